// Where tunestrip's own lossless network puts the return-loss minimum of a design folder's copper drawn
// as a zero-thickness sheet (as simulate.py draws it), with TEE_FIT and, for comparison, with a tee
// correction fitted to the named tees of junctions.json alone, and with both line widths scaled (a
// narrower strip stands in for a higher line impedance). Splits a full-wave offset into parts
// (ninth round, README). Diagnostic only; not part of tunestrip, not run by npm test.
//
//   npx tsx scripts/fullwave/sheet-model-minimum.ts OUT_DIR [--tee NAME ...] [--width-scale 0.99 ...]
import { ALL_MODELS, physicalInputImpedance, type NetworkModels } from '../../src/analysis/physicalNetwork.js';
import { TEE_FIT } from '../../src/physical/discontinuities/index.js';
import { analyseMicrostrip } from '../../src/physical/microstrip/index.js';
import { complex } from '../../src/math/complex.js';
import type { MatchCopper } from '../../src/seams.js';
import { copperOfRecord, modelMinimum, readDesignRecord, sheetOfRecord } from './design-record.js';
import { fitJunction, junctionPoints, readJunctions } from './junction-fit.js';

const args = process.argv.slice(2);
const folder = args[0];
const valuesOf = (flag: string): string[] => args.flatMap((a, i) => (a === flag && args[i + 1] !== undefined ? [args[i + 1]!] : []));
if (!folder || folder.startsWith('--')) throw new Error('usage: sheet-model-minimum.ts OUT_DIR [--tee NAME ...] [--width-scale S ...]');
const d = readDesignRecord(folder);
const sheet = sheetOfRecord(d);
const load = complex(d.load_ohm[0], d.load_ohm[1]);
const f0 = d.frequency_hz;

function report(label: string, copper: MatchCopper, models: NetworkModels): void {
  const { offset_percent: offset } = modelMinimum(d, models, copper, sheet);
  const z = physicalInputImpedance(copper, load, sheet, f0, models);
  const line = analyseMicrostrip(copper.seriesWidth, sheet, f0);
  console.log(`${label.padEnd(44)} minimum ${offset.toFixed(2).padStart(6)} %   Zin(f0) ${z.re.toFixed(2)}${z.im < 0 ? '-' : '+'}j${Math.abs(z.im).toFixed(2)} Ω   line ${line.z0.toFixed(2)} Ω`);
}

const copper = copperOfRecord(d);
report('sheet, TEE_FIT', copper, ALL_MODELS);
const tees = valuesOf('--tee');
if (tees.length > 0) {
  const data = readJunctions();
  const chosen = data.tees.filter((t) => tees.includes(t.name));
  if (chosen.length !== tees.length) throw new Error(`unknown tee; known: ${data.tees.map((t) => t.name).join(', ')}`);
  // TEE_FIT's four coefficients refitted to these tees only (their εr terms then have nothing to act on).
  const { fit, rms } = fitJunction(junctionPoints(chosen), { planeA: TEE_FIT.planeA, stubPlaneD2: TEE_FIT.stubPlaneD2, n2Deficit: TEE_FIT.n2Deficit, susceptance: TEE_FIT.susceptance });
  console.log(`tee fit to ${tees.join(', ')}: ${JSON.stringify(Object.fromEntries(Object.entries(fit).map(([k, v]) => [k, Number(v.toFixed(4))])))}, S rms ${rms.toFixed(5)}`);
  report('sheet, tee fitted to those tees', copper, { ...ALL_MODELS, junctionFit: fit });
}
for (const scale of valuesOf('--width-scale').map(Number)) {
  report(`sheet, TEE_FIT, widths x ${scale}`, { ...copper, seriesWidth: copper.seriesWidth * scale, stubWidth: copper.stubWidth * scale }, ALL_MODELS);
}
