// Diagnostics are data: a catalogue of codes, each with a severity and a hint. Stages return them;
// only the CLI decides how to print them and which exit code follows.
export type Severity = 'error' | 'warning' | 'info';

export interface Diagnostic {
  readonly code: DiagnosticCode;
  readonly severity: Severity;
  /** JSON path of the spec field or the model/feature concerned, e.g. "substrate.height" or "stub". */
  readonly where: string;
  readonly message: string;
}

export const CATALOGUE = {
  'spec.syntax': { severity: 'error', hint: 'the file is not valid YAML or JSON' },
  'spec.invalid': { severity: 'error', hint: 'a field has a value that is not allowed' },
  'spec.unknown-key': { severity: 'warning', hint: 'the key is ignored' },
  'spec.too-large': { severity: 'error', hint: 'spec files are small text files' },
  'solve.no-passive-solution': { severity: 'error', hint: 'no single shunt stub on this line reaches the target' },
  'solve.already-matched': { severity: 'info', hint: 'the load already presents the target; no stub is needed' },
  'model.out-of-range': { severity: 'warning', hint: 'the model is used outside its published validity range' },
  'model.thin-conductor': { severity: 'warning', hint: 'copper thinner than three skin depths: loss is underestimated' },
  'fab.too-narrow': { severity: 'error', hint: 'a line would be narrower than the fabrication minimum' },
  'fab.annular-ring': { severity: 'error', hint: 'via pad leaves less annular ring than the fabrication minimum' },
  'fab.rule': { severity: 'error', hint: 'a design rule is broken' },
  'fit.no-fit': { severity: 'error', hint: 'the copper does not fit the allowed area' },
  'fit.changed': { severity: 'info', hint: 'the layout was changed to fit the area' },
  'design.note': { severity: 'info', hint: '' },
  'spec.bare-number': { severity: 'warning', hint: 'a number without a unit is read in SI units (Hz, ohm, S/m); write the unit to be sure' },
  'design.via-near-junction': { severity: 'warning', hint: 'a via close to the junction is the least certain part of a short-stub match' },
  'design.refine-failed': { severity: 'warning', hint: 'the physical network refinement did not converge' },
  'design.out-of-model': { severity: 'error', hint: 'the request lies where the closed-form models do not hold' },
  'fab.min-space': { severity: 'error', hint: 'two pieces of copper are closer than the fabrication minimum space' },
  'fab.copper-to-edge': { severity: 'error', hint: 'copper is closer to the board edge than the fabrication minimum' },
} as const satisfies Record<string, { severity: Severity; hint: string }>;

export type DiagnosticCode = keyof typeof CATALOGUE;

export function diagnostic(code: DiagnosticCode, where: string, message: string): Diagnostic {
  return { code, severity: CATALOGUE[code].severity, where, message };
}

export const hasErrors = (ds: readonly Diagnostic[]): boolean => ds.some((d) => d.severity === 'error');

/** Thrown only inside the core to abort a stage; the CLI turns it into one line and an exit code. */
export class TunestripError extends Error {
  constructor(readonly diagnostic: Diagnostic) {
    super(`${diagnostic.where}: ${diagnostic.message}`);
    this.name = 'TunestripError';
  }
}

export const fail = (code: DiagnosticCode, where: string, message: string): never => {
  throw new TunestripError(diagnostic(code, where, message));
};
