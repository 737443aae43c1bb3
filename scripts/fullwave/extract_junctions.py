#!/usr/bin/python3
"""Full-wave (openEMS FDTD) extractions of the discontinuities tunestrip fits to, or checks against, its own runs.

Usage:
    /usr/bin/python3 scripts/fullwave/extract_junctions.py cross [NAME ...] [--work DIR] [--reuse]
    /usr/bin/python3 scripts/fullwave/extract_junctions.py tee   [NAME ...] [--work DIR] [--reuse]
    /usr/bin/python3 scripts/fullwave/extract_junctions.py open  [NAME ...] [--parallel 2]
    /usr/bin/python3 scripts/fullwave/extract_junctions.py via   [NAME ...] [--work DIR] [--reuse]
    /usr/bin/python3 scripts/fullwave/extract_junctions.py bend  [NAME ...] [--parallel 2] [--end-criteria 1e-6]
    /usr/bin/python3 scripts/fullwave/extract_junctions.py via-row [NAME ...] [--parallel 2] [--end-criteria 1e-6]

Each case is one bare structure of our own choosing (the CROSSES, TEES, OPEN_ENDS, VIAS and BENDS tables
below). Widths come from tunestrip's own line synthesis (zero-thickness copper), through the built CLI in dist/.
The results go into scripts/fullwave/junctions.json, one entry per case, keyed by name; the fit
(scripts/fullwave/fit-junctions.ts) and the tests read that file and never run openEMS.

cross: a symmetric cross of a main line (arms 1, 2 along x) and two stub arms (3 at +y, 4 at −y),
    copper as zero-thickness PEC on a lossless substrate. Two runs: port 1 excited and port 3
    excited; the cross's two mirror symmetries give the other two columns. Voltages and currents
    are moved with each port line's own measured β and impedance to the cross's centre-lines (the
    main arms to the stub's centre-line, the stub arms to the main line's centre-line); the 4-port
    impedance matrix is Z = V·I⁻¹ and S is normalised to each arm's measured line impedance.
    Recorded: S at 13 frequencies over 0.7–1.3 f0, the port lines' εe and impedance, and the
    symmetry and reciprocity errors of the run.

via: a straight 50 Ω line ending on the centre of one via, with a round pad around the via, as
    tunestrip draws a short stub's end. The via is a PEC cylinder of the drill diameter from the
    ground to the copper. One run; the input impedance is moved to the via centre with the port
    line's measured β and impedance. Recorded: the impedance there, its inductance X/ω, and
    Goldfarb–Pucel's value for the same via. With --edge-pitch-um the line's edges are meshed as
    simulate.py --wall-cells 1 meshes them (eighteenth round, vias-fine-edges.json).

bend: a 90° bend of one line with its outer corner mitred as tunestrip draws a folded stub's
    corners (Douville & James 1978: the cut meets each outer edge 2·M·w from the outer corner,
    M = 0.52 + 0.65·exp(−1.35·w/h), written again here from physics.md §4.3). Arm 1 runs along −x,
    arm 2 along +y, their centre-lines meet at the origin. One run, port 1 excited; the bend's mirror
    symmetry about its diagonal gives the other column. Voltages and currents are moved to the
    centre-line corner with each port line's measured β and impedance, so a bend as long
    electrically as its centre-line would show S21 = 1 there. Recorded: S over 0.7–1.3 f0 and the
    equivalent length −arg(S21)/β (negative: the bend is electrically shorter than its centre-line).

The mesh, boundary, excitation and port rules are those of simulate.py (its README), at its
recorded setting (`--refine 2`). Nothing here is part of tunestrip; it needs Debian's openems,
python3-openems and a built dist/ (npm run build).
"""
from __future__ import annotations

import argparse
import json
import math
import multiprocessing as mp
import os
import shutil
import subprocess
import time

import numpy as np

import simulate as fw  # noqa: F401  (also restores numpy's float/int aliases for openEMS)
from CSXCAD import ContinuousStructure  # noqa: E402
from CSXCAD.SmoothMeshLines import SmoothMeshLines  # noqa: E402
from openEMS import openEMS  # noqa: E402
from openEMS.physical_constants import C0, MUE0  # noqa: E402

HERE = os.path.dirname(os.path.abspath(__file__))
ROOT = os.path.abspath(os.path.join(HERE, '..', '..'))
RESULTS = os.path.join(HERE, 'junctions.json')
REFINE = 2.0
# The crosses, open ends and vias of junctions.json were made with the energy decay at 1e-5
# (−50 dB, this default); the twelve tees again at 1e-6 (`--end-criteria 1e-6`, ninth round of the
# README), which moved their S by 0.0016 at most and TEE_FIT's least squares in the fourth digit.
# Each entry records its own setting (`end_criteria`).
JUNCTION_END_CRITERIA = 1e-5
SETTINGS = {'end_criteria': JUNCTION_END_CRITERIA, 'results': RESULTS, 'edge_pitch_mm': 0.0}  # set once from the command line
FIT_POINTS = 13              # frequencies recorded per cross, over FIT_BAND × f0
FIT_BAND = (0.7, 1.3)

