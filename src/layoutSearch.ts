// Layout variants in order of electrical preference, each laid out and checked against the space
// the spec allows. When the preferred layout does not fit, the first variant that does is used,
// and what changed is said.
import type { BoardGeometry, IdealSolution, PhysicalDesign, Spec, StubStyle } from './seams.js';
import { solveSingleStub } from './solve/index.js';
import { planJunction, realizeAll, withBends, type JunctionPlan, type SizedLines } from './physical/realize.js';
import { layoutStubMatch, checkFit, foldFits, placeGeometry, type FitReport, type StubFold, type StubLayoutInput } from './geometry/index.js';
import { mitreDouvilleJames } from './physical/discontinuities/index.js';

/** How the stub is drawn: straight, or folded once (L) or twice (U) with its bends towards the load or the source. */
export type Fold = 'straight' | 'L-source' | 'L-load' | 'U-source' | 'U-load';

export interface LayoutVariant {
  readonly style: StubStyle;
  readonly junction: JunctionPlan;
  readonly ideal: IdealSolution;
  readonly physical: PhysicalDesign;
  readonly fold: Fold;
  readonly geometry: BoardGeometry;
  readonly fit: FitReport;
  /** How this variant differs from the preferred one, in words; empty for the preferred one. */
  readonly changed: readonly string[];
}

interface Electrical {
  readonly style: StubStyle;
  readonly junction: JunctionPlan;
  readonly ideal: IdealSolution;
  readonly designs: readonly PhysicalDesign[];
}

/** Straight first; then an L, then a U, each with the bend towards the source and then the load (our preference order). */
const FOLDS: readonly Fold[] = ['straight', 'L-source', 'L-load', 'U-source', 'U-load'];

const FOLD_WORDS: Readonly<Record<Exclude<Fold, 'straight'>, string>> = {
  'L-source': 'L-folded stub (bend towards the source)',
  'L-load': 'L-folded stub (bend towards the load)',
  'U-source': 'U-folded stub (bends towards the source)',
  'U-load': 'U-folded stub (bends towards the load)',
};

/** Whether the spec constrains the copper's position at all. */
export const hasSpaceLimits = (spec: Spec): boolean => spec.area !== undefined || spec.keepouts.length > 0;

function electrical(spec: Spec, lines: SizedLines, style: StubStyle, explore: boolean): Electrical {
  const stubCount = style === 'balanced' ? 2 : 1;
  const junction = planJunction(spec, lines, stubCount);
  const ideal = solveSingleStub({ load: spec.load, target: junction.targetAtJunction, lineZ0: spec.lineZ0, stubZ0: spec.stubZ0, style });
  const plan = ideal.alreadyMatched ? planJunction(spec, lines, 0) : junction;
  const own = realizeAll(spec, lines, plan, ideal);
  const others = spec.stub === 'best' || !explore ? [] : realizeAll(spec, lines, plan, ideal, [spec.stub === 'open' ? 'short' : 'open']);
  return { style, junction: plan, ideal, designs: [...own, ...others] };
}

/**
 * Every variant, most preferred first: the spec's own choice, then the other branch, the other
 * termination, the other side, the other style (single ↔ balanced) and finally folding. Only the
 * spec's own style is tried when the spec sets no area or keep-outs.
 */
