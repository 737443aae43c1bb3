// Types of scripts/fuzz-inputs.mjs.
import type fc from 'fast-check';
import type { StubLayoutInput } from '../src/geometry/index.js';

export interface LayoutInputRange {
  readonly maxWidthUm: number;
  readonly maxLengthUm: number;
  readonly maxLeadUm: number;
  readonly drillUm: readonly [number, number];
  readonly ringUm: readonly [number, number];
}

export function layoutInputs(fastCheck: typeof fc, range: LayoutInputRange): fc.Arbitrary<StubLayoutInput>;

export const UNIT_WORDS: readonly string[];
export function numberTexts(fastCheck: typeof fc): fc.Arbitrary<string>;
export function quantityLikes(fastCheck: typeof fc, size: { readonly maxLength: number; readonly maxDepth: number }): fc.Arbitrary<unknown>;