# Our own cases. Crosses: (name, εr, h mm, main Z0 Ω, stub Z0 Ω, f0 GHz). The first two repeat the
# geometry of the two extractions recorded in physics.md §4.2, so our extraction can be compared
# with them; the rest spread εr, h, f·h and the stub-to-main impedance ratio.
CROSSES = [
    ('cross-fr4-1600-50-50-2g4', 4.4, 1.6, 50, 50, 2.4),
    ('cross-ptfe-508-50-60-6g4', 2.2, 0.508, 50, 60, 6.4),
    ('cross-hc-508-50-50-5g8', 3.66, 0.508, 50, 50, 5.8),
    ('cross-er3-760-50-35-3g5', 3.0, 0.76, 50, 35, 3.5),
    ('cross-fr4-1600-50-100-1g2', 4.4, 1.6, 50, 100, 1.2),
    ('cross-er10-635-50-50-4g0', 10.2, 0.635, 50, 50, 4.0),
    ('cross-er338-305-50-70-10g', 3.38, 0.305, 50, 70, 10.0),
    ('cross-fr4-1600-50-50-5g0', 4.4, 1.6, 50, 50, 5.0),
]
# T-junctions, as the crosses: the data of tunestrip's single-stub junction correction (TEE_FIT).
# The first repeats the geometry of physics.md §4.2's 3-port extraction; the last six (second round)
# add wide and narrow stubs on thick FR-4 and on εr 10.2, and one case held out of the fit. A tee on
# 0.254 mm PTFE at 10 GHz was tried and left out: its FDTD run diverged (NaN in every probe).
TEES = [
    ('tee-fr4-1600-50-50-2g4', 4.4, 1.6, 50, 50, 2.4),
    ('tee-fr4-1600-50-50-5g0', 4.4, 1.6, 50, 50, 5.0),
    ('tee-er10-635-50-50-8g0', 10.2, 0.635, 50, 50, 8.0),
    ('tee-ptfe-787-50-70-4g2', 2.2, 0.787, 50, 70, 4.2),
    ('tee-hc-508-50-50-5g8', 3.66, 0.508, 50, 50, 5.8),
    ('tee-er3-760-50-35-3g5', 3.0, 0.76, 50, 35, 3.5),
    ('tee-er3-760-50-30-3g5', 3.0, 0.76, 50, 30, 3.5),
    ('tee-fr4-1600-50-30-2g4', 4.4, 1.6, 50, 30, 2.4),
    ('tee-fr4-1600-50-80-2g4', 4.4, 1.6, 50, 80, 2.4),
    ('tee-er10-635-50-30-4g0', 10.2, 0.635, 50, 30, 4.0),
    ('tee-er10-635-50-70-6g0', 10.2, 0.635, 50, 70, 6.0),
    ('tee-hc-508-50-40-4g0', 3.66, 0.508, 50, 40, 4.0),
    ('tee-ptfe-787-50-50-10g0', 2.2, 0.787, 50, 50, 10.0),
    ('tee-er3-760-50-50-9g0', 3.0, 0.76, 50, 50, 9.0),
]
# Open ends: (name, εr, h mm, line Z0 Ω, f0 GHz). A check of Kirschning–Jansen–Koster's open-end
# extension; nothing is fitted to it.
OPEN_ENDS = [
    ('open-er10-635-z50-8g0', 10.2, 0.635, 50, 8.0),
    ('open-fr4-1600-z50-2g4', 4.4, 1.6, 50, 2.4),
    ('open-hc-508-z50-5g8', 3.66, 0.508, 50, 5.8),
    ('open-ptfe-787-z70-4g2', 2.2, 0.787, 70, 4.2),
]
# Vias: (name, εr, h mm, drill mm, pad mm, f0 GHz, line Z0 Ω). The first repeats physics.md §4.4's
# line-ending-in-via case; the last four vary the strip width against the height (w/h) apart from εr.
VIAS = [
    ('via-er3-760-d300', 3.0, 0.76, 0.3, 0.6, 3.5, 50),
    ('via-fr4-1600-d300', 4.4, 1.6, 0.3, 0.6, 2.4, 50),
    ('via-fr4-1600-d800', 4.4, 1.6, 0.8, 1.2, 2.4, 50),
    ('via-hc-508-d300', 3.66, 0.508, 0.3, 0.6, 5.8, 50),
    ('via-ptfe-254-d200', 2.2, 0.254, 0.2, 0.45, 10.0, 50),
    ('via-er10-635-d300', 10.2, 0.635, 0.3, 0.6, 4.0, 50),
    ('via-fr4-1000-d500', 4.4, 1.0, 0.5, 0.9, 3.0, 50),
    ('via-fr4-1600-d300-z80', 4.4, 1.6, 0.3, 0.6, 2.4, 80),
    ('via-er3-760-d300-z30', 3.0, 0.76, 0.3, 0.6, 3.5, 30),
    ('via-er10-635-d300-z30', 10.2, 0.635, 0.3, 0.6, 4.0, 30),
    ('via-ptfe-254-d200-z80', 2.2, 0.254, 0.2, 0.45, 10.0, 80),
    ('via-fr4-1600-d400', 4.4, 1.6, 0.4, 0.8, 2.4, 50),
]
# Mitred 90° bends: (name, εr, h mm, line Z0 Ω, f0 GHz). Tenth round: folded stubs landed high in
# full-wave runs of whole designs; these measure how much shorter a mitred bend is than its centre-line.
BENDS = [
    ('bend-fr4-1600-z50-1g2', 4.4, 1.6, 50, 1.2),
    ('bend-ptfe-787-z50-2g0', 2.2, 0.787, 50, 2.0),
    ('bend-hc-508-z50-2g4', 3.66, 0.508, 50, 2.4),
    ('bend-er10-635-z50-4g0', 10.2, 0.635, 50, 4.0),
    ('bend-fr4-1600-z75-2g4', 4.4, 1.6, 75, 2.4),
    ('bend-er3-760-z30-3g5', 3.0, 0.76, 30, 3.5),
    ('bend-fr4-1600-z50-5g0', 4.4, 1.6, 50, 5.0),
    ('bend-ptfe-787-z80-6g0', 2.2, 0.787, 80, 6.0),
]

# Rows of vias at a line's end, as tunestrip draws `fab.vias_per_stub` > 1: (name, εr, h mm, drill mm,
# pad mm, f0 GHz, line Z0 Ω, count, pitch mm); pitch = pad + min space of the fab preset. Tenth
# round: a check of the row's inductance, where the design model ignores the vias' mutual inductance.
VIA_ROWS = [
    ('via2-fr4-1600-d200-p550', 4.4, 1.6, 0.2, 0.45, 2.4, 50, 2, 0.55),
    ('via2-ptfe-787-d200-p550', 2.2, 0.787, 0.2, 0.45, 10.0, 50, 2, 0.55),
    ('via2-er3-760-d300-p750', 3.0, 0.76, 0.3, 0.6, 3.5, 50, 2, 0.75),
    ('via2-hc-508-d200-p550', 3.66, 0.508, 0.2, 0.45, 5.8, 50, 2, 0.55),
    ('via3-fr4-1600-d300-p750', 4.4, 1.6, 0.3, 0.6, 2.4, 50, 3, 0.75),
    ('via4-ptfe-787-d200-p550', 2.2, 0.787, 0.2, 0.45, 6.0, 50, 4, 0.55),
    ('via2-er10-635-d200-p550', 10.2, 0.635, 0.2, 0.45, 4.0, 50, 2, 0.55),
    ('via3-hc-508-d200-p550', 3.66, 0.508, 0.2, 0.45, 5.8, 50, 3, 0.55),
]

