// The one table of spec-file keys: file name (snake_case), Spec name (camelCase), type, default and
// a line of documentation. The zod schema, the unknown-key check, the defaults and listFields() are
// all read from here, so the docs cannot drift from the parser.
import type { Dimension } from '../units.js';

/** Allowed interval for a number; a missing end is unbounded. */
export interface Bounds {
  readonly min?: number;
  readonly minExclusive?: boolean;
  readonly max?: number;
  readonly maxExclusive?: boolean;
}

export type FieldType =
  | { readonly kind: 'name' }
  | { readonly kind: 'preset'; readonly family: 'substrates' | 'fab' }
  | { readonly kind: 'note' }
  | { readonly kind: 'quantity'; readonly dimension: Dimension; readonly bounds: Bounds }
  | { readonly kind: 'impedance' }
  | { readonly kind: 'enum'; readonly values: readonly string[] }
  | { readonly kind: 'integer'; readonly min: number; readonly max: number }
  | { readonly kind: 'boolean' }
  | { readonly kind: 'region' }
  | { readonly kind: 'regions' }
  | { readonly kind: 'group'; readonly fields: readonly Field[] };

/**
 * required: must be in the file (or, inside substrate, in its preset);
 * default: `defaultText` is parsed like a value from the file when the key is absent;
 * derived: the default is computed from other fields (described by `defaultText`);
 * optional: absent means absent.
 */
export type Presence = 'required' | 'default' | 'derived' | 'optional';

export interface Field {
  readonly key: string;
  readonly prop: string;
  readonly type: FieldType;
  readonly presence: Presence;
  readonly defaultText?: string;
  readonly doc: string;
}

const POSITIVE: Bounds = { min: 0, minExclusive: true };
const NON_NEGATIVE: Bounds = { min: 0 };

const length = (bounds: Bounds): FieldType => ({ kind: 'quantity', dimension: 'length', bounds });
const frequency: FieldType = { kind: 'quantity', dimension: 'frequency', bounds: POSITIVE };
const z0: FieldType = { kind: 'quantity', dimension: 'impedance', bounds: POSITIVE };

/** Substrate keys shared by the spec's `substrate:` block and the substrate preset files. */
export const SUBSTRATE_FIELDS: readonly Field[] = [
  { key: 'er', prop: 'er', type: { kind: 'quantity', dimension: 'dimensionless', bounds: { min: 1 } }, presence: 'required', doc: 'relative permittivity εr of the dielectric (≥ 1)' },
  { key: 'height', prop: 'height', type: length(POSITIVE), presence: 'required', doc: 'dielectric height h between strip and ground' },
  { key: 'copper', prop: 'copper', type: length(NON_NEGATIVE), presence: 'default', defaultText: '35 um', doc: 'strip thickness t; 0 selects the zero-thickness model; "1 oz" reads as 34.8 µm' },
  { key: 'tan_delta', prop: 'tanDelta', type: { kind: 'quantity', dimension: 'dimensionless', bounds: { min: 0, max: 1, maxExclusive: true } }, presence: 'default', defaultText: '0', doc: 'dielectric loss tangent tanδ, in [0, 1)' },
  { key: 'roughness', prop: 'roughness', type: length(NON_NEGATIVE), presence: 'default', defaultText: '0 m', doc: 'RMS surface roughness of the copper' },
  { key: 'conductivity', prop: 'conductivity', type: { kind: 'quantity', dimension: 'conductivity', bounds: POSITIVE }, presence: 'default', defaultText: '5.8e7 S/m', doc: 'conductor conductivity σ (annealed copper ≈ 5.8e7 S/m)' },
];

const SUBSTRATE_PRESET_FIELD: Field = { key: 'preset', prop: 'preset', type: { kind: 'preset', family: 'substrates' }, presence: 'optional', doc: 'name of a file in templates/substrates/ (without .yaml); keys given beside it override it' };
const NOTE_FIELD: Field = { key: 'note', prop: 'note', type: { kind: 'note' }, presence: 'optional', doc: 'free text, ignored' };

/** Keys of a substrate preset file. */
export const SUBSTRATE_PRESET_FIELDS: readonly Field[] = [NOTE_FIELD, ...SUBSTRATE_FIELDS];

