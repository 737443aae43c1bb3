#!/usr/bin/python3
"""Independent full-wave (FDTD) check of a tunestrip design folder with openEMS.

Usage:
    /usr/bin/python3 scripts/fullwave/simulate.py OUT_DIR [OUT_DIR ...]
        [--spec SPEC ...] [--results scripts/fullwave/results.json] [--work /tmp/fullwave]
        [--refine 2] [--thick [--copper-cells 1]] [--wall-cells 0] [--threads 1] [--reuse] [--no-write]

What it does, per design folder (the output of `tunestrip design`):
  1. Reads design.json (substrate, frequency, load, target, lines, ports, vias) and the copper as
     drawn: the closed COPPER_TOP LWPOLYLINEs of layout.dxf (read with ezdxf).
  2. Builds an openEMS model: substrate box (εr, height, tanδ as a conductivity at f0), PEC ground
     (the z = 0 boundary), the copper polygons as zero-thickness PEC sheets at z = h (or, with
     --thick, solids of the stackup's copper thickness), each via as a PEC cylinder (drill
     diameter) from the ground to the copper.
  3. Extends the line beyond each reference plane (load plane and source plane) by a straight
     feed of the same width, with an openEMS microstrip port at its far end. Two runs, one per
     excited port. The port's own line impedance and phase constant (measured in the run), with
     the feed's dielectric attenuation, move voltage and current from the measurement plane to the
     design's reference plane. A run ends when its energy has fallen by 60 dB (--end-criteria).
  4. From the two runs, the 2-port impedance matrix of the copper: Z = V · I⁻¹ (both excitations),
     so imperfect port terminations do not matter. The load port is then terminated in software
     with the design's constant load impedance (tunestrip's assumption), and the reflection at the
     source port against the target gives |S11(f)|.
  5. Reports the frequency of the |S11| minimum, |S11(f0)| and the offset in % of f0, and writes
     them into results.json (one entry per design, keyed by name).

Nothing here is part of tunestrip; it needs Debian's openems + python3-openems and python3-ezdxf.
"""
from __future__ import annotations

import argparse
import json
import math
import multiprocessing as mp
import os
import shutil
import subprocess
import sys
import time

import numpy as np

# openEMS 0.0.35's ports.py still uses np.float / np.int, which NumPy 1.24 removed.
if not hasattr(np, 'float'):
    np.float = float  # type: ignore[attr-defined]
if not hasattr(np, 'int'):
    np.int = int  # type: ignore[attr-defined]

import ezdxf  # noqa: E402
from CSXCAD import ContinuousStructure  # noqa: E402
from CSXCAD.SmoothMeshLines import SmoothMeshLines  # noqa: E402
from openEMS import openEMS  # noqa: E402
from openEMS.physical_constants import C0, EPS0, Z0  # noqa: E402

UNIT = 1e-3  # drawing unit: mm

# Mesh and run settings (the README explains them).
CELLS_PER_WAVELENGTH = 40      # max cell ≤ λ(f_max in the substrate)/40
EDGE_CELLS_PER_WIDTH = 8       # fine cell at strip edges = narrowest width / 8 (thirds rule)
CELLS_ACROSS_WIDTH = 4         # inside the copper's extent, cells ≤ narrowest width / 4
SUBSTRATE_CELLS = 5            # cells across the substrate height
VIA_CELLS_PER_RADIUS = 2       # fine cells across a via radius
GROWTH = 1.4                   # neighbouring-cell ratio
END_CRITERIA = 1e-6            # energy decay (−60 dB) ends a run; 1e-5 stopped too early (README)
BAND = (0.8, 1.2)              # evaluation band, × f0
BAND_POINTS = 1601


def openems_version() -> str:
    try:
        out = subprocess.run(['dpkg-query', '-W', '-f=${Version}', 'openems'], capture_output=True, text=True, check=True)
        return 'openEMS ' + out.stdout.strip() + ' (Debian package openems)'
    except (OSError, subprocess.CalledProcessError):
        return 'openEMS (version unknown)'


