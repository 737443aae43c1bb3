// Prints the fits of the junction, open-end and via models to scripts/fullwave/junctions.json: per
// cross and tee case the S error of the bare T model, of the coefficients in src/, and of a fresh
// least-squares fit; each case's own elements; the open-end and via ratios. Diagnostic only.
//
//   npx tsx scripts/fullwave/fit-junctions.ts [junctions.json]
import { BEND_LENGTH_FIT, CROSS_FIT, OPEN_END_FULLWAVE_SCALE, TEE_FIT, VIA_CROWDING_FIT, type JunctionFit } from '../../src/physical/discontinuities/index.js';
import { bendComparisons, fitBendLength, fitOpenEndScale, fittedTees, openEndComparisons, caseElements, junctionElements, junctionPoints, fitJunction, fitViaCrowding, readJunctions, rmsError, viaComparisons, type JunctionPoint } from './junction-fit.js';

const data = readJunctions(process.argv[2]);
const fixed = (v: number, d: number): string => v.toFixed(d);

/** Prints a fit's heading: the coefficients in src, a fresh least-squares fit, the bare T; returns the fresh fit. */
function fitSummary(heading: string, points: readonly JunctionPoint[], inSrc: JunctionFit): JunctionFit {
  const fresh = fitJunction(points, inSrc);
  console.log(`${heading}, ${points.length} points`);
  console.log(`  coefficients in src: ${JSON.stringify(inSrc)}  rms ${fixed(rmsError(points, (p) => junctionElements(p, inSrc)), 5)}`);
  console.log(`  least squares:       ${JSON.stringify(Object.fromEntries(Object.entries(fresh.fit).map(([k, v]) => [k, Number(v.toFixed(4))])))}  rms ${fixed(fresh.rms, 5)}`);
  console.log(`  bare T model:        rms ${fixed(rmsError(points, (p) => junctionElements(p, undefined)), 5)}`);
  return fresh.fit;
}

const freshCross = fitSummary(`cross fit over ${data.crosses.length} cases`, junctionPoints(data.crosses), CROSS_FIT);
console.log('\ncase                              rms T     rms src   rms fit   | at f0: d_a mm, d2 mm, n², B mS (own fit / src model)');
for (const record of data.crosses) {
  const points = junctionPoints([record]);
  const mid = points[Math.floor(points.length / 2)]!;
  const own = caseElements(mid, junctionElements(mid, CROSS_FIT));
  const src = junctionElements(mid, CROSS_FIT);
  console.log(
    `${record.name.padEnd(34)}${fixed(rmsError(points, (p) => junctionElements(p, undefined)), 5).padEnd(10)}${fixed(rmsError(points, (p) => junctionElements(p, CROSS_FIT)), 5).padEnd(10)}${fixed(rmsError(points, (p) => junctionElements(p, freshCross)), 5).padEnd(10)}| ` +
      `${fixed(own.da * 1e3, 3)}/${fixed(src.da * 1e3, 3)}  ${fixed(own.d2 * 1e3, 3)}/${fixed(src.d2 * 1e3, 3)}  ${fixed(own.n2, 4)}/${fixed(src.n2, 4)}  ${fixed(own.susceptance * 1e3, 3)}/${fixed(src.susceptance * 1e3, 3)}  (own rms ${fixed(own.rms, 5)})`,
  );
}
const heldOut = data.tees.filter((t) => t.use === 'check').map((t) => t.name).join(', ') || 'none';
fitSummary(`\ntee fit over ${fittedTees(data).length} cases (held out: ${heldOut})`, junctionPoints(fittedTees(data)), TEE_FIT);
console.log('\ncase                              rms T     rms src   | at f0: d_a mm, d2 mm, n², B mS (own fit / src model / Hammerstad)');
for (const record of data.tees) {
  const points = junctionPoints([record]);
  const mid = points[Math.floor(points.length / 2)]!;
  const bare = junctionElements(mid, undefined);
  const src = junctionElements(mid, TEE_FIT);
  const own = caseElements(mid, src);
  const three = (k: 'da' | 'd2' | 'n2' | 'susceptance', unit: number, d: number): string => [own, src, bare].map((e) => fixed(e[k] * unit, d)).join('/');
  console.log(
    `${(record.name + (record.use === 'check' ? ' (held out)' : '')).padEnd(34)}${fixed(rmsError(points, (p) => junctionElements(p, undefined)), 5).padEnd(10)}${fixed(rmsError(points, (p) => junctionElements(p, TEE_FIT)), 5).padEnd(10)}| ` +
      `${three('da', 1e3, 3)}  ${three('d2', 1e3, 3)}  ${three('n2', 1, 4)}  ${three('susceptance', 1e3, 3)}  (own rms ${fixed(own.rms, 5)})`,
  );
}
console.log(`\nopen ends: scale on Kirschning–Jansen–Koster 1981 in src ${OPEN_END_FULLWAVE_SCALE}, least squares ${fitOpenEndScale(data.open_ends).toFixed(4)}`);
for (const o of openEndComparisons(data.open_ends)) {
  console.log(`${o.name.padEnd(26)} Δl/h measured ${fixed(o.measured / o.height, 4)}  KJK ${fixed(o.kjk / o.height, 4)} (${fixed(100 * (o.kjk / o.measured - 1), 1)} %)  design model ${fixed(o.model / o.height, 4)} (${fixed(100 * (o.model / o.measured - 1), 1)} %)`);
}
console.log(`\nvias: crowding coefficient in src ${VIA_CROWDING_FIT}, least squares ${fitViaCrowding(data.vias).toFixed(4)}`);
for (const v of viaComparisons(data.vias)) {
  console.log(
    `${v.name.padEnd(24)} ${v.use.padEnd(6)}h/d ${fixed(v.hOverD, 2).padStart(5)}  w/h ${fixed(v.wOverH, 2)}  measured ${fixed(v.measuredNh, 4)} nH  ` +
      `Goldfarb–Pucel ${fixed(v.goldfarbPucelNh, 4)} nH (${fixed(100 * (v.goldfarbPucelNh / v.measuredNh - 1), 1)} %)  design model ${fixed(v.designNh, 4)} nH (${fixed(100 * (v.designNh / v.measuredNh - 1), 1)} %)`,
  );
}
const bendFit = fitBendLength(data.bends);
console.log(`\nmitred bends: Δl = a·w + b·h in src a ${BEND_LENGTH_FIT.perWidth}, b ${BEND_LENGTH_FIT.perHeight}; least squares a ${bendFit.perWidth.toFixed(4)}, b ${bendFit.perHeight.toFixed(4)}`);
for (const b of bendComparisons(data.bends)) {
  console.log(`${b.name.padEnd(26)} w/h ${fixed(b.aspect, 3)}  Δl/w measured ${fixed(b.measured / b.width, 4)}  model ${fixed(b.model / b.width, 4)} (${fixed((b.model - b.measured) / b.width, 4)} w)`);
}