// Fabrication defaults: common practice, no source (physics.md §9.2 [M]), except the annular ring,
// which is the IPC-6012 class 3 external minimum of 0.05 mm (physics.md §9.1 [R]).
export const FAB_FIELDS: readonly Field[] = [
  { key: 'min_trace', prop: 'minTrace', type: length(POSITIVE), presence: 'default', defaultText: '0.15 mm', doc: 'narrowest copper line the fabricator etches' },
  { key: 'min_space', prop: 'minSpace', type: length(POSITIVE), presence: 'default', defaultText: '0.15 mm', doc: 'smallest gap between copper features' },
  { key: 'via_drill', prop: 'viaDrill', type: length(POSITIVE), presence: 'default', defaultText: '0.3 mm', doc: 'finished drill diameter of a ground via' },
  { key: 'via_pad', prop: 'viaPad', type: length(POSITIVE), presence: 'default', defaultText: '0.6 mm', doc: 'copper pad diameter around a via' },
  { key: 'min_annular_ring', prop: 'minAnnularRing', type: length(NON_NEGATIVE), presence: 'default', defaultText: '0.05 mm', doc: 'minimum ring of copper around a drilled hole (IPC-6012 class 3 external: 0.05 mm)' },
  { key: 'copper_to_edge', prop: 'copperToEdge', type: length(NON_NEGATIVE), presence: 'default', defaultText: '0.25 mm', doc: 'minimum distance from copper to the board edge' },
  { key: 'vias_per_stub', prop: 'viasPerStub', type: { kind: 'integer', min: 1, max: 8 }, presence: 'default', defaultText: '1', doc: 'ground vias at the end of a short-circuited stub (1–8)' },
];

const FAB_PRESET_FIELD: Field = { key: 'preset', prop: 'preset', type: { kind: 'preset', family: 'fab' }, presence: 'optional', doc: 'name of a file in templates/fab/ (without .yaml); keys given beside it override it' };

/** Keys of a fabrication preset file. */
export const FAB_PRESET_FIELDS: readonly Field[] = [NOTE_FIELD, ...FAB_FIELDS];

export const LEAD_FIELDS: readonly Field[] = [
  { key: 'load', prop: 'load', type: length(NON_NEGATIVE), presence: 'default', defaultText: '0 mm', doc: 'straight line between the load reference plane and the series line' },
  { key: 'source', prop: 'source', type: length(NON_NEGATIVE), presence: 'default', defaultText: '2 mm', doc: 'straight line from the stub junction to the source port' },
];

/** Where the section lands on the board: mirror about its own x axis first, then rotate, then move. */
export const PLACE_FIELDS: readonly Field[] = [
  { key: 'x', prop: 'x', type: length({}), presence: 'default', defaultText: '0 mm', doc: 'board x of the load reference plane centre' },
  { key: 'y', prop: 'y', type: length({}), presence: 'default', defaultText: '0 mm', doc: 'board y of the load reference plane centre' },
  { key: 'rotation_deg', prop: 'rotationDeg', type: { kind: 'quantity', dimension: 'dimensionless', bounds: {} }, presence: 'default', defaultText: '0', doc: 'counter-clockwise rotation of the whole section in degrees (any real angle)' },
  { key: 'mirror', prop: 'mirror', type: { kind: 'boolean' }, presence: 'default', defaultText: 'false', doc: 'mirror the section about its own x axis (the series line) before rotating' },
];

export const SWEEP_FIELDS: readonly Field[] = [
  { key: 'start', prop: 'start', type: frequency, presence: 'derived', defaultText: 'frequency − 20 %', doc: 'lowest sweep frequency, below frequency' },
  { key: 'stop', prop: 'stop', type: frequency, presence: 'derived', defaultText: 'frequency + 20 %', doc: 'highest sweep frequency, above frequency' },
  { key: 'points', prop: 'points', type: { kind: 'integer', min: 2, max: 10001 }, presence: 'default', defaultText: '201', doc: 'number of sweep frequencies (2–10001)' },
];

// Fabrication spread for the Monte-Carlo check, uniform within ± the value. Defaults are common
// practice for an RF-grade outer layer, no source (physics.md §9.3 [M]): etched width ±0.025 mm,
// εr ±2 %, dielectric height ±5 %, copper ±10 %.
export const TOLERANCE_FIELDS: readonly Field[] = [
  { key: 'width', prop: 'width', type: length(NON_NEGATIVE), presence: 'default', defaultText: '0.025 mm', doc: 'etched width spread, ± the same for every line (etch bias)' },
  { key: 'er_fraction', prop: 'erFraction', type: { kind: 'quantity', dimension: 'dimensionless', bounds: { min: 0, max: 0.5 } }, presence: 'default', defaultText: '0.02', doc: 'relative spread of εr (0.02 = ±2 %)' },
  { key: 'height_fraction', prop: 'heightFraction', type: { kind: 'quantity', dimension: 'dimensionless', bounds: { min: 0, max: 0.5 } }, presence: 'default', defaultText: '0.05', doc: 'relative spread of the dielectric height' },
  { key: 'copper_fraction', prop: 'copperFraction', type: { kind: 'quantity', dimension: 'dimensionless', bounds: { min: 0, max: 0.5 } }, presence: 'default', defaultText: '0.1', doc: 'relative spread of the copper thickness' },
  { key: 'runs', prop: 'runs', type: { kind: 'integer', min: 0, max: 10000 }, presence: 'default', defaultText: '200', doc: 'Monte-Carlo runs (0 turns the check off)' },
  { key: 'seed', prop: 'seed', type: { kind: 'integer', min: 0, max: 2147483647 }, presence: 'default', defaultText: '1', doc: 'seed of the run generator: the same seed gives the same figures' },
];

