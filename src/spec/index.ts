// The spec stage: parse and validate a spec file's text into a Spec.
export { parseSpec, parseSubstratePreset, parseFabPreset, listFields, type Presets, type ParsedSpec } from './parse.js';
