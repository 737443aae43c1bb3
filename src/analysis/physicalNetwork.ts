// The physical network of a single-stub match at one frequency: load → series line → T-junction
// (reference planes, transformer ratios, junction susceptance) with one or two stubs (open end or
// via) → source lead → source port, as an ABCD cascade. Lines are dispersive and lossy; every model is re-evaluated at
// the frequency asked, so a sweep is this function over a grid.
import { add, complex, div, inv, scale, type Complex } from '../math/complex.js';
import { cascade, inputImpedanceOf, lineAbcd, shuntAdmittanceAbcd, transformerAbcd, type Abcd } from '../math/network.js';
import type { MatchCopper, Substrate } from '../seams.js';
import { analyseMicrostrip, propagationConstant } from '../physical/microstrip/index.js';
import { CROSS_FIT, TEE_FIT, fittedJunction, openEndExtensionDesign, tJunctionHammerstad, viaInductanceDesign, viaResistance, type JunctionFit, type TJunction } from '../physical/discontinuities/index.js';
import { inputImpedance, openStubAdmittance, shortStubAdmittance } from '../math/lines.js';

/** Which discontinuity models take part; all on for the physical design, all off gives plain lines. */
export interface NetworkModels {
  readonly junction: boolean;
  readonly openEnd: boolean;
  readonly via: boolean;
  readonly loss: boolean;
  /** The mitred bends of a folded stub as a length offset (copper.bends). */
  readonly bend: boolean;
  /** A junction correction to weigh instead of TEE_FIT / CROSS_FIT (diagnostics; the design never sets it). */
  readonly junctionFit?: JunctionFit;
}

export const ALL_MODELS: NetworkModels = { junction: true, openEnd: true, via: true, loss: true, bend: true };

/** Plating thickness assumed in the via barrel for its resistance (common practice, no source: 25 µm). */
const VIA_PLATING = 25e-6;

/** The junction's reference planes, transformer ratios and susceptance, as the network uses them. */
export type JunctionView = Omit<TJunction, 'warnings'>;

export function junctionAt(copper: MatchCopper, substrate: Substrate, frequency: number, fit?: JunctionFit): JunctionView {
  const main = analyseMicrostrip(copper.seriesWidth, substrate, frequency);
  const stub = analyseMicrostrip(copper.stubWidth, substrate, frequency);
  const tee = tJunctionHammerstad(main, main, stub, substrate, frequency);
  // Balanced stubs meet the line in a cross, which is not two tees; each has its own fitted correction.
  const j = fittedJunction(tee, main, stub, substrate, fit ?? (copper.stubCount === 2 ? CROSS_FIT : TEE_FIT));
  return { da: j.da, db: j.db, d2: j.d2, n2a: j.n2a, n2b: j.n2b, susceptance: j.susceptance };
}

/**
 * The physical match as a two-port from the source port (1) to the load plane (2), as an ABCD
 * cascade: source lead → transformer n_b → junction shunt (stubs and B_T) → transformer n_a →
 * series line. Transformer ratios follow physics.md §4.2: the admittance seen at an arm's
 * reference plane is n² times the admittance at the junction node.
 */
export function physicalAbcd(copper: MatchCopper, substrate: Substrate, frequency: number, models: NetworkModels = ALL_MODELS): Abcd {
  const main = analyseMicrostrip(copper.seriesWidth, substrate, frequency);
  const stubLine = analyseMicrostrip(copper.stubWidth, substrate, frequency);
  const gammaMain = lossless(propagationConstant(main), models.loss);
  const gammaStub = lossless(propagationConstant(stubLine), models.loss);
  if (copper.stubCount === 0) return lineAbcd(main.z0, gammaMain, copper.seriesLength + copper.leadLength);
  const j: JunctionView = models.junction
    ? junctionAt(copper, substrate, frequency, models.junctionFit)
    : { da: 0, db: 0, d2: copper.seriesWidth / 2, n2a: 1, n2b: 1, susceptance: 0 };
  // Stub: from the junction plane (d2 from the main-line centre) to its end, its centre-line
  // length through any bends corrected by each bend's own electrical length.
  const bends = models.bend && copper.bends ? copper.bends.count * copper.bends.lengthEach : 0;
  const stubFromPlane = copper.stubLength + copper.seriesWidth / 2 - j.d2 + bends;
  const yStub = stubAdmittance(copper, stubLine.z0, gammaStub, stubFromPlane, stubLine, substrate, frequency, models);
  const yShunt = add(scale(yStub, copper.stubCount), complex(0, j.susceptance));
  return cascade(
    lineAbcd(main.z0, gammaMain, copper.leadLength - j.db),
    transformerAbcd(1 / Math.sqrt(j.n2b)),
    shuntAdmittanceAbcd(yShunt),
    transformerAbcd(Math.sqrt(j.n2a)),
    lineAbcd(main.z0, gammaMain, copper.seriesLength - j.da),
  );
}

/** Input impedance at the source port of the physical network at `frequency`, terminated in `load`. */
export function physicalInputImpedance(
  copper: MatchCopper,
  load: Complex,
  substrate: Substrate,
  frequency: number,
  models: NetworkModels = ALL_MODELS,
): Complex {
  return inputImpedanceOf(physicalAbcd(copper, substrate, frequency, models), load);
}

function stubAdmittance(
  copper: MatchCopper,
  z0: number,
  gamma: Complex,
  length: number,
  line: ReturnType<typeof analyseMicrostrip>,
  substrate: Substrate,
  frequency: number,
  models: NetworkModels,
): Complex {
  if (copper.termination === 'open') {
    // The fringing field of the open end acts as a line extension Δl (Kirschning–Jansen–Koster 1981,
    // scaled to this project's full-wave extractions of open ends).
    const extension = models.openEnd ? openEndExtensionDesign(line, substrate) : 0;
    return openStubAdmittance(z0, gamma, length + extension);
  }
  if (!(models.via && copper.vias)) return shortStubAdmittance(z0, gamma, length);
  return inv(inputImpedance(viaImpedance(copper.vias, copper.stubWidth, substrate, frequency), z0, gamma, length));
}

/** Impedance of a stub's end on a row of `count` vias (Goldfarb–Pucel 1991 with the fitted strip-to-pad crowding and, for a row, the fitted mutual inductance). */
export function viaImpedance(
  vias: NonNullable<MatchCopper['vias']>,
  stubWidth: number,
  substrate: Substrate,
  frequency: number,
): Complex {
  const l = viaInductanceDesign(substrate.height, vias.drill, vias.pad, stubWidth, vias.count, vias.pitch);
  const r = viaResistance(substrate.height, vias.drill, VIA_PLATING, substrate.conductivity, frequency) / vias.count;
  return complex(r, 2 * Math.PI * frequency * l);
}

const lossless = (gamma: Complex, withLoss: boolean): Complex => (withLoss ? gamma : complex(0, gamma.im));

/** Power-wave reflection against the target the source wants to see: (Z − Zt)/(Z + Zt*). */
export function mismatch(zin: Complex, target: Complex): Complex {
  return div(add(zin, scale(target, -1)), add(zin, complex(target.re, -target.im)));
}