# Cases kept out of the fit, run after it was made: they check the fitted model on a via or tee it
# has not seen (junction-fit.ts fits only the cases recorded with "use": "fit").
HELD_OUT = {'via-fr4-1600-d400', 'tee-hc-508-50-40-4g0', 'tee-er3-760-50-50-9g0'}


def synthesize_width(er, h_mm, z0, f_ghz):
    """tunestrip's own zero-thickness synthesis (the model the fit is for), in mm."""
    out = subprocess.run(
        ['node', os.path.join(ROOT, 'dist', 'cli', 'bin.js'), 'line', '--er', str(er), '--height', f'{h_mm}mm',
         '--copper', '0', '--freq', f'{f_ghz}GHz', f'--z0={z0}', '--json'],
        capture_output=True, text=True, check=True)
    return json.loads(out.stdout)['width_m'] * 1e3


def goldfarb_pucel_nh(h_mm, drill_mm):
    """Goldfarb & Pucel, IEEE MGWL 1(6) 1991 (physics.md §4.4), written again here from the formula."""
    h, r = h_mm * 1e-3, drill_mm * 0.5e-3
    s = math.hypot(r, h)
    return MUE0 / (2 * math.pi) * (h * math.log((h + s) / r) + 1.5 * (r - s)) * 1e9


def thirds(edge, outward, fine):
    """The thirds rule at one strip edge: a line r/3 inside the metal, one 2r/3 outside."""
    return [edge - outward * fine / 3, edge + outward * 2 * fine / 3]


def symmetric(lines_pos, res, inner, extent_inner, tol):
    """Mesh lines for x ≥ 0, smoothed, mirrored to x < 0 so both halves are the same cells."""
    core = SmoothMeshLines(fw.merge([0.0] + [v for v in lines_pos if 0 <= v <= extent_inner], tol), inner, fw.GROWTH)
    outer = [v for v in lines_pos if v > extent_inner]
    half = SmoothMeshLines(fw.merge(list(core) + outer, tol / 2), res, fw.GROWTH)
    half = [float(v) for v in half if v >= 0]
    return sorted(set([-v for v in half if v > 0] + half))


def run_fdtd(fdtd, csx, sim_path):
    if os.path.isdir(sim_path):
        shutil.rmtree(sim_path)
    os.makedirs(sim_path)
    t0 = time.time()
    fdtd.Run(sim_path, cleanup=True, verbose=0, numThreads=1)
    return time.time() - t0


def saved_or_run(run, p, work, reuse):
    """The saved ports.npy of a one-run case in `work` (with --reuse), else a new run."""
    sim_path = os.path.join(work, p['name'])
    if reuse and os.path.exists(os.path.join(sim_path, 'ports.npy')):
        return np.load(os.path.join(sim_path, 'ports.npy'), allow_pickle=True).item()
    return run((p, sim_path))


def calc_ports(ports, sim_path, freq, seconds):
    """Each port's voltage, current, β and line impedance at `freq`, moved to its reference plane; saved beside the run."""
    out = {'seconds': seconds, 'freq': freq}
    for n, (port, to_plane) in ports.items():
        port.CalcPort(sim_path, freq, ref_plane_shift=to_plane)
        out[n] = {'v': port.uf_tot, 'i': port.if_tot, 'beta': port.beta, 'zl': port.Z_ref}
    np.save(os.path.join(sim_path, 'ports.npy'), out, allow_pickle=True)
    return out


def new_fdtd(f0, mesh):
    fdtd = openEMS(EndCriteria=SETTINGS['end_criteria'], NrTS=2_000_000)
    fdtd.SetGaussExcite(f0, 0.6 * f0)
    fdtd.SetBoundaryCond(['MUR', 'MUR', 'MUR', 'MUR', 'PEC', 'MUR'])
    csx = ContinuousStructure()
    fdtd.SetCSX(csx)
    grid = csx.GetGrid()
    grid.SetDeltaUnit(fw.UNIT)
    for axis in 'xyz':
        grid.SetLines(axis, mesh[axis])
    return fdtd, csx


# ---------------------------------------------------------------------------------------------
# Cross


def plan_cross(case, arms=4):
    name, er, h, z_main, z_stub, f_ghz = case
    f0 = f_ghz * 1e9
    wm = synthesize_width(er, h, z_main, f_ghz)
    ws = synthesize_width(er, h, z_stub, f_ghz)
    f_max = fw.BAND[1] * f0 * 1.25
    res = C0 / (f_max * math.sqrt(er)) / fw.UNIT / fw.CELLS_PER_WAVELENGTH / REFINE
    fine = min(min(wm, ws) / fw.EDGE_CELLS_PER_WIDTH, h / 2) / REFINE
    meas = max(6 * h, 3 * max(wm, ws), 4.0)
    feed = 2 * meas + 2 * res
    ax = ws / 2 + feed  # main arms end at x = ±ax; the measurement plane is `meas` from the stub edge
    ay = wm / 2 + feed  # stub arms end at y = ±ay
    air = max(12 * h, 8.0)
    inner = min(res, min(wm, ws) / fw.CELLS_ACROSS_WIDTH / REFINE)
    tol = fine / 4
    mesh_x = symmetric(thirds(ws / 2, 1, fine) + [ax, ax + 3 * res], res, inner, ws / 2 + 2 * fine, tol)
    mesh_y = symmetric(thirds(wm / 2, 1, fine) + [ay, ay + 3 * res], res, inner, wm / 2 + 2 * fine, tol)
    z_sub = list(np.linspace(0, h, max(2, round(fw.SUBSTRATE_CELLS * REFINE)) + 1))
    mesh_z = [float(v) for v in SmoothMeshLines(z_sub + [h + air], res, fw.GROWTH)]
    return {'name': name, 'arms': arms, 'er': er, 'h': h, 'f0': f0, 'wm': wm, 'ws': ws, 'z_main': z_main, 'z_stub': z_stub,
            'ax': ax, 'ay': ay, 'meas': meas, 'res': res, 'fine': fine,
            'mesh': {'x': mesh_x, 'y': mesh_y, 'z': mesh_z}}


