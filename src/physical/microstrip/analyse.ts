// Microstrip line analysis: for a width, a substrate and a frequency, Z0, εe, γ.
// Stages: Hammerstad–Jensen 1980 static model with thickness correction → Kirschning–Jansen 1982
// εe(f) → Jansen–Kirschning 1983 Z0(f) → Hammerstad–Bekkadal conductor loss and filling-factor
// dielectric loss. Leaving a model's validity range yields a 'model.out-of-range' warning; nothing is
// clamped.
//
// Choice of u for the dispersion models when t > 0: KJ 1982 and JK 1983 are fed the PHYSICAL
// u = w/h. Those fits are for zero-thickness strips; the thickness enters through εe0 and Z00, which
// already come from the thickness-corrected static model, so feeding w_eff/h as well would count the
// thickness twice. (scikit-rf's default feeds w_eff/h; its compatibility mode feeds w/h. The two differ
// by ≈ 0.02 % in εe(f) for 35 µm copper on 1.6 mm at 2.4 GHz.) This is the convention of the end-to-end
// check values in physics.md §5.
//
// Losses are quasi-static approximations and are evaluated with the quasi-static quantities: αc with
// the static Z0 and the physical width w, αd with the static εe — the convention of the x-checked loss
// values in physics.md §3.3.
import type { LineProperties, Substrate } from '../../seams.js';
import { complex, type Complex } from '../../math/complex.js';
import { diagnostic, fail, type Diagnostic } from '../../diagnostics.js';
import { C0 } from './constants.js';
import { staticHJ } from './hammerstadJensen1980.js';
import { epsEffKJ } from './kirschningJansen1982.js';
import { z0JK } from './jansenKirschning1983.js';
import { conductorLossHB, dielectricLossFillingFactor, skinDepth } from './loss.js';

/** fn = f[GHz]·h[mm] for f in Hz and h in m. */
export const normalisedFrequency = (frequency: number, height: number): number => frequency * height * 1e-6;

/** fn at h/λ0 = 0.13, the dispersion models' upper limit (≈ 38.97 GHz·mm). */
export const FN_MAX = 0.13 * C0 * 1e-6;

/** Relative step below which εr counts as 1 for the filling factor (0/0 there). */
const ER_ONE = 1e-6;

function validate(width: number, substrate: Substrate, frequency: number): void {
  const positive = (x: number): boolean => Number.isFinite(x) && x > 0;
  if (!positive(width)) fail('spec.invalid', 'microstrip.width', `width must be a positive length, got ${width}`);
  if (!positive(substrate.height)) fail('spec.invalid', 'substrate.height', `height must be positive, got ${substrate.height}`);
  if (!positive(frequency)) fail('spec.invalid', 'frequency', `frequency must be positive, got ${frequency}`);
  if (!(Number.isFinite(substrate.er) && substrate.er >= 1)) fail('spec.invalid', 'substrate.er', `εr must be ≥ 1, got ${substrate.er}`);
  if (!(Number.isFinite(substrate.copper) && substrate.copper >= 0)) fail('spec.invalid', 'substrate.copper', `copper thickness must be ≥ 0, got ${substrate.copper}`);
  if (!positive(substrate.conductivity)) fail('spec.invalid', 'substrate.conductivity', `conductivity must be positive, got ${substrate.conductivity}`);
  if (!(Number.isFinite(substrate.roughness) && substrate.roughness >= 0)) fail('spec.invalid', 'substrate.roughness', `roughness must be ≥ 0, got ${substrate.roughness}`);
  if (!(Number.isFinite(substrate.tanDelta) && substrate.tanDelta >= 0)) fail('spec.invalid', 'substrate.tanDelta', `tanδ must be ≥ 0, got ${substrate.tanDelta}`);
}

