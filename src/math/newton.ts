// Newton's method on two real unknowns with a forward-difference Jacobian. Used to refine the
// series-line and stub lengths on the physical network, where no closed form exists.
export interface Newton2Result {
  readonly x: readonly [number, number];
  readonly residual: number;
  readonly iterations: number;
  readonly converged: boolean;
}

export function newton2(
  f: (x: readonly [number, number]) => readonly [number, number],
  start: readonly [number, number],
  options: { readonly step: readonly [number, number]; readonly tolerance: number; readonly maxIterations?: number; readonly maxMove?: readonly [number, number] },
): Newton2Result {
  const maxIterations = options.maxIterations ?? 40;
  let x: [number, number] = [start[0], start[1]];
  let fx = f(x);
  let residual = Math.hypot(fx[0], fx[1]);
  for (let i = 0; i < maxIterations; i++) {
    if (!Number.isFinite(residual)) return { x, residual, iterations: i, converged: false };
    if (residual <= options.tolerance) return { x, residual, iterations: i, converged: true };
    const f0 = f([x[0] + options.step[0], x[1]]);
    const f1 = f([x[0], x[1] + options.step[1]]);
    const a = (f0[0] - fx[0]) / options.step[0];
    const c = (f0[1] - fx[1]) / options.step[0];
    const b = (f1[0] - fx[0]) / options.step[1];
    const d = (f1[1] - fx[1]) / options.step[1];
    const det = a * d - b * c;
    if (!Number.isFinite(det) || det === 0) return { x, residual, iterations: i, converged: false };
    let dx0 = -(d * fx[0] - b * fx[1]) / det;
    let dx1 = -(-c * fx[0] + a * fx[1]) / det;
    // Limit the step so a poor start cannot throw the lengths onto another branch.
    if (options.maxMove) {
      const k = Math.max(Math.abs(dx0) / options.maxMove[0], Math.abs(dx1) / options.maxMove[1], 1);
      dx0 /= k;
      dx1 /= k;
    }
    // Backtrack: accept the step only if the residual falls.
    let t = 1;
    let next: [number, number] = [x[0] + dx0, x[1] + dx1];
    let fn = f(next);
    let rn = Math.hypot(fn[0], fn[1]);
    while (!(rn < residual) && t > 1 / 64) {
      t /= 2;
      next = [x[0] + t * dx0, x[1] + t * dx1];
      fn = f(next);
      rn = Math.hypot(fn[0], fn[1]);
    }
    if (!(rn < residual)) return { x, residual, iterations: i, converged: residual <= options.tolerance };
    x = next;
    fx = fn;
    residual = rn;
  }
  return { x, residual, iterations: maxIterations, converged: residual <= options.tolerance };
}
