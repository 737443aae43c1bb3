// One-dimensional minimisation: a grid finds the lowest sample, golden-section search refines it
// between that sample's neighbours. The grid keeps a second dip from hiding the lowest one.

const INV_PHI = (Math.sqrt(5) - 1) / 2;

/** The x in [lo, hi] where f is smallest: `samples` grid points, then golden section to `tolerance` in x. */
export function minimiseOnGrid(f: (x: number) => number, lo: number, hi: number, samples: number, tolerance: number): number {
  const step = (hi - lo) / (samples - 1);
  let best = 0;
  let bestValue = Infinity;
  for (let k = 0; k < samples; k++) {
    const v = f(lo + k * step);
    if (v < bestValue) [best, bestValue] = [k, v];
  }
  let a = lo + Math.max(0, best - 1) * step;
  let b = lo + Math.min(samples - 1, best + 1) * step;
  let c = b - INV_PHI * (b - a);
  let d = a + INV_PHI * (b - a);
  let fc = f(c);
  let fd = f(d);
  while (b - a > tolerance) {
    if (fc < fd) {
      [b, d, fd] = [d, c, fc];
      c = b - INV_PHI * (b - a);
      fc = f(c);
    } else {
      [a, c, fc] = [c, d, fd];
      d = a + INV_PHI * (b - a);
      fd = f(d);
    }
  }
  return (a + b) / 2;
}
