#!/usr/bin/python3
"""Post-processes a stopped simulate.py run from its port files, cut at a chosen time.

A run whose energy stops falling and grows again (a late-time instability of the FDTD, seen in the
fifteenth round with 17.5 µm cells) never reaches the end criterion. Stop it, copy its
excite-source and excite-load folders to SAVED, and pass the time of its lowest energy (timestep
number from openEMS's log × its timestep): the port signals are cut there and post-processed
exactly as simulate.py does. Prints the result and, with --results, records it there as
simulate.py would, its end criterion saying where the signals were cut.

    /usr/bin/python3 scripts/fullwave/cut-run.py OUT_DIR SAVED T_CUT_S --work W [--refine 2]
        [--thick] [--copper-cells N] [--wall-cells N] [--spec SPEC --results results.json --ran-seconds S]
"""
import argparse
import glob
import importlib.util
import json
import os
import sys

ap = argparse.ArgumentParser(description=__doc__.split('\n')[0])
ap.add_argument('folder')
ap.add_argument('saved', help='folder holding the stopped run\'s excite-source and excite-load')
ap.add_argument('t_cut', type=float, help='time (s) after which the port signals are dropped')
ap.add_argument('--work', required=True)
ap.add_argument('--refine', type=float, default=2.0)
ap.add_argument('--thick', action='store_true')
ap.add_argument('--copper-cells', type=int, default=1)
ap.add_argument('--wall-cells', type=int, default=0)
ap.add_argument('--spec', help='spec file the folder was made from, recorded with the result')
ap.add_argument('--ran-seconds', type=float, help="how long the stopped run ran (from openEMS's log), recorded as run_seconds")
ap.add_argument('--results', help='results.json to record the run in (by default it is only printed)')
args = ap.parse_args()

here = os.path.dirname(os.path.abspath(__file__))
spec = importlib.util.spec_from_file_location('simulate', os.path.join(here, 'simulate.py'))
sim = importlib.util.module_from_spec(spec)
sys.argv = sys.argv[:1]
spec.loader.exec_module(sim)


def cut_saved_signals(self, sim_path, **_):
    """Stands in for openEMS.Run: writes the saved port signals up to t_cut into the run folder."""
    source = os.path.join(args.saved, os.path.basename(sim_path))
    for path in glob.glob(os.path.join(source, 'port_*')):
        with open(path, encoding='utf8') as f:
            rows = [r for r in f if r.startswith('%') or float(r.split()[0]) <= args.t_cut]
        with open(os.path.join(sim_path, os.path.basename(path)), 'w', encoding='utf8') as f:
            f.writelines(rows)


class SavedRun(sim.openEMS):
    Run = cut_saved_signals


sim.openEMS = SavedRun
sim.run_or_reuse = lambda worker, jobs, reuse: [worker(j) for j in jobs]
r = sim.simulate(args.folder, args.work, 1, False, args.refine, args.thick, sim.END_CRITERIA, args.copper_cells, args.wall_cells)
r['end_criteria'] = f'stopped; port signals cut at {args.t_cut:g} s'
r['run_seconds'] = args.ran_seconds
print(json.dumps({k: r[k] for k in ('name', 'copper_model', 'f_min_hz', 'offset_percent', 's11_db_at_f0', 's11_db_at_min', 'fdtd_port_line_at_f0', 'reciprocity_error', 'end_criteria', 'mesh')}, indent=1))
if args.results:
    if args.spec:
        r['spec'] = os.path.relpath(os.path.abspath(args.spec), os.path.join(here, '..', '..'))
    with open(args.results, encoding='utf8') as f:
        results = json.load(f)
    same = lambda d: d['name'] == r['name'] and d.get('copper_model') == r['copper_model']  # noqa: E731
    results['designs'] = sorted([d for d in results['designs'] if not same(d)] + [r], key=lambda d: (d['name'], d.get('copper_model', '')))
    with open(args.results, 'w', encoding='utf8') as f:
        json.dump(results, f, indent=2)
        f.write('\n')