# ---------------------------------------------------------------------------------------------
# Geometry: the copper as drawn


def read_design(folder: str) -> dict:
    with open(os.path.join(folder, 'design.json'), encoding='utf8') as f:
        design = json.load(f)
    doc = ezdxf.readfile(os.path.join(folder, 'layout.dxf'))
    polygons = []
    for e in doc.modelspace().query('LWPOLYLINE[layer=="COPPER_TOP"]'):
        if not e.closed:
            raise SystemExit(f'{folder}: an open COPPER_TOP polyline; the copper must be closed outlines')
        pts = [(float(p[0]), float(p[1])) for p in e.get_points('xy')]
        if any(abs(p[2]) > 1e-12 for p in e.get_points('xyb')):
            raise SystemExit(f'{folder}: bulged polyline segments are not supported')
        polygons.append(pts)
    if not polygons:
        raise SystemExit(f'{folder}: no COPPER_TOP polylines in layout.dxf')
    design['_polygons_mm'] = polygons
    return design


def signed_area(pts):
    return 0.5 * sum(pts[i][0] * pts[(i + 1) % len(pts)][1] - pts[(i + 1) % len(pts)][0] * pts[i][1] for i in range(len(pts)))


def edge_lines(polygons, fine, skip_x):
    """Mesh lines for the copper edges by the thirds rule: r/3 inside the metal, 2r/3 outside."""
    xs, ys = [], []
    for pts in polygons:
        orient = 1.0 if signed_area(pts) > 0 else -1.0
        n = len(pts)
        for i in range(n):
            (x1, y1), (x2, y2) = pts[i], pts[(i + 1) % n]
            dx, dy = x2 - x1, y2 - y1
            if abs(dx) < 1e-9 and abs(dy) > 1e-9:  # vertical edge, x = const
                if any(abs(x1 - s) < 1e-6 for s in skip_x):
                    continue  # the line continues into the port feed here: not an edge
                out = math.copysign(1.0, dy * orient)  # outward normal (dy, −dx)·orient
                xs += [x1 - out * fine / 3, x1 + out * 2 * fine / 3]
            elif abs(dy) < 1e-9 and abs(dx) > 1e-9:  # horizontal edge, y = const
                out = math.copysign(1.0, -dx * orient)
                ys += [y1 - out * fine / 3, y1 + out * 2 * fine / 3]
            else:  # a short chord of a pad arc: keep its ends
                xs += [x1]
                ys += [y1]
    return xs, ys


def merge(lines, tol):
    """Sorted lines with near-duplicates (closer than tol) merged, so no sliver cells form."""
    out = []
    for v in sorted(lines):
        if out and v - out[-1] < tol:
            out[-1] = 0.5 * (out[-1] + v)
        else:
            out.append(v)
    return out


def wall_lines(polygons, step, cells, skip_x):
    """Mesh lines for the side walls of solid copper: one on each wall and `cells` more on either
    side of it, `step` apart, so the fields round the copper's corners are resolved on the scale
    of its thickness (the thirds rule is for zero-thickness sheets)."""
    offsets = [step * k for k in range(-cells, cells + 1)]
    xs, ys = [], []
    for pts in polygons:
        n = len(pts)
        for i in range(n):
            (x1, y1), (x2, y2) = pts[i], pts[(i + 1) % n]
            if abs(x2 - x1) < 1e-9 and abs(y2 - y1) > 1e-9:
                if not any(abs(x1 - s) < 1e-6 for s in skip_x):
                    xs += [x1 + o for o in offsets]
            elif abs(y2 - y1) < 1e-9 and abs(x2 - x1) > 1e-9:
                ys += [y1 + o for o in offsets]
            else:
                xs += [x1]
                ys += [y1]
    return xs, ys


