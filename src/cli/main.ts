// The command line: parse arguments, call the library, print, write files through Io, return the
// exit code (0 success, 1 design failure, 2 usage or input error). Never prints a stack trace
// unless --debug.
import yargs, { type Argv } from 'yargs';
import { join } from 'node:path';
import { TunestripError, hasErrors, type Diagnostic } from '../diagnostics.js';
import { design, designFromText } from '../design.js';
import { parseSpec } from '../spec/index.js';
import { solveSingleStub } from '../solve/index.js';
import { parseImpedance, parseQuantity } from '../units.js';
import { analyseMicrostrip, synthesizeMicrostrip } from '../physical/microstrip/index.js';
import { designRecord } from '../writers/json.js';
import { IoError, type Io } from './io.js';
import { designSummary, diagnosticLine, fitTable, lineSummary, solveTable } from './print.js';
import type { Substrate } from '../seams.js';

/** Spec files are small hand-written texts; anything larger is refused before parsing. */
export const MAX_SPEC_BYTES = 1024 * 1024;

const COPPER_CONDUCTIVITY = 5.8e7;

function parser(version: string): Argv {
  return yargs()
    .scriptName('tunestrip')
    .usage('$0 <command> [options]\n\nSingle-stub microstrip matching: from a spec file to verified copper.')
    .command('design <spec>', 'design a match from a spec file and write its artwork, records and report', (y) =>
      y
        .positional('spec', { type: 'string', describe: 'spec file, YAML or JSON' })
        .option('out', { type: 'string', describe: 'output folder (default out/<name>)' })
        .option('force', { type: 'boolean', default: false, describe: 'write into an existing folder tunestrip did not make' })
        .option('allow-drc', { type: 'boolean', default: false, describe: 'write files even when a design rule is broken' })
        .option('json', { type: 'boolean', default: false, describe: 'print design.json instead of the summary' }),
    )
    .command('fit <spec>', 'print every layout variant with its footprint and its margin to the area and keep-outs', (y) =>
      y.positional('spec', { type: 'string', describe: 'spec file, YAML or JSON' }).option('json', { type: 'boolean', default: false }),
    )
    .command('solve', 'print every ideal single-stub solution for a load', (y) =>
      y
        .option('load', { type: 'string', demandOption: true, describe: 'load impedance, e.g. 22-j31' })
        .option('target', { type: 'string', default: '50', describe: 'impedance to present at the source port' })
        .option('line-z0', { type: 'string', default: '50', describe: 'series line impedance (Ω)' })
        .option('stub-z0', { type: 'string', describe: 'stub impedance (Ω), default the line impedance' })
        .option('style', { choices: ['single', 'balanced'] as const, default: 'single' as const })
        .option('json', { type: 'boolean', default: false }),
    )
    .command('line', 'analyse a microstrip width or synthesise one for an impedance', (y) =>
      y
        .option('er', { type: 'string', demandOption: true, describe: 'relative permittivity' })
        .option('height', { type: 'string', demandOption: true, describe: 'dielectric height, e.g. 0.508mm' })
        .option('copper', { type: 'string', default: '35um', describe: 'strip thickness; 0 selects the zero-thickness model' })
        .option('freq', { type: 'string', demandOption: true, describe: 'frequency, e.g. 5.8GHz' })
        .option('z0', { type: 'string', describe: 'impedance to synthesise a width for' })
        .option('width', { type: 'string', describe: 'width to analyse, e.g. 1.1mm' })
        .option('tan-delta', { type: 'string', default: '0' })
        .option('roughness', { type: 'string', default: '0' })
        .option('json', { type: 'boolean', default: false })
        .conflicts('z0', 'width')
        .check((a) => {
          if (a.z0 === undefined && a.width === undefined) throw new Error('give --z0 or --width');
          return true;
        }),
    )
    .option('debug', { type: 'boolean', default: false, describe: 'print stack traces of internal errors' })
    .demandCommand(1, 'name a command: design, solve or line')
    .recommendCommands()
    .strict()
    .help()
    .version(version)
    .exitProcess(false)
    .wrap(100);
}

type Args = Record<string, unknown> & { _: (string | number)[] };

