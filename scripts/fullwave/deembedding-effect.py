#!/usr/bin/python3
"""How much the lossy feed de-embedding moves each recorded run (eighth round, README).

Reads the saved runs of `simulate.py` (WORK/<name>-refine2/excite-*/ports.npy, whose V and I were
moved to the reference plane with the feed's attenuation kept), moves them back to the probes, and
moves them again, from the mesh line openEMS measured on, with Re(β) only, as openEMS 0.0.35's own
shift does, and with the attenuation. Prints the return-loss minimum both ways. Diagnostic only; not part of tunestrip.

    /usr/bin/python3 scripts/fullwave/deembedding-effect.py DESIGNS_DIR WORK_DIR NAME [NAME ...]
"""
import os
import sys

import numpy as np

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import simulate as S  # noqa: E402


def main():
    designs, work, names = sys.argv[1], sys.argv[2], sys.argv[3:]
    for name in names:
        design = S.read_design(os.path.join(designs, name))
        plan = S.plan_model(design, 2.0, False)
        runs = {ex: np.load(os.path.join(work, f'{name}-refine2', f'excite-{ex}', 'ports.npy'), allow_pickle=True).item() for ex in ('source', 'load')}
        freq = runs['source']['freq']
        load, target, f0 = complex(*design['load_ohm']), complex(*design['target_ohm']), design['frequency_hz']
        row = [name]
        for lossy in (False, True):
            moved = {}
            for ex, run in runs.items():
                moved[ex] = {'freq': freq}
                for role in ('source', 'load'):
                    p = run[role]
                    # runs saved before the ninth round were moved the requested distance, later ones the snapped one
                    moved_by = p.get('meas_m', plan['meas'] * S.UNIT)
                    v, i = S.shift_along_line(p['v'], p['i'], np.real(p['beta']) - 1j * p['alpha'], p['zl'], -moved_by)
                    beta = np.real(p['beta']) - (1j * p['alpha'] if lossy else 0)
                    v, i = S.shift_along_line(v, i, beta, p['zl'], S.measurement_distance(plan, role) * S.UNIT)
                    moved[ex][role] = {'v': v, 'i': i}
            z = S.impedance_matrix(moved['source'], moved['load'])
            db = 20 * np.log10(np.abs(S.terminated_reflection(z, load, target)))
            f_min, _, _ = S.minimum_of(freq, db)
            row.append(f"{'lossy' if lossy else 'Re(beta) only'} {100 * (f_min - f0) / f0:+.2f} %")
        print('  '.join(row), flush=True)


if __name__ == '__main__':
    main()