def plan_model(design: dict, refine: float = 1.0, thick: bool = False, copper_cells: int = 1, wall_cells: int = 0) -> dict:
    """Everything both runs share: materials, copper, feeds, ports, mesh lines (mm).

    `refine` divides every cell size (a mesh-convergence knob). `thick` draws the design's copper
    as a solid of the stackup's copper thickness (the feeds stay zero-thickness sheets; the step at
    the reference plane is tiny) instead of a zero-thickness sheet. `copper_cells` above 1 puts that
    many cells across the solid copper (a convergence check of the thickness; 1 is the recorded
    setting). `wall_cells` above 0 replaces the thirds rule at the copper's edges by lines on each
    edge and that many either side, the stackup's copper thickness / `wall_cells` apart (sheet or
    solid, so the two can be compared on one lateral mesh); it defaults to `copper_cells` when
    that is above 1.
    """
    sub = design['substrate']
    f0 = design['frequency_hz']
    h = sub['height_m'] / UNIT
    er = sub['er']
    ports = {p['role']: p for p in design['ports']}
    for p in ports.values():
        if round(p['direction_deg']) % 180 != 0 or abs(p['y_m']) > 1e-12:
            raise SystemExit('ports must lie on the x axis and face along it')
    widths = [l['width_m'] / UNIT for l in design['lines']]
    w_line = ports['load']['width_m'] / UNIT
    w_min = min(widths)
    f_max = BAND[1] * f0 * 1.25
    res = C0 / (f_max * math.sqrt(er)) / UNIT / CELLS_PER_WAVELENGTH / refine
    fine = min(w_min / EDGE_CELLS_PER_WIDTH, h / 2) / refine
    substrate_cells = max(2, round(SUBSTRATE_CELLS * refine))
    via_cells = max(1, round(VIA_CELLS_PER_RADIUS * refine))

    # Feeds: straight line of the port's width beyond each reference plane. The measurement plane
    # sits `meas` beyond the reference plane, well clear of the junction's local fields; the
    # excitation and its 50 Ω feed resistor sit at the far end, `meas` further out.
    meas = max(6 * h, 3 * w_line, 4.0)
    feed_len = 2 * meas + 2 * res
    x_load = ports['load']['x_m'] / UNIT
    x_src = ports['source']['x_m'] / UNIT
    feeds = {
        'source': {'x_ref': x_src, 'x_far': x_src + feed_len * (1 if x_src > x_load else -1), 'width': ports['source']['width_m'] / UNIT},
        'load': {'x_ref': x_load, 'x_far': x_load - feed_len * (1 if x_src > x_load else -1), 'width': w_line},
    }
    polys = design['_polygons_mm']
    ymin = min(p[1] for poly in polys for p in poly)
    ymax = max(p[1] for poly in polys for p in poly)
    margin_xy = max(10 * h, 3 * w_line, 8.0)
    air = max(12 * h, 8.0)
    xlo = min(f['x_far'] for f in feeds.values()) - 3 * res
    xhi = max(f['x_far'] for f in feeds.values()) + 3 * res
    ylo, yhi = ymin - margin_xy, ymax + margin_xy

    t = sub['copper_m'] / UNIT if thick else 0.0
    if thick and t <= 0:
        raise SystemExit('--thick needs a design with copper thickness > 0')
    if copper_cells > 1 and not thick:
        raise SystemExit('--copper-cells needs --thick')
    wall_cells = wall_cells or (copper_cells if copper_cells > 1 else 0)
    tol = fine / 4
    if wall_cells > 0:
        pitch = sub['copper_m'] / UNIT / wall_cells
        if pitch <= 0:
            raise SystemExit('--wall-cells needs a design with copper thickness > 0')
        xs, ys = wall_lines(polys, pitch, wall_cells, skip_x=[x_load, x_src])
        tol = pitch / 2
    else:
        xs, ys = edge_lines(polys, fine, skip_x=[x_load, x_src])
    for f in feeds.values():
        xs += [f['x_far'], f['x_ref']]
    vias = [{'x': v['x_m'] / UNIT, 'y': v['y_m'] / UNIT, 'r': v['drill_m'] / 2 / UNIT} for v in design.get('vias', [])]
    via_x, via_y = [], []
    for v in vias:
        step = v['r'] / via_cells
        tol = min(tol, step / 2)
        via_x += list(v['x'] + step * np.arange(-via_cells, via_cells + 1))
        via_y += list(v['y'] + step * np.arange(-via_cells, via_cells + 1))
        # the via's own lines win over edge lines that fall among them
        xs = [x for x in xs if abs(x - v['x']) > v['r'] + step / 2]
        ys = [y for y in ys if abs(y - v['y']) > v['r'] + step / 2]
    # Inside the copper's extent the cells stay at most a quarter of the narrowest strip, so each
    # strip has several cells across; outside they grow to the wavelength limit.
    inner = min(res, w_min / CELLS_ACROSS_WIDTH / refine)
    core_x = SmoothMeshLines(merge(xs + via_x, tol), inner, GROWTH)
    core_y = SmoothMeshLines(merge(ys + via_y, tol), inner, GROWTH)
    mesh_x = SmoothMeshLines(merge(list(core_x), tol / 2) + [xlo, xhi], res, GROWTH)
    mesh_y = SmoothMeshLines(merge(list(core_y), tol / 2) + [ylo, yhi], res, GROWTH)
    z_sub = list(np.linspace(0, h, substrate_cells + 1))
    copper_z = [h + t * k / copper_cells for k in range(1, copper_cells + 1)] if thick else []
    mesh_z = SmoothMeshLines(z_sub + copper_z + [h + air], res, GROWTH)
    kappa = 2 * math.pi * f0 * EPS0 * er * sub['tan_delta']
    return {
        'f0': f0, 'h': h, 't': t, 'er': er, 'kappa': kappa, 'polys': polys, 'vias': vias, 'feeds': feeds, 'meas': meas,
        'mesh': {'x': [float(v) for v in mesh_x], 'y': [float(v) for v in mesh_y], 'z': [float(v) for v in mesh_z]},
        'res': res, 'fine': fine, 'refine': refine, 'substrate_cells': substrate_cells, 'copper_cells': copper_cells if thick else 0, 'wall_cells': wall_cells, 'box': (xlo, xhi, ylo, yhi, h + air),
    }