export function main(argv: readonly string[], io: Io, version: string): number {
  let parseError: Error | null = null;
  let output = '';
  let args: Args;
  try {
    args = parser(version).parse([...argv], {}, (err: Error | undefined, _a: unknown, out: string) => {
      parseError = err ?? null;
      output = out;
    }) as Args;
  } catch (e) {
    io.stderr(`tunestrip: ${(e as Error).message}\n`);
    return 2;
  }
  if (parseError) {
    io.stderr(`tunestrip: ${firstLine((parseError as Error).message)}\n`);
    return 2;
  }
  if (output) {
    io.stdout(`${output}\n`);
    return 0;
  }
  const debug = args.debug === true;
  try {
    switch (String(args._[0])) {
      case 'design':
        return runDesign(args, io, version);
      case 'fit':
        return runFit(args, io, version);
      case 'solve':
        return runSolve(args, io);
      case 'line':
        return runLine(args, io);
      default:
        io.stderr(`tunestrip: unknown command ${String(args._[0])}\n`);
        return 2;
    }
  } catch (e) {
    if (e instanceof TunestripError) {
      io.stderr(`tunestrip: ${e.diagnostic.where}: ${firstLine(e.diagnostic.message)}\n`);
      return exitCodeOf(e.diagnostic);
    }
    if (e instanceof IoError) {
      io.stderr(`tunestrip: ${firstLine(e.message)}\n`);
      return e.exitCode;
    }
    io.stderr(`tunestrip: internal error: ${firstLine(String((e as Error)?.message ?? e))}${debug ? '' : ' (run with --debug for details)'}\n`);
    if (debug) io.stderr(`${(e as Error)?.stack ?? ''}\n`);
    return 1;
  }
}

const firstLine = (text: string): string => text.split('\n')[0] ?? '';

/** Input problems are usage errors (2); a request that cannot be met is a design failure (1). */
export function exitCodeOf(d: Diagnostic): 1 | 2 {
  return d.code.startsWith('spec.') ? 2 : 1;
}

function runDesign(args: Args, io: Io, version: string): number {
  const specPath = String(args.spec);
  const text = io.readText(specPath, MAX_SPEC_BYTES);
  const presets = { substrates: io.readPresets('substrates'), fab: io.readPresets('fab') };
  // Parse first and show its warnings (unknown keys, bare numbers) even when the design then fails.
  const parsed = parseSpec(text, presets, specPath);
  for (const d of parsed.diagnostics) if (d.severity === 'warning') io.stderr(`${diagnosticLine(d)}\n`);
  const run = design(parsed.spec, { version }, parsed.diagnostics);
  for (const d of run.diagnostics.slice(parsed.diagnostics.length)) if (d.severity === 'warning') io.stderr(`${diagnosticLine(d)}\n`);
  const errors = run.diagnostics.filter((d) => d.severity === 'error');
  if (hasErrors(run.diagnostics) && args['allow-drc'] !== true) {
    for (const d of errors) io.stderr(`tunestrip: ${d.message.startsWith(`${d.where}:`) ? d.message : `${d.where}: ${d.message}`}\n`);
    io.stderr('tunestrip: nothing written; fix the design or pass --allow-drc\n');
    return 1;
  }
  const outDir = typeof args.out === 'string' ? args.out : join('out', run.spec.name);
  const written = io.writeOutputs(outDir, run.artifacts, { force: args.force === true });
  if (args.json === true) {
    const record = designRecord({ ...run, version });
    io.stdout(`${JSON.stringify(record, null, 2)}\n`);
  } else {
    io.stdout(designSummary(run, written, outDir));
  }
  return errors.length > 0 ? 1 : 0;
}

function runFit(args: Args, io: Io, version: string): number {
  const specPath = String(args.spec);
  const text = io.readText(specPath, MAX_SPEC_BYTES);
  const presets = { substrates: io.readPresets('substrates'), fab: io.readPresets('fab') };
  const run = designFromText(text, presets, { version }, specPath);
  if (args.json === true) {
    const rows = run.variants.map((v) => ({
      style: v.style,
      termination: v.physical.solution.termination,
      branch: v.physical.solution.branch,
      side: v.physical.stubSides.join('+'),
      fold: v.fold,
      stub_length_m: v.physical.copper.stubLength,
      footprint_m: v.geometry.bounds,
      fits: v.fit.fits,
      margin_m: Number.isFinite(v.fit.margin) ? v.fit.margin : null,
      limited_by: v.fit.limitedBy,
      chosen: v.physical === run.physical,
    }));
    io.stdout(`${JSON.stringify({ variants: rows }, null, 2)}\n`);
  } else {
    io.stdout(fitTable(run));
  }
  return run.fit.fits ? 0 : 1;
}

