// tunestrip's lossless 2-port Z of a design folder's copper drawn as a zero-thickness sheet, at one
// frequency, optionally with one discontinuity model off (eighth round, README). Z11 is Zin with the
// load port open, Zin(short) = Z11 − Z12²/Z22, and Zin(50 Ω) gives Z22. Diagnostic only.
//
//   npx tsx scripts/fullwave/model-two-port.ts OUT_DIR F_HZ [junction|openEnd|via]
import { ALL_MODELS, physicalInputImpedance, type NetworkModels } from '../../src/analysis/physicalNetwork.js';
import { complex, div, mul, sqrt, sub, type Complex } from '../../src/math/complex.js';
import { copperOfRecord, readDesignRecord, sheetOfRecord } from './design-record.js';

const [folder, frequencyText, without] = process.argv.slice(2);
if (!folder || !frequencyText) throw new Error('usage: model-two-port.ts OUT_DIR F_HZ [junction|openEnd|via]');
const d = readDesignRecord(folder);
const f = Number(frequencyText);
const sheet = sheetOfRecord(d);
const isModel = (name: string): name is keyof NetworkModels => Object.keys(ALL_MODELS).includes(name);
if (without !== undefined && !isModel(without)) throw new Error(`unknown model '${without}': one of ${Object.keys(ALL_MODELS).join(', ')}`);
const models: NetworkModels = without ? { ...ALL_MODELS, [without]: false } : ALL_MODELS;
const zin = (load: Complex): Complex => physicalInputImpedance(copperOfRecord(d), load, sheet, f, models);

const text = (z: Complex): string => `${z.re.toFixed(2)}${z.im >= 0 ? '+' : '-'}${Math.abs(z.im).toFixed(2)}j`;

const z11 = zin(complex(1e12, 0));
const zShort = zin(complex(0, 0));
const z50 = zin(complex(50, 0));
// (Z11 − Zin(R))(Z22 + R) = Z12² = (Z11 − Zin(0))·Z22  ⇒  Z22 = R·(Z11 − Zin(R)) / (Zin(R) − Zin(0))
const z22 = div(mul(complex(50, 0), sub(z11, z50)), sub(z50, zShort));
const z12Squared = mul(sub(z11, zShort), z22);
const z12 = sqrt(z12Squared);
console.log(`model${without ? ` without ${without}` : ''} at ${f / 1e9} GHz: Z11=${text(z11)} Z12=±(${text(z12)}) Z22=${text(z22)}`);
