// How far each discontinuity model moves tunestrip's own predicted return-loss minimum for the copper
// as drawn: the physical network of a design folder evaluated with all models, and with the
// T-junction, open-end or via model switched off in turn. Read beside the full-wave offsets in
// results.json: an element whose model moves the minimum by much more than the full-wave error is
// doing its job. For a short stub it also prints where the minimum moves when the via inductance is
// scaled (a smaller drill in the Goldfarb–Pucel barrel term stands in for a larger L; the crowding
// term stays as it is), so a full-wave offset can be read as an equivalent via inductance. Diagnostic only (not part of tunestrip, not run by npm test).
//
//   npx tsx scripts/fullwave/model-sensitivity.ts OUT_DIR [OUT_DIR ...]
import { ALL_MODELS, type NetworkModels } from '../../src/analysis/physicalNetwork.js';
import type { MatchCopper, Substrate } from '../../src/seams.js';
import { copperOfRecord, modelMinimum, readDesignRecord, substrateOfRecord, type ModelMinimum } from './design-record.js';
import { viaInductanceGoldfarbPucel } from '../../src/physical/discontinuities/index.js';

const variants: Readonly<Record<string, NetworkModels>> = {
  all: ALL_MODELS,
  'no junction': { ...ALL_MODELS, junction: false },
  'no open end': { ...ALL_MODELS, openEnd: false },
  'no via': { ...ALL_MODELS, via: false },
};

for (const folder of process.argv.slice(2)) {
  const d = readDesignRecord(folder);
  const substrate: Substrate = substrateOfRecord(d);
  const copper: MatchCopper = copperOfRecord(d);
  const out: { [k: string]: ModelMinimum } = {};
  const minimum = (c: MatchCopper, models: NetworkModels): ModelMinimum => modelMinimum(d, models, c);
  for (const [label, models] of Object.entries(variants)) out[label] = minimum(copper, models);
  if (copper.vias) {
    const vias = copper.vias;
    const l0 = viaInductanceGoldfarbPucel(substrate.height, vias.drill);
    for (const ratio of [1.25, 1.5, 1.75, 2]) {
      // The drill whose Goldfarb–Pucel inductance is `ratio` × the drawn via's (bisection; L falls as the drill grows).
      let lo = vias.drill * 1e-3;
      let hi = vias.drill;
      for (let i = 0; i < 60; i++) {
        const mid = Math.sqrt(lo * hi);
        if (viaInductanceGoldfarbPucel(substrate.height, mid) > ratio * l0) lo = mid;
        else hi = mid;
      }
      out[`via L x${ratio}`] = minimum({ ...copper, vias: { ...vias, drill: hi } }, ALL_MODELS);
    }
  }
  console.log(JSON.stringify({ name: d.name, ...out }));
}