def cross_ports(fdtd, copper, p, excite):
    """Ports 1 (−x), 2 (+x), 3 (+y), 4 (−y, crosses only); each box runs from the arm's end to the other arm's edge."""
    h, wm, ws, ax, ay = p['h'], p['wm'], p['ws'], p['ax'], p['ay']
    specs = {
        1: ([-ax, -wm / 2, h], [-ws / 2, wm / 2, 0], 'x', ax),
        2: ([ax, -wm / 2, h], [ws / 2, wm / 2, 0], 'x', ax),
        3: ([-ws / 2, ay, h], [ws / 2, wm / 2, 0], 'y', ay),
        4: ([-ws / 2, -ay, h], [ws / 2, -wm / 2, 0], 'y', ay),
    }
    ports = {}
    for n, (start, stop, direction, to_centre) in list(specs.items())[:p['arms']]:
        arm = abs(stop['xy'.index(direction)] - start['xy'.index(direction)])
        ports[n] = (fdtd.AddMSLPort(n, copper, start, stop, direction, 'z', excite=1 if n == excite else 0,
                                    MeasPlaneShift=arm - p['meas'], FeedShift=0, Feed_R=50, priority=10), to_centre)
    return ports


def run_cross(args):
    p, excite, sim_path = args
    fdtd, csx = new_fdtd(p['f0'], p['mesh'])
    mx, my, mz = p['mesh']['x'], p['mesh']['y'], p['mesh']['z']
    csx.AddMaterial('substrate', epsilon=p['er']).AddBox([mx[0], my[0], 0], [mx[-1], my[-1], p['h']], priority=0)
    copper = csx.AddMetal('copper')
    h, wm, ws, ax, ay = p['h'], p['wm'], p['ws'], p['ax'], p['ay']
    copper.AddBox([-ax, -wm / 2, h], [ax, wm / 2, h], priority=10)
    copper.AddBox([-ws / 2, -ay if p['arms'] == 4 else 0, h], [ws / 2, ay, h], priority=10)
    ports = cross_ports(fdtd, copper, p, excite)
    seconds = run_fdtd(fdtd, csx, sim_path)
    return calc_ports(ports, sim_path, np.linspace(FIT_BAND[0] * p['f0'], FIT_BAND[1] * p['f0'], FIT_POINTS), seconds)


def cross_matrices(run1, run3, arms=4):
    """Full V and I (arms × arms per frequency) from runs 1 and 3 and the mirror symmetries (x → −x
    for both; y → −y for the cross)."""
    n = len(run1['freq'])
    v = np.zeros((n, arms, arms), complex)
    i = np.zeros((n, arms, arms), complex)
    swap_x = [2, 1, 3, 4]   # mirror x → −x: excitation of port 2 seen as port 1's
    swap_y = [1, 2, 4, 3]   # mirror y → −y: excitation of port 4 seen as port 3's
    columns = ((run1, [1, 2, 3, 4]), (run1, swap_x), (run3, [1, 2, 3, 4]), (run3, swap_y))[:arms]
    for k in range(n):
        for col, (run, perm) in enumerate(columns):
            for row in range(arms):
                v[k, row, col] = run[perm[row]]['v'][k]
                i[k, row, col] = run[perm[row]]['i'][k]
    return v, i


def extract_cross(p, work, reuse):
    jobs = [(p, e, os.path.join(work, p['name'], f'excite-{e}')) for e in (1, 3)]
    runs = fw.run_or_reuse(run_cross, jobs, reuse)
    run1, run3 = runs
    freq = run1['freq']
    arms = p['arms']
    v, i = cross_matrices(run1, run3, arms)
    z = np.array([v[k] @ np.linalg.inv(i[k]) for k in range(len(freq))])
    z_main = np.real(run1[1]['zl'])
    z_stub = np.real(run3[3]['zl'])
    s = []
    for k in range(len(freq)):
        r = np.diag([z_main[k], z_main[k], z_stub[k], z_stub[k]][:arms])
        root = np.sqrt(r)
        s.append(np.linalg.inv(root) @ (z[k] - r) @ np.linalg.inv(z[k] + r) @ root)
    s = np.array(s)
    reciprocity = float(np.max(np.abs(z - np.transpose(z, (0, 2, 1)))) / np.max(np.abs(z)))
    if arms == 4:  # y mirror: the two stubs see the same when a main arm is driven
        symmetry = float(np.max(np.abs(run1[3]['v'] - run1[4]['v']) / np.abs(run1[3]['v'])))
    else:  # x mirror: the two main arms see the same when the stub is driven
        symmetry = float(np.max(np.abs(run3[1]['v'] - run3[2]['v']) / np.abs(run3[1]['v'])))
    k_of = lambda f: 2 * math.pi * f / C0  # noqa: E731
    return {
        'name': p['name'],
        **({} if arms == 4 else {'use': 'check' if p['name'] in HELD_OUT else 'fit'}),
        'substrate': {'er': p['er'], 'height_m': p['h'] * 1e-3, 'copper_m': 0.0, 'tan_delta': 0.0},
        'frequency_hz': p['f0'],
        'main': {'z0_target_ohm': p['z_main'], 'width_m': p['wm'] * 1e-3},
        'stub': {'z0_target_ohm': p['z_stub'], 'width_m': p['ws'] * 1e-3},
        'freq_hz': [float(f) for f in freq],
        's_re': np.real(s).round(6).tolist(),
        's_im': np.imag(s).round(6).tolist(),
        'fdtd_line': {
            'main_z_ohm': z_main.round(4).tolist(),
            'stub_z_ohm': z_stub.round(4).tolist(),
            'main_eps_eff': [float(round((np.real(b) / k_of(f)) ** 2, 5)) for b, f in zip(run1[1]['beta'], freq)],
            'stub_eps_eff': [float(round((np.real(b) / k_of(f)) ** 2, 5)) for b, f in zip(run3[3]['beta'], freq)],
        },
        'reciprocity_error': round(reciprocity, 6),
        'symmetry_error': round(symmetry, 6),
        'mesh': {'cells': [len(p['mesh'][a]) - 1 for a in 'xyz'], 'max_cell_mm': round(p['res'], 5),
                 'edge_cell_mm': round(p['fine'], 5), 'refine': REFINE},
        'end_criteria': SETTINGS['end_criteria'],
        'run_seconds': round(max(r['seconds'] for r in runs), 1),
    }


