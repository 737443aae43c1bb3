// The part of a design folder's design.json the full-wave diagnostics read (model-sensitivity.ts,
// tee-permittivity.ts), and where tunestrip's own network puts that copper's return-loss minimum.
// Not part of tunestrip.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { abs, complex } from '../../src/math/complex.js';
import { minimiseOnGrid } from '../../src/math/minimise.js';
import { mismatch, physicalInputImpedance, type NetworkModels } from '../../src/analysis/physicalNetwork.js';
import type { MatchCopper, Substrate } from '../../src/seams.js';

export interface Line { readonly role: string; readonly width_m: number; readonly length_m: number }
export interface DesignRecord {
  readonly name: string;
  readonly frequency_hz: number;
  readonly load_ohm: readonly [number, number];
  readonly target_ohm: readonly [number, number];
  readonly substrate: { readonly er: number; readonly height_m: number; readonly copper_m: number; readonly tan_delta: number; readonly roughness_m: number; readonly conductivity_s_per_m: number };
  readonly solution: { readonly termination: 'open' | 'short'; readonly style: string };
  readonly lines: readonly Line[];
  readonly vias: readonly { readonly x_m: number; readonly y_m: number; readonly drill_m: number; readonly pad_m: number }[];
  /** Present for a folded stub: its mitred bends (a straight stub has none). */
  readonly layout?: { readonly bends?: { readonly count: number; readonly length_each_m: number } };
}

export const readDesignRecord = (folder: string): DesignRecord => JSON.parse(readFileSync(join(folder, 'design.json'), 'utf8')) as DesignRecord;

export const lineOf = (d: DesignRecord, role: string): Line => d.lines.find((l) => l.role === role)!;

export const substrateOfRecord = (d: DesignRecord): Substrate => ({
  er: d.substrate.er,
  height: d.substrate.height_m,
  copper: d.substrate.copper_m,
  tanDelta: d.substrate.tan_delta,
  roughness: d.substrate.roughness_m,
  conductivity: d.substrate.conductivity_s_per_m,
});

/** The design's stackup with the copper as simulate.py draws it: a lossless zero-thickness PEC sheet. */
export const sheetOfRecord = (d: DesignRecord): Substrate => ({ ...substrateOfRecord(d), copper: 0, conductivity: 1e15, roughness: 0, tanDelta: 0 });

/** Centre-to-centre distance of the first stub's first two vias (0 for one via per stub). */
function viaRowPitch(d: DesignRecord): number {
  const perStub = d.vias.length / (d.solution.style === 'balanced' ? 2 : 1);
  const [a, b] = d.vias;
  return perStub > 1 && a && b ? Math.hypot(b.x_m - a.x_m, b.y_m - a.y_m) : 0;
}

/** The copper of the design as tunestrip's physical network takes it. */
export function copperOfRecord(d: DesignRecord): MatchCopper {
  const line = (role: string): Line => lineOf(d, role);
  const stubCount = d.solution.style === 'balanced' ? 2 : 1;
  return {
    seriesWidth: line('series').width_m,
    stubWidth: line('stub').width_m,
    seriesLength: line('series').length_m,
    stubLength: line('stub').length_m,
    leadLength: line('lead').length_m,
    termination: d.solution.termination,
    stubCount,
    // A folded stub is drawn longer by what its bends take; without them the network sees it too long.
    ...(d.layout?.bends && d.layout.bends.count > 0 ? { bends: { count: d.layout.bends.count, lengthEach: d.layout.bends.length_each_m } } : {}),
    ...(d.solution.termination === 'short' && d.vias[0] ? { vias: { drill: d.vias[0].drill_m, pad: d.vias[0].pad_m, count: d.vias.length / stubCount, pitch: viaRowPitch(d) } } : {}),
  };
}

export interface ModelMinimum { readonly f_min_hz: number; readonly offset_percent: number; readonly s11_db_at_f0: number }

/**
 * The return-loss minimum of `copper` (default: the design's own) on `substrate` (default: the
 * design's stackup) in tunestrip's physical network with `models`, against the design's target: a grid over 0.7–1.3 f0 in steps of 0.01 % of f0, refined to 1e-7 f0.
 */
export function modelMinimum(d: DesignRecord, models: NetworkModels, copper: MatchCopper = copperOfRecord(d), substrate: Substrate = substrateOfRecord(d)): ModelMinimum {
  const f0 = d.frequency_hz;
  const load = complex(d.load_ohm[0], d.load_ohm[1]);
  const target = complex(d.target_ohm[0], d.target_ohm[1]);
  const gammaAt = (f: number): number => abs(mismatch(physicalInputImpedance(copper, load, substrate, f, models), target));
  const fMin = minimiseOnGrid(gammaAt, 0.7 * f0, 1.3 * f0, 6001, 1e-7 * f0);
  return { f_min_hz: fMin, offset_percent: (100 * (fMin - f0)) / f0, s11_db_at_f0: 20 * Math.log10(gammaAt(f0)) };
}
