// Runs every stage of the pipeline and keeps each seam and every diagnostic, so a caller can stop
// at or dump any stage. Pure: text in, artifacts out; the CLI does the file I/O.
import type { Diagnostic } from './diagnostics.js';
import type { Artifact, BoardGeometry, IdealSolution, PhysicalDesign, ResponseSet, Spec } from './seams.js';
import { parseSpec, type Presets } from './spec/index.js';
import { solveSingleStub } from './solve/index.js';
import { planJunction, realize, sizeLines, type JunctionPlan, type SizedLines } from './physical/realize.js';
import { sweep } from './analysis/sweep.js';
import { layoutStubMatch, type StubLayoutInput } from './geometry/index.js';
import { writeArtifacts } from './writers/index.js';

export interface DesignRun {
  readonly spec: Spec;
  readonly lines: SizedLines;
  readonly junction: JunctionPlan;
  readonly ideal: IdealSolution;
  readonly physical: PhysicalDesign;
  readonly response: ResponseSet;
  readonly geometry: BoardGeometry;
  readonly artifacts: readonly Artifact[];
  readonly diagnostics: readonly Diagnostic[];
}

export interface DesignOptions {
  /** Written into the artwork's generation attributes. */
  readonly version: string;
}

export function design(spec: Spec, options: DesignOptions, parseDiagnostics: readonly Diagnostic[] = []): DesignRun {
  const lines = sizeLines(spec);
  const stubCount = spec.style === 'balanced' ? 2 : 1;
  const junction = planJunction(spec, lines, stubCount);
  const ideal = solveSingleStub({
    load: spec.load,
    target: junction.targetAtJunction,
    lineZ0: spec.lineZ0,
    stubZ0: spec.stubZ0,
    style: spec.style,
  });
  const physical = realize(spec, lines, ideal.alreadyMatched ? planJunction(spec, lines, 0) : junction, ideal);
  const response = sweep(spec, physical);
  const geometry = layoutStubMatch(layoutInputOf(spec, physical));
  const diagnostics = [...parseDiagnostics, ...physical.diagnostics];
  const artifacts = writeArtifacts({ spec, ideal, physical, response, geometry, diagnostics, version: options.version });
  return { spec, lines, junction, ideal, physical, response, geometry, artifacts, diagnostics };
}

/** Parse a spec file's text and run the whole pipeline on it. */
export function designFromText(text: string, presets: Presets, options: DesignOptions, sourceName?: string): DesignRun {
  const parsed = parseSpec(text, presets, sourceName);
  return design(parsed.spec, options, parsed.diagnostics);
}

/** The copper dimensions the physical stage chose, handed to the geometry stage. */
export function layoutInputOf(spec: Spec, physical: PhysicalDesign): StubLayoutInput {
  const c = physical.copper;
  return {
    seriesWidth: c.seriesWidth,
    seriesLength: c.seriesLength,
    leadLength: c.leadLength,
    stubWidth: c.stubWidth,
    stubLength: c.stubLength,
    stubSides: physical.stubSides,
    termination: c.termination,
    ...(c.vias ? { via: { drill: c.vias.drill, pad: c.vias.pad, count: c.vias.count, pitch: viaPitch(spec) } } : {}),
    ...(spec.area ? { area: spec.area } : {}),
    keepouts: spec.keepouts,
  };
}

/** Vias in a row sit one pad apart plus the minimum space between drills' pads (common practice, no source). */
const viaPitch = (spec: Spec): number => spec.fab.viaPad + spec.fab.minSpace;