# ---------------------------------------------------------------------------------------------
# Via at the end of a line


def plan_via(case):
    name, er, h, drill, pad, f_ghz, z0, *row = case
    count, pitch = (row + [1, 0.0])[:2] if row else (1, 0.0)
    f0 = f_ghz * 1e9
    w = synthesize_width(er, h, z0, f_ghz)
    f_max = fw.BAND[1] * f0 * 1.25
    res = C0 / (f_max * math.sqrt(er)) / fw.UNIT / fw.CELLS_PER_WAVELENGTH / REFINE
    fine = min(w / fw.EDGE_CELLS_PER_WIDTH, h / 2) / REFINE
    r = drill / 2
    via_cells = max(1, round(fw.VIA_CELLS_PER_RADIUS * REFINE))
    meas = max(6 * h, 3 * w, 4.0)
    feed = 2 * meas + 2 * res
    x_far = -(pad / 2 + feed)   # the line runs from x_far to the via centre at x = 0
    margin = max(10 * h, 3 * w, 8.0)
    air = max(12 * h, 8.0)
    step = r / via_cells
    edge_pitch = SETTINGS['edge_pitch_mm']   # not `pitch`: that is the row's via pitch
    tol = min(fine / 4, step / 2, edge_pitch / 4 if edge_pitch else math.inf)
    via_lines = list(step * np.arange(-via_cells, via_cells + 1))
    centres = [(k - (count - 1) / 2) * pitch for k in range(count)]   # across the line, as tunestrip draws a row
    span = (count - 1) * pitch
    xs = [v for v in thirds(pad / 2, 1, fine) if v > r + step / 2] + via_lines + [x_far]
    # the line's edges as simulate.py --wall-cells 1 meshes them (a line on the edge and one either
    # side, `edge_pitch` apart) when --edge-pitch-um is given; the pads' lines stay as they were
    line_edges = [w / 2 - edge_pitch, w / 2, w / 2 + edge_pitch] if edge_pitch else thirds(w / 2, 1, fine)
    edges = line_edges + [c + e for c in centres for e in thirds(pad / 2, 1, fine)] + ([span / 2 + pad / 2] if span > w else [])
    ys_pos = [v for v in edges if v > 0 and all(abs(v - c) > r + step / 2 for c in centres)]
    ys = ys_pos + [-v for v in ys_pos] + [c + v for c in centres for v in via_lines]
    inner = min(res, w / fw.CELLS_ACROSS_WIDTH / REFINE, pad / 4)
    core_x = SmoothMeshLines(fw.merge(xs, tol), inner, fw.GROWTH)
    mesh_x = SmoothMeshLines(fw.merge(list(core_x), tol / 2) + [x_far - 3 * res, pad / 2 + margin], res, fw.GROWTH)
    core_y = SmoothMeshLines(fw.merge(ys, tol), inner, fw.GROWTH)
    mesh_y = SmoothMeshLines(fw.merge(list(core_y), tol / 2) + [-(w / 2 + margin), w / 2 + margin], res, fw.GROWTH)
    z_sub = list(np.linspace(0, h, max(2, round(fw.SUBSTRATE_CELLS * REFINE)) + 1))
    mesh_z = SmoothMeshLines(z_sub + [h + air], res, fw.GROWTH)
    return {'name': name, 'er': er, 'h': h, 'f0': f0, 'z0': z0, 'w': w, 'drill': drill, 'pad': pad, 'x_far': x_far,
            'count': count, 'pitch': pitch, 'centres': centres,
            'meas': meas, 'res': res, 'fine': fine,
            'mesh': {a: [float(v) for v in m] for a, m in (('x', mesh_x), ('y', mesh_y), ('z', mesh_z))}}


def run_via(args):
    p, sim_path = args
    fdtd, csx = new_fdtd(p['f0'], p['mesh'])
    mx, my = p['mesh']['x'], p['mesh']['y']
    h, w = p['h'], p['w']
    csx.AddMaterial('substrate', epsilon=p['er']).AddBox([mx[0], my[0], 0], [mx[-1], my[-1], h], priority=0)
    copper = csx.AddMetal('copper')
    copper.AddBox([p['x_far'], -w / 2, h], [0, w / 2, h], priority=10)
    # each pad as tunestrip draws it: a polygon of 32 sides on the via centre; a row wider than the
    # line gets tunestrip's bar behind the via centres, one pad radius deep
    angles = 2 * math.pi * np.arange(32) / 32
    span = (p['count'] - 1) * p['pitch']
    if span > w:
        copper.AddBox([-p['pad'] / 2, -span / 2, h], [0, span / 2, h], priority=10)
    for c in p['centres']:
        copper.AddPolygon(np.array([p['pad'] / 2 * np.cos(angles), c + p['pad'] / 2 * np.sin(angles)]), 'z', h, priority=10)
        copper.AddCylinder([0, c, 0], [0, c, h], p['drill'] / 2, priority=10)
    arm = abs(p['x_far']) - p['pad'] / 2
    port = fdtd.AddMSLPort(1, copper, [p['x_far'], -w / 2, h], [p['x_far'] + arm, w / 2, 0], 'x', 'z', excite=1,
                           MeasPlaneShift=arm - p['meas'], FeedShift=0, Feed_R=50, priority=10)
    seconds = run_fdtd(fdtd, csx, sim_path)
    freq = np.linspace(0.5 * p['f0'], 1.5 * p['f0'], 11)
    port.CalcPort(sim_path, freq, ref_plane_shift=abs(p['x_far']))
    out = {'seconds': seconds, 'freq': freq, 'v': port.uf_tot, 'i': port.if_tot, 'beta': port.beta, 'zl': port.Z_ref}
    np.save(os.path.join(sim_path, 'ports.npy'), out, allow_pickle=True)
    return out


