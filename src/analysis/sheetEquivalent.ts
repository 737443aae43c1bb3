// Where an EM model that draws this copper as a lossless zero-thickness sheet (a common default of
// planar and FDTD solvers) should put the return-loss minimum. tunestrip sizes every line for the
// stackup's copper, and thickness lowers εe and Z0 (Hammerstad–Jensen 1980's correction, checked
// against a field solution of the cross-section in test/reference/microstrip-cross-section.test.ts).
// A sheet model leaves that out, so it sees other lines and a shifted match. Saying where lets the
// designer who verifies the artwork compare like with like.
import { abs } from '../math/complex.js';
import { minimiseOnGrid } from '../math/minimise.js';
import type { PhysicalDesign, SheetEquivalent, Spec } from '../seams.js';
import { ALL_MODELS, mismatch, physicalInputImpedance } from './physicalNetwork.js';

/** Searched span around f0 (fraction): wider than any thickness shift, narrow enough to stay on the design's own dip. */
const SPAN = 0.3;
const SAMPLES = 121;
/** Resolution of the minimum as a fraction of f0. */
const RESOLUTION = 1e-7;

/** The sheet model's return-loss minimum, or null when the stackup's copper is already zero-thickness. */
export function sheetEquivalent(spec: Spec, design: PhysicalDesign): SheetEquivalent | null {
  if (spec.substrate.copper === 0) return null;
  const sheet = { ...spec.substrate, copper: 0 };
  const models = { ...ALL_MODELS, loss: false };
  const f0 = design.frequency;
  const gammaAt = (f: number): number => abs(mismatch(physicalInputImpedance(design.copper, spec.load, sheet, f, models), spec.target));
  const minimumFrequency = minimiseOnGrid(gammaAt, f0 * (1 - SPAN), f0 * (1 + SPAN), SAMPLES, f0 * RESOLUTION);
  return { minimumFrequency, offset: minimumFrequency / f0 - 1 };
}
