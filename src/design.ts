// Runs every stage of the pipeline and keeps each seam and every diagnostic, so a caller can stop
// at or dump any stage. Pure: text in, artifacts out; the CLI does the file I/O.
import { diagnostic, fail, type Diagnostic } from './diagnostics.js';
import type { Artifact, BoardGeometry, IdealSolution, PhysicalDesign, ResponseSet, Spec } from './seams.js';
import { parseSpec, type Presets } from './spec/index.js';
import { sizeLines, type JunctionPlan, type SizedLines } from './physical/realize.js';
import { sweep } from './analysis/sweep.js';
import { checkDesignRules, type FitReport } from './geometry/index.js';
import { writeArtifacts } from './writers/index.js';
import { hasSpaceLimits, layoutVariants, type LayoutVariant } from './layoutSearch.js';
import { mm } from './format.js';

export { layoutInputOf } from './layoutSearch.js';

export interface DesignRun {
  readonly spec: Spec;
  readonly lines: SizedLines;
  readonly junction: JunctionPlan;
  readonly ideal: IdealSolution;
  readonly physical: PhysicalDesign;
  readonly response: ResponseSet;
  readonly geometry: BoardGeometry;
  readonly fit: FitReport & { readonly changed: readonly string[] };
  /** How the chosen stub is drawn: 'straight' or a fold such as 'L-source'. */
  readonly fold: string;
  /** Every layout tried, most preferred first (the `fit` command prints them). */
  readonly variants: readonly LayoutVariant[];
  readonly artifacts: readonly Artifact[];
  readonly diagnostics: readonly Diagnostic[];
}

export interface DesignOptions {
  /** Written into the artwork's generation attributes. */
  readonly version: string;
}

export function design(spec: Spec, options: DesignOptions, parseDiagnostics: readonly Diagnostic[] = []): DesignRun {
  const lines = sizeLines(spec);
  const variants = layoutVariants(spec, lines);
  if (variants.length === 0) {
    fail('solve.no-passive-solution', 'stub', `no ${spec.stub === 'best' ? '' : `${spec.stub}-circuit `}stub branch could be built and brought to the target on the physical network; try another stub termination, stub impedance or fabrication limits`);
  }
  const fitting = variants.findIndex((v) => v.fit.fits);
  const chosen = variants[fitting >= 0 ? fitting : 0]!;
  const fitDiagnostics: Diagnostic[] = [];
  if (hasSpaceLimits(spec)) {
    if (fitting < 0) {
      const best = variants.reduce((a, b) => (b.fit.margin > a.fit.margin ? b : a));
      fitDiagnostics.push(diagnostic('fit.no-fit', 'area', `no layout fits: the preferred one misses by ${mm(-chosen.fit.margin)} mm (${chosen.fit.limitedBy}); the closest of ${variants.length} tried misses by ${mm(-best.fit.margin)} mm`));
    } else if (chosen.changed.length > 0) {
      fitDiagnostics.push(diagnostic('fit.changed', 'area', `the preferred layout does not fit; changed to fit: ${chosen.changed.join(', ')}`));
    }
  }
  const physical = chosen.physical;
  const response = sweep(spec, physical);
  const geometry = chosen.geometry;
  const drc = checkDesignRules(geometry, spec.fab, spec.area);
  const diagnostics = [...parseDiagnostics, ...physical.diagnostics, ...fitDiagnostics, ...drc];
  const fit = { ...chosen.fit, changed: chosen.changed };
  const artifacts = writeArtifacts({ spec, ideal: chosen.ideal, physical, response, geometry, diagnostics, fit, fold: chosen.fold, version: options.version });
  return { spec, lines, junction: chosen.junction, ideal: chosen.ideal, physical, response, geometry, fit, fold: chosen.fold, variants, artifacts, diagnostics };
}

/** Parse a spec file's text and run the whole pipeline on it. */
export function designFromText(text: string, presets: Presets, options: DesignOptions, sourceName?: string): DesignRun {
  const parsed = parseSpec(text, presets, sourceName);
  return design(parsed.spec, options, parsed.diagnostics);
}
