// The spec stage's public face: text in, Spec out; presets and the field table for docs.
export { parseSpec, parseSubstratePreset, parseFabPreset, listFields, type Presets, type ParsedSpec } from './parse.js';
export { SPEC_FIELDS, SUBSTRATE_FIELDS, FAB_FIELDS, type Field, type FieldType } from './fields.js';
export { MAX_SPEC_BYTES } from './document.js';