# ---------------------------------------------------------------------------------------------
# One FDTD run


def run_one(args):
    plan, excite_role, sim_path, threads = args
    f0 = plan['f0']
    fdtd = openEMS(EndCriteria=plan['end_criteria'], NrTS=2_000_000)
    # Gaussian pulse centred on f0, −20 dB at f0 ± 0.6·f0: covers the band with margin.
    fdtd.SetGaussExcite(f0, 0.6 * f0)
    fdtd.SetBoundaryCond(['MUR', 'MUR', 'MUR', 'MUR', 'PEC', 'MUR'])
    csx = ContinuousStructure()
    fdtd.SetCSX(csx)
    grid = csx.GetGrid()
    grid.SetDeltaUnit(UNIT)
    grid.SetLines('x', plan['mesh']['x'])
    grid.SetLines('y', plan['mesh']['y'])
    grid.SetLines('z', plan['mesh']['z'])
    xlo, xhi, ylo, yhi, _ = plan['box']
    h = plan['h']

    substrate = csx.AddMaterial('substrate', epsilon=plan['er'], kappa=plan['kappa'])
    substrate.AddBox([xlo, ylo, 0], [xhi, yhi, h], priority=0)
    copper = csx.AddMetal('copper')
    t = plan['t']
    for poly in plan['polys']:
        pts = np.array(poly).T
        if t > 0:
            copper.AddLinPoly(pts, 'z', h, t, priority=10)
        else:
            copper.AddPolygon(pts, 'z', h, priority=10)
    for v in plan['vias']:
        copper.AddCylinder([v['x'], v['y'], 0], [v['x'], v['y'], h + t], v['r'], priority=10)

    ports = {}
    for number, role in ((1, 'source'), (2, 'load')):
        f = plan['feeds'][role]
        w = f['width']
        feed_len = abs(f['x_far'] - f['x_ref'])
        ports[role] = fdtd.AddMSLPort(
            number, copper, [f['x_far'], -w / 2, h], [f['x_ref'], w / 2, 0], 'x', 'z',
            excite=1 if role == excite_role else 0,
            MeasPlaneShift=feed_len - plan['meas'], FeedShift=0, Feed_R=50, priority=10,
        )
    if os.path.isdir(sim_path):
        shutil.rmtree(sim_path)
    os.makedirs(sim_path)
    t0 = time.time()
    fdtd.Run(sim_path, cleanup=True, verbose=0, numThreads=threads)
    seconds = time.time() - t0

    freq = np.linspace(BAND[0] * f0, BAND[1] * f0, BAND_POINTS)
    out = {'seconds': seconds}
    for role, port in ports.items():
        f = plan['feeds'][role]
        # V and I at the measurement plane, and the port line's measured β and impedance. openEMS
        # puts the probes on the mesh line nearest the requested plane (port.measplane_shift is the
        # snapped distance from the port's far end), so the shift is taken from there.
        port.CalcPort(sim_path, freq)
        distance = abs(f['x_far'] - f['x_ref']) - port.measplane_shift
        if abs(distance - measurement_distance(plan, role)) > 1e-9:
            raise SystemExit(f'{role}: openEMS put the measurement plane {distance} mm from the copper, not where expected')
        alpha = feed_attenuation(np.real(port.beta), freq, plan['er'], plan['kappa'])
        v, i = shift_along_line(port.uf_tot, port.if_tot, np.real(port.beta) - 1j * alpha, port.Z_ref, distance * UNIT)
        out[role] = {'v': v, 'i': i, 'beta': port.beta, 'zl': port.Z_ref, 'alpha': alpha, 'meas_m': distance * UNIT}
    out['freq'] = freq
    np.save(os.path.join(sim_path, 'ports.npy'), out, allow_pickle=True)
    return out