/** Validity ranges from physics.md §1–3 (the ranges themselves are mostly [M] there). */
function validityWarnings(u: number, substrate: Substrate, fn: number): Diagnostic[] {
  const out: Diagnostic[] = [];
  const { er, copper: t, height: h } = substrate;
  const fmt = (x: number): string => x.toPrecision(4);
  // Hammerstad–Jensen 1980: εe within 0.2 % for 0.01 ≤ u ≤ 100, εr ≤ 128.
  if (u < 0.01 || u > 100) out.push(diagnostic('model.out-of-range', 'microstrip.width', `w/h = ${fmt(u)} is outside 0.01–100 (Hammerstad–Jensen 1980)`));
  if (er > 128) out.push(diagnostic('model.out-of-range', 'substrate.er', `εr = ${fmt(er)} is above 128 (Hammerstad–Jensen 1980)`));
  // HJ 1980 thickness correction: thin strips, t ≪ h (taken here as t ≤ h/10) and t < w.
  if (t > 0 && (t >= u * h || t > h / 10)) out.push(diagnostic('model.out-of-range', 'substrate.copper', `t = ${fmt(t * 1e6)} µm is not thin against w and h (Hammerstad–Jensen 1980 thickness correction wants t < w, t ≪ h)`));
  // Kirschning–Jansen 1982: 0.1 ≤ u ≤ 100, 1 ≤ εr ≤ 20, h/λ0 ≤ 0.13.
  if (u < 0.1 || u > 100) out.push(diagnostic('model.out-of-range', 'microstrip.width', `w/h = ${fmt(u)} is outside 0.1–100 (Kirschning–Jansen 1982 εe(f))`));
  if (er > 20) out.push(diagnostic('model.out-of-range', 'substrate.er', `εr = ${fmt(er)} is above 20 (Kirschning–Jansen 1982 εe(f))`));
  if (fn > FN_MAX) out.push(diagnostic('model.out-of-range', 'frequency', `f·h = ${fmt(fn)} GHz·mm is above ${fmt(FN_MAX)} (h/λ0 > 0.13; Kirschning–Jansen 1982, Jansen–Kirschning 1983)`));
  // Jansen–Kirschning 1983: 0.1 ≤ u ≤ 10, εr ≤ 18.
  if (u < 0.1 || u > 10) out.push(diagnostic('model.out-of-range', 'microstrip.width', `w/h = ${fmt(u)} is outside 0.1–10 (Jansen–Kirschning 1983 Z0(f))`));
  if (er > 18) out.push(diagnostic('model.out-of-range', 'substrate.er', `εr = ${fmt(er)} is above 18 (Jansen–Kirschning 1983 Z0(f))`));
  return out;
}

/** Filling factor q = (εe − 1)/(εr − 1); at εr → 1 its limit, from the static model a step above 1. */
function fillingFactor(u: number, tn: number, er: number, epsEff0: number): number {
  if (er - 1 >= ER_ONE) return (epsEff0 - 1) / (er - 1);
  const near = staticHJ(u, tn, 1 + ER_ONE);
  return (near.epsEff - 1) / ER_ONE;
}

export function analyseMicrostrip(width: number, substrate: Substrate, frequency: number): LineProperties {
  validate(width, substrate, frequency);
  const { er, height: h, copper: t } = substrate;
  const u = width / h;
  const fn = normalisedFrequency(frequency, h);
  const stat = staticHJ(u, t / h, er);
  const epsEff = epsEffKJ(u, er, stat.epsEff, fn);
  const z0 = z0JK(u, er, stat.epsEff, epsEff, stat.z0, fn);
  const alphaConductor = conductorLossHB(stat.z0, width, frequency, substrate.conductivity, substrate.roughness);
  const q = fillingFactor(u, t / h, er, stat.epsEff);
  const alphaDielectric = dielectricLossFillingFactor(er, stat.epsEff, q, substrate.tanDelta, frequency);
  const warnings = validityWarnings(u, substrate, fn);
  const skin = skinDepth(frequency, substrate.conductivity);
  if (t > 0 && t < 3 * skin) {
    warnings.push(diagnostic('model.thin-conductor', 'substrate.copper', `t = ${(t * 1e6).toPrecision(3)} µm is below 3 skin depths (${(3 * skin * 1e6).toPrecision(3)} µm) at ${(frequency / 1e9).toPrecision(4)} GHz`));
  }
  const sqrtEps = Math.sqrt(epsEff);
  return {
    width,
    frequency,
    z0,
    z0Static: stat.z0,
    epsEff,
    epsEffStatic: stat.epsEff,
    wavelength: C0 / (frequency * sqrtEps),
    alphaConductor,
    alphaDielectric,
    beta: (2 * Math.PI * frequency * sqrtEps) / C0,
    warnings,
  };
}

/** γ = α + jβ with α = αc + αd (Np/m) and β (rad/m). */
export function propagationConstant(line: LineProperties): Complex {
  return complex(line.alphaConductor + line.alphaDielectric, line.beta);
}
