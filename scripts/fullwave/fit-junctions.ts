// Prints the fits of the cross-junction and via models to scripts/fullwave/junctions.json: per cross
// case the even-mode S error of the bare T model, of the coefficients in src/, and of a fresh
// least-squares fit; each case's own elements; the via inductance ratios. Diagnostic only.
//
//   npx tsx scripts/fullwave/fit-junctions.ts [junctions.json]
import { CROSS_FIT, VIA_CROWDING_FIT } from '../../src/physical/discontinuities/index.js';
import { openEndComparisons, caseElements, crossElements, crossPoints, fitCross, fitViaCrowding, readJunctions, rmsError, viaComparisons } from './junction-fit.js';

const data = readJunctions(process.argv[2]);
const fixed = (v: number, d: number): string => v.toFixed(d);

const all = crossPoints(data.crosses);
const fresh = fitCross(all, CROSS_FIT);
console.log(`cross fit over ${data.crosses.length} cases, ${all.length} points`);
console.log(`  coefficients in src: ${JSON.stringify(CROSS_FIT)}  rms ${fixed(rmsError(all, (p) => crossElements(p, CROSS_FIT)), 5)}`);
console.log(`  least squares:       ${JSON.stringify(Object.fromEntries(Object.entries(fresh.fit).map(([k, v]) => [k, Number(v.toFixed(4))])))}  rms ${fixed(fresh.rms, 5)}`);
console.log(`  bare T model:        rms ${fixed(rmsError(all, (p) => crossElements(p, undefined)), 5)}`);
console.log('\ncase                              rms T     rms src   rms fit   | at f0: d_a mm, d2 mm, n², B mS (own fit / src model)');
for (const record of data.crosses) {
  const points = crossPoints([record]);
  const mid = points[Math.floor(points.length / 2)]!;
  const own = caseElements(mid, crossElements(mid, CROSS_FIT));
  const src = crossElements(mid, CROSS_FIT);
  console.log(
    `${record.name.padEnd(34)}${fixed(rmsError(points, (p) => crossElements(p, undefined)), 5).padEnd(10)}${fixed(rmsError(points, (p) => crossElements(p, CROSS_FIT)), 5).padEnd(10)}${fixed(rmsError(points, (p) => crossElements(p, fresh.fit)), 5).padEnd(10)}| ` +
      `${fixed(own.da * 1e3, 3)}/${fixed(src.da * 1e3, 3)}  ${fixed(own.d2 * 1e3, 3)}/${fixed(src.d2 * 1e3, 3)}  ${fixed(own.n2, 4)}/${fixed(src.n2, 4)}  ${fixed(own.susceptance * 1e3, 3)}/${fixed(src.susceptance * 1e3, 3)}  (own rms ${fixed(own.rms, 5)})`,
  );
}
console.log('\ntee (Hammerstad 1981, not fitted)   rms T     | at f0: d_a mm, d2 mm, n², B mS (own fit / Hammerstad)');
for (const record of data.tees) {
  const points = crossPoints([record]);
  const mid = points[Math.floor(points.length / 2)]!;
  const model = crossElements(mid, undefined);
  const own = caseElements(mid, model);
  console.log(
    `${record.name.padEnd(34)}${fixed(rmsError(points, (p) => crossElements(p, undefined)), 5).padEnd(10)}| ` +
      `${fixed(own.da * 1e3, 3)}/${fixed(model.da * 1e3, 3)}  ${fixed(own.d2 * 1e3, 3)}/${fixed(model.d2 * 1e3, 3)}  ${fixed(own.n2, 4)}/${fixed(model.n2, 4)}  ${fixed(own.susceptance * 1e3, 3)}/${fixed(model.susceptance * 1e3, 3)}  (own rms ${fixed(own.rms, 5)})`,
  );
}
{
  // A candidate for later: the cross's correction form fitted to the tees. Not used by tunestrip;
  // applying it moves every design's copper (see scripts/fullwave/README.md, second round).
  const tees = crossPoints(data.tees);
  if (tees.length > 0) {
    const teeFit = fitCross(tees, { planeA: 1, stubPlaneD2: 0, n2Deficit: 1, susceptance: 0 });
    console.log(`  candidate tee correction (cross form, not used): ${JSON.stringify(Object.fromEntries(Object.entries(teeFit.fit).map(([k, v]) => [k, Number(v.toFixed(4))])))}  rms ${fixed(teeFit.rms, 5)}`);
  }
}
console.log('\nopen ends (Kirschning–Jansen–Koster 1981, not fitted)');
for (const o of openEndComparisons(data.open_ends)) {
  console.log(`${o.name.padEnd(26)} Δl/h measured ${fixed(o.measured / o.height, 4)}  model ${fixed(o.model / o.height, 4)}  (${fixed(100 * (o.model / o.measured - 1), 1)} %)`);
}
console.log(`\nvias: crowding coefficient in src ${VIA_CROWDING_FIT}, least squares ${fitViaCrowding(data.vias).toFixed(4)}`);
for (const v of viaComparisons(data.vias)) {
  console.log(
    `${v.name.padEnd(24)} ${v.use.padEnd(6)}h/d ${fixed(v.hOverD, 2).padStart(5)}  w/h ${fixed(v.wOverH, 2)}  measured ${fixed(v.measuredNh, 4)} nH  ` +
      `Goldfarb–Pucel ${fixed(v.goldfarbPucelNh, 4)} nH (${fixed(100 * (v.goldfarbPucelNh / v.measuredNh - 1), 1)} %)  design model ${fixed(v.designNh, 4)} nH (${fixed(100 * (v.designNh / v.measuredNh - 1), 1)} %)`,
  );
}