# ---------------------------------------------------------------------------------------------
# Post-processing


def feed_attenuation(beta, freq, er, kappa):
    """Dielectric attenuation (Np/m) of the feed line, from its measured phase constant.

    openEMS 0.0.35's own reference-plane shift (ports.py, CalcPort) uses only Re(β), so a lossy
    feed's attenuation over the measurement distance stayed in the de-embedded impedance. The
    quasi-TEM dielectric attenuation α_d = k0·εr(εe−1)·tanδ / (2√εe(εr−1)) (Pozar, Microwave
    Engineering, 4th ed., 2012, §3.8, microstrip attenuation due to dielectric loss; equation from
    memory) with tanδ = κ/(ωε0εr), the FDTD's own conductivity, reduces to η0·κ·(εe−1)/(2√εe(εr−1))
    (η0, the free-space impedance, is openEMS's physical_constants.Z0).
    The measured Im(β) agrees with it within a few % where the standing wave is mild, but is noisy
    where the port sees a large reflection, so the formula with the measured εe is used.
    """
    if kappa == 0:
        return np.zeros_like(beta)
    eps_eff = (beta / (2 * np.pi * freq / C0)) ** 2
    return Z0 * kappa * (eps_eff - 1) / (2 * np.sqrt(eps_eff) * (er - 1))


def measurement_distance(plan, role):
    """Distance (mm) from the copper's reference plane to the mesh line openEMS 0.0.35 measures on.

    Its MSLPort (ports.py) moves the requested measurement plane to the nearest line of the mesh
    along the feed, never the first or last; `plan['meas']` is only the requested distance. Up to
    the eighth round the shift used the requested one, so each run's reference planes sat up to
    half a feed cell off the copper's edge (ninth round, README).
    """
    f = plan['feeds'][role]
    lines = np.array(plan['mesh']['x'])
    toward_copper = 1 if f['x_ref'] > f['x_far'] else -1
    requested = f['x_far'] + toward_copper * (abs(f['x_far'] - f['x_ref']) - plan['meas'])
    k = min(max(int(np.argmin(np.abs(lines - requested))), 1), len(lines) - 2)
    return float(abs(f['x_ref'] - lines[k]))


