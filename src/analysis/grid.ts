// Evenly spaced frequency grids for sweeps and tolerance runs.
export function frequencyGrid(start: number, stop: number, points: number): number[] {
  if (points < 2) return [start];
  return Array.from({ length: points }, (_, i) => start + ((stop - start) * i) / (points - 1));
}