def extract_via(p, work, reuse):
    run = saved_or_run(run_via, p, work, reuse)
    freq = run['freq']
    z = run['v'] / run['i']
    inductance = np.imag(z) / (2 * math.pi * freq)
    k0 = len(freq) // 2
    gp = goldfarb_pucel_nh(p['h'], p['drill'])
    return {
        'name': p['name'],
        **({'use': 'check' if p['name'] in HELD_OUT else 'fit'} if p['count'] == 1 else {}),
        'substrate': {'er': p['er'], 'height_m': p['h'] * 1e-3, 'copper_m': 0.0, 'tan_delta': 0.0},
        'frequency_hz': p['f0'],
        'line': {'z0_target_ohm': p['z0'], 'width_m': p['w'] * 1e-3},
        'via': {'drill_m': p['drill'] * 1e-3, 'pad_m': p['pad'] * 1e-3, **({'count': p['count'], 'pitch_m': round(p['pitch'] * 1e-3, 9)} if p['count'] > 1 else {})},
        'freq_hz': [float(f) for f in freq],
        'z_re_ohm': np.real(z).round(5).tolist(),
        'z_im_ohm': np.imag(z).round(5).tolist(),
        'inductance_nh': (inductance * 1e9).round(5).tolist(),
        'inductance_nh_at_f0': round(float(inductance[k0] * 1e9), 5),
        'goldfarb_pucel_nh': round(gp, 5),
        'ratio_to_goldfarb_pucel_at_f0': round(float(inductance[k0] * 1e9 / gp), 4),
        'fdtd_line_z_ohm_at_f0': round(float(np.real(run['zl'][k0])), 4),
        'mesh': {'cells': [len(p['mesh'][a]) - 1 for a in 'xyz'], 'max_cell_mm': round(p['res'], 5),
                 'edge_cell_mm': round(p['fine'], 5), 'refine': REFINE,
                 **({'line_edge_pitch_mm': SETTINGS['edge_pitch_mm']} if SETTINGS['edge_pitch_mm'] else {})},
        'end_criteria': SETTINGS['end_criteria'],
        'run_seconds': round(run['seconds'], 1),
    }


# ---------------------------------------------------------------------------------------------
# Open end of a line


def plan_open(case):
    name, er, h, z0, f_ghz = case
    f0 = f_ghz * 1e9
    w = synthesize_width(er, h, z0, f_ghz)
    f_max = fw.BAND[1] * f0 * 1.25
    res = C0 / (f_max * math.sqrt(er)) / fw.UNIT / fw.CELLS_PER_WAVELENGTH / REFINE
    fine = min(w / fw.EDGE_CELLS_PER_WIDTH, h / 2) / REFINE
    meas = max(6 * h, 3 * w, 4.0)
    x_far = -(2 * meas + 2 * res)   # the line runs from x_far to its open end at x = 0
    margin = max(10 * h, 3 * w, 8.0)
    air = max(12 * h, 8.0)
    tol = fine / 4
    inner = min(res, w / fw.CELLS_ACROSS_WIDTH / REFINE)
    core_x = SmoothMeshLines(fw.merge(thirds(0.0, 1, fine) + [x_far], tol), inner, fw.GROWTH)
    mesh_x = SmoothMeshLines(fw.merge(list(core_x), tol / 2) + [x_far - 3 * res, margin], res, fw.GROWTH)
    ys_pos = thirds(w / 2, 1, fine)
    core_y = SmoothMeshLines(fw.merge(ys_pos + [-v for v in ys_pos], tol), inner, fw.GROWTH)
    mesh_y = SmoothMeshLines(fw.merge(list(core_y), tol / 2) + [-(w / 2 + margin), w / 2 + margin], res, fw.GROWTH)
    z_sub = list(np.linspace(0, h, max(2, round(fw.SUBSTRATE_CELLS * REFINE)) + 1))
    mesh_z = SmoothMeshLines(z_sub + [h + air], res, fw.GROWTH)
    return {'name': name, 'er': er, 'h': h, 'f0': f0, 'z0': z0, 'w': w, 'x_far': x_far, 'meas': meas, 'res': res, 'fine': fine,
            'mesh': {a: [float(v) for v in m] for a, m in (('x', mesh_x), ('y', mesh_y), ('z', mesh_z))}}


def run_open(args):
    p, sim_path = args
    fdtd, csx = new_fdtd(p['f0'], p['mesh'])
    mx, my = p['mesh']['x'], p['mesh']['y']
    h, w = p['h'], p['w']
    csx.AddMaterial('substrate', epsilon=p['er']).AddBox([mx[0], my[0], 0], [mx[-1], my[-1], h], priority=0)
    copper = csx.AddMetal('copper')
    copper.AddBox([p['x_far'], -w / 2, h], [0, w / 2, h], priority=10)
    arm = abs(p['x_far'])
    port = fdtd.AddMSLPort(1, copper, [p['x_far'], -w / 2, h], [0, w / 2, 0], 'x', 'z', excite=1,
                           MeasPlaneShift=arm - p['meas'], FeedShift=0, Feed_R=50, priority=10)
    seconds = run_fdtd(fdtd, csx, sim_path)
    freq = np.linspace(0.5 * p['f0'], 1.5 * p['f0'], 11)
    port.CalcPort(sim_path, freq, ref_plane_shift=arm)
    out = {'seconds': seconds, 'freq': freq, 'v': port.uf_tot, 'i': port.if_tot, 'beta': port.beta, 'zl': port.Z_ref}
    np.save(os.path.join(sim_path, 'ports.npy'), out, allow_pickle=True)
    return out