def snap_saved_run(run, plan):
    """A run saved before the ninth round (V and I moved the requested distance) moved on to the
    reference plane from the snapped measurement plane: the rest of the way along the same line."""
    for role in ('source', 'load'):
        p = run[role]
        if 'meas_m' in p:
            continue
        rest = (measurement_distance(plan, role) - plan['meas']) * UNIT
        p['v'], p['i'] = shift_along_line(p['v'], p['i'], np.real(p['beta']) - 1j * p['alpha'], p['zl'], rest)
        p['meas_m'] = measurement_distance(plan, role) * UNIT
        run['snapped_after_run'] = True
    return run


def shift_along_line(v, i, gamma_beta, z0, length):
    """V and I moved `length` (m) along a uniform line toward the copper, e^{-jβx} convention with
    a complex β = β' − jα; the same transform openEMS applies, with the attenuation kept."""
    phase = gamma_beta * length
    return (v * np.cos(-phase) + 1j * i * z0 * np.sin(-phase),
            i * np.cos(-phase) + 1j * v / z0 * np.sin(-phase))


def impedance_matrix(run_src, run_load):
    """Z such that V = Z·I at both reference planes, from the two excitations (currents into the copper)."""
    n = len(run_src['freq'])
    z = np.zeros((n, 2, 2), complex)
    for k in range(n):
        v = np.array([[run_src['source']['v'][k], run_load['source']['v'][k]], [run_src['load']['v'][k], run_load['load']['v'][k]]])
        i = np.array([[run_src['source']['i'][k], run_load['source']['i'][k]], [run_src['load']['i'][k], run_load['load']['i'][k]]])
        z[k] = v @ np.linalg.inv(i)
    return z


def reflection_against(zin, target):
    """Power-wave reflection of Zin against a (possibly complex) target: (Zin − Zt)/(Zin + Zt*)."""
    return (zin - target) / (zin + np.conj(target))


def terminated_input_impedance(z, load):
    """Input impedance at port 1 of the 2-port(s) `z` (…, 2, 2) with port 2 ended in `load`."""
    return z[..., 0, 0] - z[..., 0, 1] * z[..., 1, 0] / (z[..., 1, 1] + load)


def terminated_reflection(z, load, target):
    return reflection_against(terminated_input_impedance(z, load), target)


def minimum_of(freq, mag_db):
    k = int(np.argmin(mag_db))
    if 0 < k < len(freq) - 1:  # parabola through the three lowest samples
        y0, y1, y2 = mag_db[k - 1], mag_db[k], mag_db[k + 1]
        den = y0 - 2 * y1 + y2
        frac = 0.5 * (y0 - y2) / den if den > 0 else 0.0
        return float(freq[k] + frac * (freq[1] - freq[0])), float(y1), k
    return float(freq[k]), float(mag_db[k]), k


def model_minimum(folder, target):
    """The minimum of tunestrip's own predicted response (response.s1p), for comparison.

    The Touchstone file is referenced to its real R; for a complex target the mismatch that matters
    is the power-wave reflection against the target, so Zin is recovered and compared with it.
    """
    fs, gs = [], []
    scale, r_ref = 1.0, 50.0
    with open(os.path.join(folder, 'response.s1p'), encoding='utf8') as f:
        for line in f:
            s = line.strip()
            if not s or s.startswith('!'):
                continue
            if s.startswith('#'):
                words = s.upper().split()
                scale = {'HZ': 1, 'KHZ': 1e3, 'MHZ': 1e6, 'GHZ': 1e9}[words[1]]
                if 'RI' not in words:
                    return None
                if 'R' in words:  # Touchstone's default reference is 50 Ω
                    r_ref = float(words[words.index('R') + 1])
                continue
            a = s.split()
            fs.append(float(a[0]) * scale)
            g = complex(float(a[1]), float(a[2]))
            zin = r_ref * (1 + g) / (1 - g)
            gs.append(abs(reflection_against(zin, target)))
    k = int(np.argmin(gs))
    return fs[k]


