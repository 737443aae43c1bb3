// tunestrip's public API: the stage functions, the whole pipeline, and the seam types.
export * from './seams.js';
export type { Complex } from './math/complex.js';
export { complex } from './math/complex.js';
export { CATALOGUE, TunestripError, type Diagnostic, type DiagnosticCode, type Severity } from './diagnostics.js';
export { design, designFromText, layoutInputOf, type DesignRun, type DesignOptions } from './design.js';
export { parseSpec, type Presets, type ParsedSpec } from './spec/index.js';
export { parseQuantity, parseImpedance } from './units.js';
export { solveSingleStub, type StubProblem } from './solve/index.js';
export { analyseMicrostrip, synthesizeMicrostrip, propagationConstant } from './physical/microstrip/index.js';
export { sizeLines, planJunction, realize } from './physical/realize.js';
export { physicalInputImpedance } from './analysis/physicalNetwork.js';
export { sweep } from './analysis/sweep.js';
export { layoutStubMatch } from './geometry/index.js';
export { writeArtifacts } from './writers/index.js';