/** Keys of a spec file, in the order they are checked and documented. */
export const SPEC_FIELDS: readonly Field[] = [
  { key: 'name', prop: 'name', type: { kind: 'name' }, presence: 'required', doc: 'output folder name: letters, digits, . _ -, no leading dot, at most 64 characters' },
  { key: 'frequency', prop: 'frequency', type: frequency, presence: 'required', doc: 'design frequency f0' },
  { key: 'load', prop: 'load', type: { kind: 'impedance' }, presence: 'required', doc: 'load impedance in ohms, e.g. 22-j31' },
  { key: 'target', prop: 'target', type: { kind: 'impedance' }, presence: 'default', defaultText: '50', doc: 'impedance the match presents at the source port' },
  { key: 'line_z0', prop: 'lineZ0', type: z0, presence: 'default', defaultText: '50', doc: 'characteristic impedance of the series line and leads (Ω)' },
  { key: 'stub_z0', prop: 'stubZ0', type: z0, presence: 'derived', defaultText: 'line_z0', doc: 'characteristic impedance of the stub (Ω)' },
  { key: 'stub', prop: 'stub', type: { kind: 'enum', values: ['open', 'short', 'best'] }, presence: 'default', defaultText: 'best', doc: 'stub termination: open, short, or best (the shorter stub)' },
  { key: 'style', prop: 'style', type: { kind: 'enum', values: ['single', 'balanced'] }, presence: 'default', defaultText: 'single', doc: 'one stub, or two equal stubs on opposite sides' },
  { key: 'stub_side', prop: 'stubSide', type: { kind: 'enum', values: ['left', 'right'] }, presence: 'default', defaultText: 'left', doc: 'side of the series line a single stub points to, looking from the load' },
  { key: 'substrate', prop: 'substrate', type: { kind: 'group', fields: [SUBSTRATE_PRESET_FIELD, ...SUBSTRATE_FIELDS] }, presence: 'required', doc: 'dielectric and copper; a preset, explicit keys, or both' },
  { key: 'fab', prop: 'fab', type: { kind: 'group', fields: [FAB_PRESET_FIELD, ...FAB_FIELDS] }, presence: 'default', defaultText: '{}', doc: 'fabrication rules; a preset, explicit keys, or both' },
  { key: 'leads', prop: 'leads', type: { kind: 'group', fields: LEAD_FIELDS }, presence: 'default', defaultText: '{}', doc: 'straight lines at the two ports' },
  { key: 'place', prop: 'place', type: { kind: 'group', fields: PLACE_FIELDS }, presence: 'default', defaultText: '{}', doc: 'where the section lands on the board: { x, y, rotation_deg, mirror }; area and keep-outs are in board coordinates' },
  { key: 'area', prop: 'area', type: { kind: 'region' }, presence: 'optional', doc: 'where copper may go: { x: [min, max], y: [min, max] } or { polygon: [[x, y], …] }' },
  { key: 'keepouts', prop: 'keepouts', type: { kind: 'regions' }, presence: 'default', defaultText: '[]', doc: 'regions copper must avoid: rectangles, polygons or { center: [x, y], radius: r }' },
  { key: 'clearance', prop: 'clearance', type: length(NON_NEGATIVE), presence: 'default', defaultText: '0 mm', doc: 'extra distance kept from keep-outs and the area edge' },
  { key: 'sweep', prop: 'sweep', type: { kind: 'group', fields: SWEEP_FIELDS }, presence: 'default', defaultText: '{}', doc: 'frequency sweep used to verify the match' },
  { key: 'tolerance', prop: 'tolerance', type: { kind: 'group', fields: TOLERANCE_FIELDS }, presence: 'default', defaultText: '{}', doc: 'fabrication spread for the Monte-Carlo check of the match' },
];

/** Keys a region may have, by form. */
export const REGION_FORMS = {
  rect: ['x', 'y'],
  polygon: ['polygon'],
  circle: ['center', 'radius'],
} as const;
export const REGION_KEYS: readonly string[] = [...REGION_FORMS.rect, ...REGION_FORMS.polygon, ...REGION_FORMS.circle];

/** Human text for a field's type, for docs and messages. */
export function typeText(type: FieldType): string {
  switch (type.kind) {
    case 'name':
      return 'name';
    case 'preset':
      return `${type.family === 'fab' ? 'fab' : 'substrate'} preset name`;
    case 'note':
      return 'text';
    case 'quantity': {
      const b = type.bounds;
      const lo = b.min === undefined ? '' : `${b.minExclusive ? '>' : '≥'} ${b.min}`;
      const hi = b.max === undefined ? '' : `${b.maxExclusive ? '<' : '≤'} ${b.max}`;
      const range = [lo, hi].filter((s) => s !== '').join(', ');
      return range === '' ? type.dimension : `${type.dimension} ${range}`;
    }
    case 'impedance':
      return 'complex impedance';
    case 'enum':
      return type.values.join(' | ');
    case 'integer':
      return `integer ${type.min}–${type.max}`;
    case 'boolean':
      return 'true | false';
    case 'region':
      return 'region';
    case 'regions':
      return 'list of regions';
    case 'group':
      return 'mapping';
  }
}