def extract_open(p, work, reuse):
    run = saved_or_run(run_open, p, work, reuse)
    freq = run['freq']
    y = run['i'] / run['v']
    # The end's capacitance as a line extension: tan(β·Δl) = B·Z (the port line's own β and Z).
    extension = np.arctan(np.imag(y) * np.real(run['zl'])) / np.real(run['beta'])
    k0 = len(freq) // 2
    return {
        'name': p['name'],
        'substrate': {'er': p['er'], 'height_m': p['h'] * 1e-3, 'copper_m': 0.0, 'tan_delta': 0.0},
        'frequency_hz': p['f0'],
        'line': {'z0_target_ohm': p['z0'], 'width_m': p['w'] * 1e-3},
        'freq_hz': [float(f) for f in freq],
        'g_s': np.real(y).round(8).tolist(),
        'b_s': np.imag(y).round(8).tolist(),
        'extension_m': (extension).round(9).tolist(),
        'extension_m_at_f0': round(float(extension[k0]), 9),
        'fdtd_line_z_ohm_at_f0': round(float(np.real(run['zl'][k0])), 4),
        'mesh': {'cells': [len(p['mesh'][a]) - 1 for a in 'xyz'], 'max_cell_mm': round(p['res'], 5),
                 'edge_cell_mm': round(p['fine'], 5), 'refine': REFINE},
        'end_criteria': SETTINGS['end_criteria'],
        'run_seconds': round(run['seconds'], 1),
    }


# ---------------------------------------------------------------------------------------------
# Mitred 90° bend


def mitre_edge_cut(w, h):
    """Douville & James (1978) optimum mitre as a cut 2·M·w from the outer corner along each outer edge (physics.md §4.3)."""
    m = 0.52 + 0.65 * math.exp(-1.35 * w / h)
    return 2 * m * w


def plan_bend(case):
    name, er, h, z0, f_ghz = case
    f0 = f_ghz * 1e9
    w = synthesize_width(er, h, z0, f_ghz)
    a = mitre_edge_cut(w, h)
    f_max = fw.BAND[1] * f0 * 1.25
    res = C0 / (f_max * math.sqrt(er)) / fw.UNIT / fw.CELLS_PER_WAVELENGTH / REFINE
    fine = min(w / fw.EDGE_CELLS_PER_WIDTH, h / 2) / REFINE
    meas = max(6 * h, 3 * w, 4.0)
    arm = w / 2 + 2 * meas + 2 * res     # each arm ends this far from the corner
    margin = max(10 * h, 3 * w, 8.0)
    air = max(12 * h, 8.0)
    tol = fine / 4
    inner = min(res, w / fw.CELLS_ACROSS_WIDTH / REFINE)
    # Both axes alike (the bend is symmetric about its diagonal): edges at ±w/2 by the thirds rule,
    # the mitre's end points, the arm's end; arm 1 runs to −arm in x, arm 2 to +arm in y.
    edges = thirds(-w / 2, -1, fine) + thirds(w / 2, 1, fine) + [w / 2 - a, -w / 2 + a]
    core_x = SmoothMeshLines(fw.merge(edges + [-arm], tol), inner, fw.GROWTH)
    mesh_x = SmoothMeshLines(fw.merge(list(core_x), tol / 2) + [-arm - 3 * res, w / 2 + margin], res, fw.GROWTH)
    core_y = SmoothMeshLines(fw.merge(edges + [arm], tol), inner, fw.GROWTH)
    mesh_y = SmoothMeshLines(fw.merge(list(core_y), tol / 2) + [-w / 2 - margin, arm + 3 * res], res, fw.GROWTH)
    z_sub = list(np.linspace(0, h, max(2, round(fw.SUBSTRATE_CELLS * REFINE)) + 1))
    mesh_z = SmoothMeshLines(z_sub + [h + air], res, fw.GROWTH)
    return {'name': name, 'er': er, 'h': h, 'f0': f0, 'z0': z0, 'w': w, 'cut': a, 'arm': arm, 'meas': meas, 'res': res, 'fine': fine,
            'mesh': {ax: [float(v) for v in m] for ax, m in (('x', mesh_x), ('y', mesh_y), ('z', mesh_z))}}


def run_bend(args):
    p, sim_path = args
    fdtd, csx = new_fdtd(p['f0'], p['mesh'])
    mx, my = p['mesh']['x'], p['mesh']['y']
    h, w, a, arm = p['h'], p['w'], p['cut'], p['arm']
    csx.AddMaterial('substrate', epsilon=p['er']).AddBox([mx[0], my[0], 0], [mx[-1], my[-1], h], priority=0)
    copper = csx.AddMetal('copper')
    outline = [(-arm, -w / 2), (w / 2 - a, -w / 2), (w / 2, -w / 2 + a), (w / 2, arm), (-w / 2, arm), (-w / 2, w / 2), (-arm, w / 2)]
    copper.AddPolygon([[x for x, _ in outline], [y for _, y in outline]], 'z', h, priority=10)
    ports = {
        1: (fdtd.AddMSLPort(1, copper, [-arm, -w / 2, h], [-w / 2, w / 2, 0], 'x', 'z', excite=1,
                            MeasPlaneShift=arm - w / 2 - p['meas'], FeedShift=0, Feed_R=50, priority=10), arm),
        2: (fdtd.AddMSLPort(2, copper, [-w / 2, arm, h], [w / 2, w / 2, 0], 'y', 'z', excite=0,
                            MeasPlaneShift=arm - w / 2 - p['meas'], FeedShift=0, Feed_R=50, priority=10), arm),
    }
    seconds = run_fdtd(fdtd, csx, sim_path)
    return calc_ports(ports, sim_path, np.linspace(FIT_BAND[0] * p['f0'], FIT_BAND[1] * p['f0'], FIT_POINTS), seconds)


