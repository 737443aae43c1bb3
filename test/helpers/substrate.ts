// A substrate for model checks: smooth, lossless copper and dielectric unless a test says otherwise
// (annealed copper σ = 5.8e7 S/m, common practice, no source).
import type { Substrate } from '../../src/seams.js';

export const substrate = (er: number, height: number, copper = 0, extra: Partial<Substrate> = {}): Substrate => ({
  er,
  height,
  copper,
  tanDelta: 0,
  roughness: 0,
  conductivity: 5.8e7,
  ...extra,
});
