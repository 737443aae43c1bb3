#!/usr/bin/python3
"""The full-wave 2-port Z of a saved simulate.py run at given frequencies, and the input impedance it
gives with port 2 ended in each given load (eighth round, README). Diagnostic only; not part of
tunestrip.

    /usr/bin/python3 scripts/fullwave/two-port-at.py WORK/<name>-refine2 --f 1.8e9 [--f ...] [--load 60-45j ...]
        [--design OUT_DIR --refine 2]   (needed for runs saved before the ninth round)
"""
import argparse
import os
import sys

import numpy as np

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from simulate import impedance_matrix, plan_model, read_design, snap_saved_run, terminated_input_impedance  # noqa: E402


def main():
    ap = argparse.ArgumentParser(description=__doc__.split('\n')[0])
    ap.add_argument('run', help="a run folder of simulate.py's --work (holds excite-source/ and excite-load/)")
    ap.add_argument('--f', type=float, action='append', required=True, help='frequency in Hz (repeatable)')
    ap.add_argument('--load', type=complex, action='append', default=[], help="load on port 2 in Python's notation, 60-45j (repeatable)")
    ap.add_argument('--design', help='the design folder the run was made from (to move an older saved run to the snapped measurement plane)')
    ap.add_argument('--refine', type=float, default=2.0, help='the run\'s --refine (with --design)')
    args = ap.parse_args()
    runs = [np.load(os.path.join(args.run, f'excite-{role}', 'ports.npy'), allow_pickle=True).item() for role in ('source', 'load')]
    if any('meas_m' not in r[role] for r in runs for role in ('source', 'load')):
        if not args.design:
            raise SystemExit('this run was saved before the ninth round: give --design (and --refine) to place its reference planes')
        plan = plan_model(read_design(args.design), args.refine)
        runs = [snap_saved_run(r, plan) for r in runs]
    z = impedance_matrix(*runs)
    freq = runs[0]['freq']
    for f_target in args.f:
        k = int(np.argmin(abs(freq - f_target)))
        zz = z[k]
        print(f"f={freq[k] / 1e9:.4f} GHz  Z11={zz[0, 0]:.2f} Z12={zz[0, 1]:.2f} Z21={zz[1, 0]:.2f} Z22={zz[1, 1]:.2f}")
        for load in args.load:
            zin = terminated_input_impedance(zz, load)
            print(f"   ZL={load}: Zin={zin.real:.3f}{zin.imag:+.3f}j")


if __name__ == '__main__':
    main()
