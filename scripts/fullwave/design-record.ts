// The part of a design folder's design.json the full-wave diagnostics read (model-sensitivity.ts,
// tee-permittivity.ts). Not part of tunestrip.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
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
  readonly vias: readonly { readonly drill_m: number; readonly pad_m: number }[];
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
    ...(d.solution.termination === 'short' && d.vias[0] ? { vias: { drill: d.vias[0].drill_m, pad: d.vias[0].pad_m, count: d.vias.length / stubCount } } : {}),
  };
}