function runSolve(args: Args, io: Io): number {
  const load = parseImpedance(args.load, 'load');
  const target = parseImpedance(args.target, 'target');
  const lineZ0 = positiveImpedance(args['line-z0'], 'line-z0');
  const stubZ0 = args['stub-z0'] === undefined ? lineZ0 : positiveImpedance(args['stub-z0'], 'stub-z0');
  const style = args.style === 'balanced' ? 'balanced' : 'single';
  const ideal = solveSingleStub({ load, target, lineZ0, stubZ0, style });
  if (args.json === true) {
    const solutions = ideal.solutions.map((s) => ({
      position_wl: s.positionWl,
      stub_wl: s.stubWl,
      termination: s.termination,
      residual_gamma: s.residualGamma,
      branch: s.branch,
      style: s.style,
      stub_susceptance: s.stubSusceptance,
    }));
    io.stdout(`${JSON.stringify({ already_matched: ideal.alreadyMatched, solutions }, null, 2)}\n`);
  } else {
    io.stdout(solveTable(ideal));
  }
  return 0;
}

function runLine(args: Args, io: Io): number {
  const substrate: Substrate = {
    er: parseQuantity(args.er, 'dimensionless', 'er'),
    height: parseQuantity(args.height, 'length', 'height'),
    copper: parseQuantity(args.copper, 'length', 'copper'),
    tanDelta: parseQuantity(args['tan-delta'], 'dimensionless', 'tan-delta'),
    roughness: parseQuantity(args.roughness, 'length', 'roughness'),
    conductivity: COPPER_CONDUCTIVITY,
  };
  const frequency = parseQuantity(args.freq, 'frequency', 'freq');
  const checks: [string, boolean, string][] = [
    ['er', substrate.er >= 1 && Number.isFinite(substrate.er), 'a finite number of at least 1'],
    ['height', substrate.height > 0 && Number.isFinite(substrate.height), 'a positive length, e.g. 0.508mm'],
    ['freq', frequency > 0 && Number.isFinite(frequency), 'a positive frequency, e.g. 5.8GHz'],
    ['copper', substrate.copper >= 0 && Number.isFinite(substrate.copper), 'a length of zero or more'],
    ['tan-delta', substrate.tanDelta >= 0 && substrate.tanDelta < 1, 'a number from 0 to below 1'],
    ['roughness', substrate.roughness >= 0 && Number.isFinite(substrate.roughness), 'a length of zero or more'],
  ];
  for (const [name, ok, allowed] of checks) if (!ok) throw new IoError(`--${name}: must be ${allowed}`);
  const line =
    args.z0 !== undefined
      ? synthesizeMicrostrip(positiveImpedance(args.z0), substrate, frequency)
      : analyseMicrostrip(widthInRange(positiveLength(args.width), substrate.height), substrate, frequency);
  for (const w of line.warnings) io.stderr(`${diagnosticLine(w)}\n`);
  if (args.json === true) {
    const lossDbPerM = ((line.alphaConductor + line.alphaDielectric) * 20) / Math.LN10;
    io.stdout(
      `${JSON.stringify(
        {
          width_m: line.width,
          z0_ohm: line.z0,
          eps_eff: line.epsEff,
          wavelength_m: line.wavelength,
          z0_static_ohm: line.z0Static,
          eps_eff_static: line.epsEffStatic,
          loss_db_per_m: lossDbPerM,
          loss_db_per_wavelength: lossDbPerM * line.wavelength,
          warnings: line.warnings.map((w) => w.message),
        },
        null,
        2,
      )}\n`,
    );
  } else {
    io.stdout(lineSummary(line));
  }
  return 0;
}

function positiveImpedance(v: unknown, name = 'z0'): number {
  const z = parseQuantity(v, 'impedance', name);
  if (!(z > 0) || !Number.isFinite(z)) throw new IoError(`--${name}: must be a positive impedance in ohms`);
  return z;
}

/** The line models are fitted for w/h within about 0.01–100; far outside, the numbers mean nothing. */
function widthInRange(width: number, height: number): number {
  const u = width / height;
  if (u < 1e-4 || u > 1e4) throw new IoError(`--width: w/h = ${u.toExponential(2)} is far outside the microstrip models (0.01 to 100)`);
  return width;
}

function positiveLength(v: unknown): number {
  const w = parseQuantity(v, 'length', 'width');
  if (!(w > 0) || !Number.isFinite(w)) throw new IoError('--width: must be a positive length, e.g. 1.1mm');
  return w;
}