export function layoutVariants(spec: Spec, lines: SizedLines, explore = hasSpaceLimits(spec)): LayoutVariant[] {
  const styles: StubStyle[] = explore ? [spec.style, spec.style === 'single' ? 'balanced' : 'single'] : [spec.style];
  const byStyle = styles.map((style) => electrical(spec, lines, style, explore));
  const preferred = byStyle[0]?.designs[0];
  const variants: LayoutVariant[] = [];
  for (const fold of explore ? FOLDS : FOLDS.slice(0, 1)) {
    for (const e of byStyle) {
      const sides: ('left' | 'right')[] =
        e.style === 'balanced' ? ['left'] : explore ? [spec.stubSide, spec.stubSide === 'left' ? 'right' : 'left'] : [spec.stubSide];
      for (const side of sides) {
        for (const d of explore ? e.designs : e.designs.slice(0, 1)) {
          const straight: PhysicalDesign = e.style === 'balanced' || d.copper.stubCount === 0 ? d : { ...d, stubSides: [side] };
          const sided = fold === 'straight' || straight.copper.stubCount === 0 ? straight : withBends(spec, straight, fold.startsWith('U') ? 2 : 1);
          const input = layoutInputOf(spec, sided, fold);
          // A fold that cannot be built at this stub length (too short to fold) is not a variant.
          if (input.fold && !foldFits(input)) continue;
          // A folded stub carries the bend model's validity warnings (w/h ≥ 0.25) with its design.
          const bendWarnings = input.fold ? mitreDouvilleJames(sided.copper.stubWidth, spec.substrate.height).warnings : [];
          const physical: PhysicalDesign = bendWarnings.length > 0 ? { ...sided, diagnostics: [...sided.diagnostics, ...bendWarnings] } : sided;
          const geometry = placeGeometry(layoutStubMatch(input), spec.place);
          const fit = checkFit(geometry, spec.area, spec.keepouts, spec.clearance);
          variants.push({ style: e.style, junction: e.junction, ideal: e.ideal, physical, fold, geometry, fit, changed: preferred ? differences(preferred, physical, fold) : [] });
        }
      }
    }
  }
  return variants;
}

function differences(a: PhysicalDesign, b: PhysicalDesign, fold: Fold): string[] {
  const out: string[] = [];
  const sa = a.solution;
  const sb = b.solution;
  if (sa.style !== sb.style) out.push(`${sb.style} stubs instead of ${sa.style}`);
  if (sa.termination !== sb.termination) out.push(`${sb.termination}-circuit stub instead of ${sa.termination}`);
  if (sa.branch !== sb.branch && sa.style === sb.style) out.push(`branch ${sb.branch} instead of ${sa.branch}`);
  if (sb.style === 'single' && sa.style === 'single' && a.stubSides[0] !== b.stubSides[0]) out.push(`stub on the ${b.stubSides[0]} instead of the ${a.stubSides[0]}`);
  if (fold !== 'straight') out.push(FOLD_WORDS[fold]);
  return out;
}

/** The copper dimensions the physical stage chose, handed to the geometry stage. */
export function layoutInputOf(spec: Spec, physical: PhysicalDesign, fold: Fold = 'straight'): StubLayoutInput {
  const c = physical.copper;
  const folded = foldOf(spec, physical, fold);
  return {
    seriesWidth: c.seriesWidth,
    seriesLength: c.seriesLength,
    leadLength: c.leadLength,
    stubWidth: c.stubWidth,
    stubLength: c.stubLength,
    stubSides: physical.stubSides,
    termination: c.termination,
    ...(c.vias ? { via: { drill: c.vias.drill, pad: c.vias.pad, count: c.vias.count, pitch: c.vias.pitch } } : {}),
    ...(folded ? { fold: folded } : {}),
    ...(spec.area ? { area: spec.area } : {}),
    keepouts: spec.keepouts,
  };
}

/**
 * The bend geometry of a folded stub: each corner mitred per Douville & James (1978), the cut from
 * mitreDouvilleJames (physics.md §4.3 [M]); the fold keeps max(2 × stub width, fab.min_space) from
 * the series line and between a U's arms, so coupling stays small and the space rule holds (common
 * practice, no source: two line widths between coupled-free parallel lines).
 */
function foldOf(spec: Spec, physical: PhysicalDesign, fold: Fold): StubFold | undefined {
  if (fold === 'straight' || physical.copper.stubCount === 0) return undefined;
  const w = physical.copper.stubWidth;
  const [kind, toward] = fold.split('-') as ['L' | 'U', 'load' | 'source'];
  return { kind, toward, mitreCut: mitreDouvilleJames(w, spec.substrate.height).edgeCut, clearance: Math.max(2 * w, spec.fab.minSpace) };
}


