// design.json: the machine-readable record of a design. The key names are a published contract
// (README, "design.json"); add keys, never rename them.
import type { Diagnostic } from '../diagnostics.js';
import type { Artifact, BoardGeometry, IdealSolution, PhysicalDesign, ResponseSet, Spec } from '../seams.js';

export interface DesignRecordInput {
  readonly spec: Spec;
  readonly ideal: IdealSolution;
  readonly physical: PhysicalDesign;
  readonly response: ResponseSet;
  readonly geometry: BoardGeometry;
  readonly diagnostics: readonly Diagnostic[];
  readonly fit: { readonly fits: boolean; readonly margin: number; readonly limitedBy: string; readonly changed: readonly string[] };
  /** How the chosen stub is drawn: straight or folded (e.g. 'L-source'). */
  readonly fold: string;
  readonly version: string;
}

const ROLE_NAMES = { series: 'series', stub: 'stub', 'lead-source': 'lead', 'lead-load': 'lead' } as const;

export function designRecord(input: DesignRecordInput): unknown {
  const { spec, ideal, physical, response, geometry } = input;
  const s = physical.solution;
  return {
    tool: { name: 'tunestrip', version: input.version },
    name: spec.name,
    frequency_hz: spec.frequency,
    load_ohm: [spec.load.re, spec.load.im],
    target_ohm: [spec.target.re, spec.target.im],
    line_z0_ohm: spec.lineZ0,
    stub_z0_ohm: spec.stubZ0,
    substrate: {
      er: spec.substrate.er,
      height_m: spec.substrate.height,
      copper_m: spec.substrate.copper,
      tan_delta: spec.substrate.tanDelta,
      roughness_m: spec.substrate.roughness,
      conductivity_s_per_m: spec.substrate.conductivity,
      ...(spec.substrate.preset ? { preset: spec.substrate.preset } : {}),
    },
    already_matched: ideal.alreadyMatched,
    solution: {
      position_wl: s.positionWl,
      stub_wl: s.stubWl,
      termination: s.termination,
      style: s.style,
      branch: s.branch,
      residual_gamma: s.residualGamma,
    },
    branches: ideal.solutions.map((b) => ({
      position_wl: b.positionWl,
      stub_wl: b.stubWl,
      termination: b.termination,
      style: b.style,
      branch: b.branch,
      residual_gamma: b.residualGamma,
    })),
    target_at_junction_ohm: [physical.targetAtJunction.re, physical.targetAtJunction.im],
    lines: physical.sections.map((sec) => ({
      role: ROLE_NAMES[sec.role],
      width_m: sec.width,
      length_m: sec.length,
      z0_ohm: sec.z0,
      eps_eff: sec.epsEff,
      wavelength_m: sec.wavelength,
      electrical_wl: sec.electricalWl,
      ideal_length_m: sec.idealLength,
      corrections: sec.corrections.map((c) => ({ model: c.model, delta_m: c.delta })),
    })),
    ports: geometry.ports.map((p) => ({ role: p.role, x_m: p.x, y_m: p.y, direction_deg: p.directionDeg, width_m: p.width })),
    vias: geometry.vias.map((v) => ({ x_m: v.x, y_m: v.y, drill_m: v.drill, pad_m: v.pad })),
    footprint_m: { xmin: geometry.bounds.xmin, ymin: geometry.bounds.ymin, xmax: geometry.bounds.xmax, ymax: geometry.bounds.ymax },
    predicted: {
      s11_db_at_f0: physical.s11DbAtF0,
      band_10db_hz: response.band10dB ? [response.band10dB.low, response.band10dB.high] : null,
      zero_thickness_sheet: response.sheetEquivalent
        ? { f_min_hz: response.sheetEquivalent.minimumFrequency, offset_percent: response.sheetEquivalent.offset * 100 }
        : null,
    },
    tolerance: response.tolerance
      ? {
          runs: response.tolerance.runs,
          seed: response.tolerance.seed,
          s11_db_at_f0: response.tolerance.s11DbAtF0,
          minimum_frequency_hz: response.tolerance.minimumFrequency,
          yield_10db: response.tolerance.yield10dB,
          envelope_p95_db: { frequencies_hz: response.tolerance.frequencies, s11_db: response.tolerance.envelopeP95Db },
        }
      : null,
    layout: {
      fold: input.fold,
      ...(physical.copper.bends ? { bends: { count: physical.copper.bends.count, length_each_m: physical.copper.bends.lengthEach } } : {}),
      stub_sides: physical.stubSides,
      placement: { x_m: spec.place.x, y_m: spec.place.y, rotation_deg: spec.place.rotationDeg, mirror: spec.place.mirror },
    },
    fit: {
      fits: input.fit.fits,
      margin_m: Number.isFinite(input.fit.margin) ? input.fit.margin : null,
      limited_by: input.fit.limitedBy,
      changed: input.fit.changed,
    },
    drc: input.diagnostics.filter((d) => d.code.startsWith('fab.')).map((d) => ({ code: d.code, where: d.where, message: d.message })),
    diagnostics: input.diagnostics.map((d) => ({ code: d.code, severity: d.severity, where: d.where, message: d.message })),
    defaulted: spec.defaulted,
  };
}

export function writeDesignJson(input: DesignRecordInput): Artifact {
  return { path: 'design.json', mediaType: 'application/json', text: `${JSON.stringify(designRecord(input), null, 2)}\n` };
}
