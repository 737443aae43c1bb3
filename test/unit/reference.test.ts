// Reflection against a real reference, recovered from the power-wave reflection against a complex
// target (src/analysis/reference.ts). Check: for any Z, converting (Z − Zt)/(Z + Zt*) must give
// the ordinary reflection (Z − R)/(Z + R) (Pozar, Microwave Engineering, 3rd ed. 2005, eq. 2.35).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { complex, div, add, sub, abs } from '../../src/math/complex.js';
import { mismatch } from '../../src/analysis/physicalNetwork.js';
import { realReference, reflectionAgainst } from '../../src/analysis/reference.js';

describe('reflection against a real reference', () => {
  it('a real target is its own reference, a complex one falls back to 50 Ω', () => {
    expect(realReference(complex(75, 0))).toBe(75);
    expect(realReference(complex(25, 15))).toBe(50);
  });

  it('recovers (Z − R)/(Z + R) from the power-wave reflection against any passive target', () => {
    const positive = fc.double({ min: 0.5, max: 500, noNaN: true });
    const reactance = fc.double({ min: -500, max: 500, noNaN: true });
    fc.assert(
      fc.property(positive, reactance, positive, reactance, (r, x, rt, xt) => {
        const z = complex(r, x);
        const target = complex(rt, xt);
        const got = reflectionAgainst(mismatch(z, target), target, 50);
        const want = div(sub(z, complex(50, 0)), add(z, complex(50, 0)));
        return abs(sub(got, want)) < 1e-9;
      }),
      { seed: 42, numRuns: 500 },
    );
  });
});
