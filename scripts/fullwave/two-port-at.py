#!/usr/bin/python3
"""The full-wave 2-port Z of a saved simulate.py run at given frequencies, and the input impedance it
gives for a few loads (eighth round, README). Diagnostic only; not part of tunestrip.

    /usr/bin/python3 scripts/fullwave/two-port-at.py WORK/<name>-refine2 F_HZ [F_HZ ...]
"""
import os
import sys

import numpy as np

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from simulate import impedance_matrix  # noqa: E402

base = sys.argv[1]
rs = np.load(os.path.join(base, 'excite-source', 'ports.npy'), allow_pickle=True).item()
rl = np.load(os.path.join(base, 'excite-load', 'ports.npy'), allow_pickle=True).item()
z = impedance_matrix(rs, rl)
f = rs['freq']
loads = [complex(60, -45), 50, 25, 100, complex(0, 50), complex(0, -50)]
for f_target in [float(x) for x in sys.argv[2:]]:
    k = int(np.argmin(abs(f - f_target)))
    zz = z[k]
    print(f"f={f[k] / 1e9:.4f} GHz  Z11={zz[0, 0]:.2f} Z12={zz[0, 1]:.2f} Z21={zz[1, 0]:.2f} Z22={zz[1, 1]:.2f}")
    for load in loads:
        zin = zz[0, 0] - zz[0, 1] * zz[1, 0] / (zz[1, 1] + load)
        print(f"   ZL={load}: Zin={zin.real:.3f}{zin.imag:+.3f}j")
