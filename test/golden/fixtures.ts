// Three fixed layouts (our own scenarios) shared by the writer, golden and integration tests,
// with their copper area worked out by hand from the rectangles (and pad polygons).
import { layoutStubMatch, padPolygonArea, type StubLayoutInput } from '../../src/geometry/index.js';
import type { BoardGeometry } from '../../src/seams.js';
import type { ArtworkMeta } from '../../src/writers/units.js';

export interface Fixture {
  readonly name: string;
  readonly input: StubLayoutInput;
  readonly geometry: BoardGeometry;
  readonly meta: ArtworkMeta;
  /** Copper area (mm²) from the section dimensions, independent of the union. */
  readonly analyticAreaMm2: number;
}

const meta = (name: string, notes: string[]): ArtworkMeta => ({ name, version: '0.1.0', notes });

const openSingle: StubLayoutInput = {
  seriesWidth: 1.1e-3,
  seriesLength: 8.25e-3,
  leadLength: 3e-3,
  stubWidth: 1.1e-3,
  stubLength: 6.4e-3,
  stubSides: ['left'],
  termination: 'open',
};

const shortVias: StubLayoutInput = {
  seriesWidth: 2.9e-3,
  seriesLength: 14.2e-3,
  leadLength: 5e-3,
  stubWidth: 2.9e-3,
  stubLength: 9.6e-3,
  stubSides: ['right'],
  termination: 'short',
  via: { drill: 0.3e-3, pad: 0.6e-3, count: 3, pitch: 1e-3 },
  area: { kind: 'rect', x: [-2e-3, 22e-3], y: [-15e-3, 5e-3] },
  keepouts: [{ kind: 'rect', x: [2e-3, 6e-3], y: [-10e-3, -6e-3] }],
};

const balanced: StubLayoutInput = {
  seriesWidth: 1.5e-3,
  seriesLength: 10e-3,
  leadLength: 4e-3,
  stubWidth: 1.2e-3,
  stubLength: 5.5e-3,
  stubSides: ['left', 'right'],
  termination: 'open',
  area: { kind: 'circle', center: [7e-3, 0], radius: 12e-3 },
};

export const FIXTURES: readonly Fixture[] = [
  {
    name: 'open-single',
    input: openSingle,
    geometry: layoutStubMatch(openSingle),
    meta: meta('open-single', ['open stub, single, left side']),
    // line 1.1 × (8.25 + 3) plus stub 1.1 × 6.4 beyond the line edge.
    analyticAreaMm2: 1.1 * 11.25 + 1.1 * 6.4,
  },
  {
    name: 'short-vias',
    input: shortVias,
    geometry: layoutStubMatch(shortVias),
    meta: meta('short-vias', ['short stub, 3 vias', 'Z0 = 50 Ω, f0 = 2.4 GHz']),
    // line 2.9 × 19.2, stub 2.9 × 9.6 beyond the edge, and the outer half of each of the 3 pads
    // (the inner half lies on the stub; the pads do not touch each other: pitch 1 ≥ pad 0.6).
    analyticAreaMm2: 2.9 * 19.2 + 2.9 * 9.6 + 3 * (padPolygonArea(0.3e-3) * 1e6) / 2,
  },
  {
    name: 'balanced',
    input: balanced,
    geometry: layoutStubMatch(balanced),
    meta: meta('balanced', ['balanced open stubs']),
    analyticAreaMm2: 1.5 * 14 + 2 * 1.2 * 5.5,
  },
];