def extract_bend(p, work, reuse):
    run = saved_or_run(run_bend, p, work, reuse)
    freq = run['freq']
    n = len(freq)
    # Column 2 (port 2 excited) is column 1 mirrored about the bend's diagonal.
    z = np.zeros((n, 2, 2), complex)
    for k in range(n):
        v = np.array([[run[1]['v'][k], run[2]['v'][k]], [run[2]['v'][k], run[1]['v'][k]]])
        i = np.array([[run[1]['i'][k], run[2]['i'][k]], [run[2]['i'][k], run[1]['i'][k]]])
        z[k] = v @ np.linalg.inv(i)
    zl = np.real(run[1]['zl'])
    beta = np.real(run[1]['beta'])
    s = np.array([np.linalg.inv(z[k] + zl[k] * np.eye(2)) @ (z[k] - zl[k] * np.eye(2)) for k in range(n)])
    s21 = s[:, 1, 0]
    length = -np.unwrap(np.angle(s21)) / beta  # beta in rad/m
    k0 = n // 2
    k_of = lambda f: 2 * math.pi * f / C0  # noqa: E731
    return {
        'name': p['name'],
        'substrate': {'er': p['er'], 'height_m': p['h'] * 1e-3, 'copper_m': 0.0, 'tan_delta': 0.0},
        'frequency_hz': p['f0'],
        'line': {'z0_target_ohm': p['z0'], 'width_m': p['w'] * 1e-3},
        'mitre_edge_cut_m': round(p['cut'] * 1e-3, 9),
        'freq_hz': [float(f) for f in freq],
        's11_re': np.real(s[:, 0, 0]).round(6).tolist(),
        's11_im': np.imag(s[:, 0, 0]).round(6).tolist(),
        's21_re': np.real(s21).round(6).tolist(),
        's21_im': np.imag(s21).round(6).tolist(),
        'equivalent_length_m': length.round(9).tolist(),
        'equivalent_length_m_at_f0': round(float(length[k0]), 9),
        'equivalent_length_per_width_at_f0': round(float(length[k0] / (p['w'] * 1e-3)), 5),
        'fdtd_line_z_ohm_at_f0': round(float(zl[k0]), 4),
        'fdtd_line_eps_eff_at_f0': round(float((beta[k0] / k_of(freq[k0])) ** 2), 5),
        # No reciprocity error: the mirrored column makes Z symmetric by construction.
        'mesh': {'cells': [len(p['mesh'][a]) - 1 for a in 'xyz'], 'max_cell_mm': round(p['res'], 5),
                 'edge_cell_mm': round(p['fine'], 5), 'refine': REFINE},
        'end_criteria': SETTINGS['end_criteria'],
        'run_seconds': round(run['seconds'], 1),
    }


def save(kind, entry):
    data = {'solver': fw.openems_version(), 'crosses': [], 'tees': [], 'open_ends': [], 'vias': [], 'bends': [], 'via_rows': []}
    results = SETTINGS['results']
    if os.path.exists(results):
        with open(results, encoding='utf8') as f:
            data = {**data, **json.load(f)}
    data['solver'] = fw.openems_version()
    data[kind] = sorted([d for d in data[kind] if d['name'] != entry['name']] + [entry], key=lambda d: d['name'])
    with open(results + '.tmp', 'w', encoding='utf8') as f:
        json.dump(data, f, indent=1)
        f.write('\n')
    os.replace(results + '.tmp', results)


def main():
    ap = argparse.ArgumentParser(description=__doc__.split('\n')[0])
    ap.add_argument('kind', choices=['cross', 'tee', 'open', 'via', 'via-row', 'bend'])
    ap.add_argument('names', nargs='*', help='cases to run (default: all of that kind)')
    ap.add_argument('--work', default='/tmp/fullwave-junctions')
    ap.add_argument('--reuse', action='store_true', help='post-process earlier runs in --work again')
    ap.add_argument('--parallel', type=int, default=1, help='open-end or via cases run side by side (one thread each)')
    ap.add_argument('--end-criteria', type=float, default=JUNCTION_END_CRITERIA,
                    help='stop when the field energy has decayed to this fraction of its peak')
    ap.add_argument('--results', default=RESULTS, help='the JSON file the entries are written into')
    ap.add_argument('--edge-pitch-um', type=float, default=0.0,
                    help='via and via-row only: mesh the line\'s edges with lines this far apart (on the edge and '
                         'one either side) instead of the thirds rule; needs --results other than junctions.json')
    args = ap.parse_args()
    if args.edge_pitch_um and (args.kind not in ('via', 'via-row') or os.path.abspath(args.results) == os.path.abspath(RESULTS)):
        raise SystemExit('--edge-pitch-um is for via and via-row cases, written to a --results file of their own')
    SETTINGS.update(end_criteria=args.end_criteria, results=os.path.abspath(args.results),
                    edge_pitch_mm=args.edge_pitch_um / 1000)
    table = {'cross': CROSSES, 'tee': TEES, 'open': OPEN_ENDS, 'via': VIAS, 'via-row': VIA_ROWS, 'bend': BENDS}[args.kind]
    cases = [c for c in table if not args.names or c[0] in args.names]
    if args.names and len(cases) != len(args.names):
        raise SystemExit('unknown case name; known: ' + ', '.join(c[0] for c in table))
    if args.kind in ('cross', 'tee'):
        for c in cases:
            entry = extract_cross(plan_cross(c, 4 if args.kind == 'cross' else 3), args.work, args.reuse)
            save('crosses' if args.kind == 'cross' else 'tees', entry)
            print(json.dumps({k: entry[k] for k in ('name', 'reciprocity_error', 'symmetry_error', 'mesh', 'run_seconds')}), flush=True)
    else:  # one-run cases: several side by side with --parallel
        plan, run, extract, key, shown = {
            'open': (plan_open, run_open, extract_open, 'open_ends', ('extension_m_at_f0',)),
            'via': (plan_via, run_via, extract_via, 'vias', ('inductance_nh_at_f0', 'goldfarb_pucel_nh', 'ratio_to_goldfarb_pucel_at_f0')),
            'via-row': (plan_via, run_via, extract_via, 'via_rows', ('inductance_nh_at_f0', 'goldfarb_pucel_nh')),
            'bend': (plan_bend, run_bend, extract_bend, 'bends', ('equivalent_length_m_at_f0', 'equivalent_length_per_width_at_f0')),
        }[args.kind]
        plans = [plan(c) for c in cases]
        if args.parallel > 1 and not args.reuse:
            with mp.get_context('fork').Pool(args.parallel) as pool:
                pool.map(run, [(p, os.path.join(args.work, p['name'])) for p in plans])
            args.reuse = True
        for p in plans:
            entry = extract(p, args.work, args.reuse)
            save(key, entry)
            print(json.dumps({k: entry[k] for k in ('name',) + shown + ('run_seconds',)}), flush=True)

if __name__ == '__main__':
    main()