def run_or_reuse(worker, jobs, reuse):
    """Runs the jobs two at a time (one thread each), or with `reuse` reads each job's saved
    ports.npy (the job's third element is its run folder) when all of them exist."""
    if reuse and all(os.path.exists(os.path.join(j[2], 'ports.npy')) for j in jobs):
        return [np.load(os.path.join(j[2], 'ports.npy'), allow_pickle=True).item() for j in jobs]
    with mp.get_context('fork').Pool(2) as pool:
        return pool.map(worker, jobs)


def simulate(folder, work, threads, reuse, refine=2.0, thick=False, end_criteria=END_CRITERIA, copper_cells=1, wall_cells=0):
    design = read_design(folder)
    name = design['name']
    plan = {**plan_model(design, refine, thick, copper_cells, wall_cells), 'end_criteria': end_criteria}
    tag = (name + ('' if refine == 1.0 else f'-refine{refine:g}') + ('-thick' if thick else '')
           + (f'-cu{copper_cells}' if copper_cells > 1 else '') + (f'-walls{plan["wall_cells"]}' if plan['wall_cells'] else ''))
    jobs = [(plan, role, os.path.join(work, tag, 'excite-' + role), threads) for role in ('source', 'load')]
    runs = [snap_saved_run(r, plan) for r in run_or_reuse(run_one, jobs, reuse)]
    run_src, run_load = runs
    freq = run_src['freq']
    z = impedance_matrix(run_src, run_load)
    load = complex(*design['load_ohm'])
    target = complex(*design['target_ohm'])
    gamma = terminated_reflection(z, load, target)
    mag_db = 20 * np.log10(np.abs(gamma))
    f0 = design['frequency_hz']
    f_min, s_min, _ = minimum_of(freq, mag_db)
    k0 = int(np.argmin(np.abs(freq - f0)))
    reciprocity = float(np.max(np.abs(z[:, 0, 1] - z[:, 1, 0]) / np.abs(z[:, 0, 1])))
    k_f0 = 2 * math.pi * f0 / C0
    port_line = {}
    for role in ('source', 'load'):
        beta = run_src[role]['beta'][k0] if role == 'source' else run_load[role]['beta'][k0]
        zl = run_src[role]['zl'][k0] if role == 'source' else run_load[role]['zl'][k0]
        own = run_src if role == 'source' else run_load
        if 'alpha' not in own[role]:
            raise SystemExit(f'{name}: ports.npy comes from an older simulate.py (lossless shift); run again without --reuse')
        port_line[role] = {
            'eps_eff': float((np.real(beta) / k_f0) ** 2), 'z0_ohm': float(np.real(zl)),
            'alpha_db_per_m_deembedded': float(own[role]['alpha'][k0] * 20 / math.log(10)),
            'alpha_db_per_m_measured': float(-np.imag(beta) * 20 / math.log(10)),
        }
    lines = {l['role']: l for l in design['lines']}
    model_f = model_minimum(folder, target)
    nx, ny, nz = (len(plan['mesh'][a]) for a in 'xyz')
    result = {
        'name': name,
        'frequency_hz': f0,
        'load_ohm': design['load_ohm'],
        'target_ohm': design['target_ohm'],
        'termination': design['solution']['termination'],
        'copper_model': (('solid, the stackup thickness' + (f', {copper_cells} cells across it' if copper_cells > 1 else '')) if thick else 'zero-thickness sheet')
                        + (f', edge lines {plan["wall_cells"]} per copper thickness' if plan['wall_cells'] else ''),
        'copper': {
            role: {'width_m': l['width_m'], 'length_m': l['length_m'], 'z0_ohm': l['z0_ohm'], 'eps_eff': l['eps_eff']}
            for role, l in lines.items()
        },
        'vias': [{'x_m': v['x_m'], 'y_m': v['y_m'], 'drill_m': v['drill_m']} for v in design.get('vias', [])],
        'f_min_hz': f_min,
        'offset_percent': 100 * (f_min - f0) / f0,
        's11_db_at_f0': float(mag_db[k0]),
        's11_db_at_min': s_min,
        'model_f_min_hz': model_f,
        'fdtd_port_line_at_f0': port_line,
        'reciprocity_error': reciprocity,
        'end_criteria': end_criteria,
        'deembedding': 'lossy feed (measured beta, dielectric attenuation) from the snapped measurement plane'
                       + (' (saved run, moved on after it ran)' if any(r.get('snapped_after_run') for r in runs) else ''),
        'measurement_plane_mm': {role: round(measurement_distance(plan, role), 5) for role in ('source', 'load')},
        'mesh': {
            'cells': [nx - 1, ny - 1, nz - 1],
            'max_cell_mm': plan['res'],
            'edge_cell_mm': plan['fine'],
            'substrate_cells': plan['substrate_cells'],
            'refine': plan['refine'],
            'copper_thickness_mm': plan['t'],
            'copper_cells': plan['copper_cells'],
            'wall_cells': plan['wall_cells'],
            'min_cell_mm': float(min(np.min(np.diff(plan['mesh'][a])) for a in 'xyz')),
        },
        'run_seconds': round(max(r['seconds'] for r in runs), 1),
        'solver': openems_version(),
    }
    np.savez(os.path.join(work, tag, 'sweep.npz'), freq=freq, s11_db=mag_db, z=z)
    return result


