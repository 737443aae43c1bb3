// Symmetric cross junction (balanced stubs): Hammerstad's T-junction model (1981) corrected by
// factors fitted to two 4-port full-wave extractions of bare crosses (physics.md §4.2, "Full-wave
// check of the cross": εr 2.2 / h 0.508 mm / 50 Ω main, 60 Ω stubs at 6.4 GHz, and εr 4.4 /
// h 1.6 mm / 50 Ω main and stubs at 2.4 GHz). Against the T model, both crosses showed
//   main-arm planes        d_a × 1.37 … 1.44              → × 1.40
//   stub plane             d2 + 0.258·D2 … d2 + 0.251·D2  → d2 + 0.255·D2
//   transformer deficit    (1 − n²) × 2.66 … 2.94         → × 2.8
//   susceptance            B + 31.8 … 32.7·(D2/λ2)²/Z2    → B + 32.2·(D2/λ2)²/Z2
// with D2 = η0·h/(Z2·√εe,2) the stub's parallel-plate width and λ2 its guided wavelength. Each
// stub of a cross is electrically shorter than the stub of a T, which these shifts capture. Two
// extractions only: check balanced designs by full-wave simulation.
import type { LineProperties, Substrate } from '../../seams.js';
import { ETA0 } from '../microstrip/constants.js';
import type { TJunction } from './tJunction.js';

export const CROSS_FIT = { planeA: 1.4, stubPlaneD2: 0.255, n2Deficit: 2.8, susceptance: 32.2 } as const;

export function crossJunctionFitted(tee: TJunction, stub: LineProperties, substrate: Substrate): TJunction {
  const d2Width = (ETA0 / stub.z0) * substrate.height / Math.sqrt(stub.epsEff);
  const n2 = (n: number): number => Math.max(1 - CROSS_FIT.n2Deficit * (1 - n), 1e-3);
  return {
    da: CROSS_FIT.planeA * tee.da,
    db: CROSS_FIT.planeA * tee.db,
    d2: tee.d2 + CROSS_FIT.stubPlaneD2 * d2Width,
    n2a: n2(tee.n2a),
    n2b: n2(tee.n2b),
    susceptance: tee.susceptance + (CROSS_FIT.susceptance * (d2Width / stub.wavelength) ** 2) / stub.z0,
    warnings: tee.warnings,
  };
}