def main():
    ap = argparse.ArgumentParser(description=__doc__.split('\n')[0])
    ap.add_argument('folders', nargs='+', help='tunestrip design output folders')
    ap.add_argument('--spec', action='append', default=[], help='spec file each folder was made from (same order), recorded in results.json')
    ap.add_argument('--results', default=os.path.join(os.path.dirname(os.path.abspath(__file__)), 'results.json'))
    ap.add_argument('--work', default='/tmp/fullwave')
    ap.add_argument('--threads', type=int, default=1, help='threads per run (two runs go in parallel)')
    ap.add_argument('--refine', type=float, default=2.0, help='divide every cell size by this (2 is the recorded setting; 1 and 1.5 for a convergence check)')
    ap.add_argument('--thick', action='store_true', help="draw the design's copper with the stackup's thickness")
    ap.add_argument('--copper-cells', type=int, default=1, help='with --thick: cells across the copper and at its side walls (1, the recorded setting; more for a convergence check)')
    ap.add_argument('--wall-cells', type=int, default=0, help='lines on each copper edge and this many either side, a copper thickness / N apart, instead of the thirds rule (default: --copper-cells when above 1)')
    ap.add_argument('--end-criteria', type=float, default=END_CRITERIA, help='energy decay that ends a run (1e-6, −60 dB, is the recorded setting)')
    ap.add_argument('--reuse', action='store_true', help='post-process earlier runs in --work again')
    ap.add_argument('--no-write', action='store_true', help='print only; leave results.json alone')
    args = ap.parse_args()
    results = {'solver': openems_version(), 'designs': []}
    if os.path.exists(args.results):
        with open(args.results, encoding='utf8') as f:
            results = json.load(f)
    for n, folder in enumerate(args.folders):
        r = simulate(folder, args.work, args.threads, args.reuse, args.refine, args.thick, args.end_criteria, args.copper_cells, args.wall_cells)
        if n < len(args.spec):
            r['spec'] = os.path.relpath(args.spec[n], os.path.join(os.path.dirname(os.path.abspath(__file__)), '..', '..'))
        print(json.dumps({k: r[k] for k in ('name', 'f_min_hz', 'offset_percent', 's11_db_at_f0', 's11_db_at_min', 'fdtd_port_line_at_f0', 'reciprocity_error', 'mesh', 'run_seconds')}, indent=1), flush=True)
        if not args.no_write:
            results['solver'] = openems_version()
            same = lambda d: d['name'] == r['name'] and d.get('copper_model') == r['copper_model']  # noqa: E731
            results['designs'] = [d for d in results['designs'] if not same(d)] + [r]
            results['designs'].sort(key=lambda d: (d['name'], d.get('copper_model', '')))
            with open(args.results, 'w', encoding='utf8') as f:
                json.dump(results, f, indent=2)
                f.write('\n')


if __name__ == '__main__':
    main()
