// Copper of a single (or balanced) shunt-stub match from its section dimensions.
//
// Board frame (metres, y up): the load-side reference plane is the line x = 0, the series line
// runs along +x centred on y = 0, the stub centre-line is at x = seriesLength, and the source
// reference plane is at x = seriesLength + leadLength. A 'left' stub points along +y (left of the
// load → source direction), a 'right' stub along −y.
//
// Each stub rectangle starts on the series line's centre-line, so it overlaps the line by half the
// line width of real copper (Gerber spec 2023.08 §4.14: connect by overlap, not by touching), and
// the two are merged into one outline anyway. A short stub ends on the centre-line of a row of vias
// across its end; each via pad is a polygon (see `circlePolygon` for the area convention) that
// belongs to the same copper island.
import type { BoardGeometry, CopperIsland, Feature, Point, Port, Region, Ring, Via } from '../seams.js';
import { boundsOfRings, circlePolygon, rectRing, snap } from './polygon.js';
import { unionRings } from './union.js';

export interface StubLayoutInput {
  /** Series line and source lead width (m). */
  readonly seriesWidth: number;
  /** Load reference plane (x = 0) → stub centre-line (m). */
  readonly seriesLength: number;
  /** Stub centre-line → source reference plane (m), ≥ 0. */
  readonly leadLength: number;
  readonly stubWidth: number;
  /** From the series line's edge to the open end, or to the via centre for a short stub (m). */
  readonly stubLength: number;
  /** ['left'] = +y; balanced = ['left', 'right']. */
  readonly stubSides: readonly ('left' | 'right')[];
  readonly termination: 'open' | 'short';
  /** Short stubs: `count` vias in a row across the stub end, `pitch` apart, centred on the stub axis. */
  readonly via?: { readonly drill: number; readonly pad: number; readonly count: number; readonly pitch: number };
  readonly area?: Region;
  readonly keepouts?: readonly Region[];
}

type Rect = Feature['rect'];

function requireLength(name: string, value: number, positive: boolean): void {
  if (!Number.isFinite(value)) throw new RangeError(`${name} must be finite, got ${value}`);
  if (positive ? !(value > 0) : value < 0)
    throw new RangeError(`${name} must be ${positive ? 'positive' : 'non-negative'}, got ${value}`);
}

function requireFiniteRegion(name: string, region: Region): void {
  const numbers =
    region.kind === 'rect'
      ? [...region.x, ...region.y]
      : region.kind === 'circle'
        ? [...region.center, region.radius]
        : region.points.flat();
  if (!numbers.every(Number.isFinite)) throw new RangeError(`${name} has a non-finite coordinate`);
}

function validate(input: StubLayoutInput): void {
  requireLength('seriesWidth', input.seriesWidth, true);
  requireLength('stubWidth', input.stubWidth, true);
  requireLength('seriesLength', input.seriesLength, false);
  requireLength('leadLength', input.leadLength, false);
  requireLength('stubLength', input.stubLength, false);
  const sides = input.stubSides;
  if (sides.length < 1 || sides.length > 2 || new Set(sides).size !== sides.length)
    throw new RangeError(`stubSides must be one side or both distinct sides, got [${sides.join(', ')}]`);
  if (input.termination === 'short') {
    const v = input.via;
    if (!v) throw new RangeError('a short stub needs via dimensions');
    requireLength('via.drill', v.drill, true);
    requireLength('via.pad', v.pad, true);
    requireLength('via.pitch', v.pitch, false);
    if (!Number.isInteger(v.count) || v.count < 1) throw new RangeError(`via.count must be a whole number ≥ 1, got ${v.count}`);
    if (!(v.drill < v.pad)) throw new RangeError(`via.drill ${v.drill} must be smaller than via.pad ${v.pad}`);
    if (v.count > 1 && !(v.pitch > v.drill)) throw new RangeError(`via.pitch ${v.pitch} must exceed via.drill ${v.drill}: drills would overlap`);
    // Every via centre lies on the stub's copper, so every pad overlaps the stub and the island stays one.
    if ((v.count - 1) * v.pitch > input.stubWidth)
      throw new RangeError(`the via row (${v.count} at ${v.pitch} m pitch) is wider than the stub (${input.stubWidth} m)`);
  }
  if (input.area) requireFiniteRegion('area', input.area);
  (input.keepouts ?? []).forEach((k, i) => requireFiniteRegion(`keepouts[${i}]`, k));
}

const rectOf = (xmin: number, ymin: number, xmax: number, ymax: number): Rect => ({
  xmin: snap(xmin),
  ymin: snap(ymin),
  xmax: snap(xmax),
  ymax: snap(ymax),
});

const ringOf = (r: Rect): Ring => rectRing(r.xmin, r.ymin, r.xmax, r.ymax);
const hasArea = (r: Rect): boolean => r.xmax > r.xmin && r.ymax > r.ymin;

export function layoutStubMatch(input: StubLayoutInput): BoardGeometry {
  validate(input);
  const halfLine = input.seriesWidth / 2;
  const xStub = input.seriesLength;
  const xEnd = input.seriesLength + input.leadLength;

  const features: Feature[] = [
    {
      id: 'series',
      kind: 'line',
      rect: rectOf(0, -halfLine, xStub, halfLine),
      length: input.seriesLength,
      width: input.seriesWidth,
    },
    {
      id: 'lead-source',
      kind: 'lead',
      rect: rectOf(xStub, -halfLine, xEnd, halfLine),
      length: input.leadLength,
      width: input.seriesWidth,
    },
  ];

  // Canonical side order (left, then right) keeps ids stable whatever order the caller lists.
  const sides = (['left', 'right'] as const).filter((s) => input.stubSides.includes(s));
  const vias: Via[] = [];
  const padRings: Ring[] = [];
  sides.forEach((side, index) => {
    const sign = side === 'left' ? 1 : -1;
    const yEnd = sign * (halfLine + input.stubLength);
    features.push({
      id: index === 0 ? 'stub' : `stub-${index + 1}`,
      kind: 'stub',
      rect: rectOf(xStub - input.stubWidth / 2, Math.min(0, yEnd), xStub + input.stubWidth / 2, Math.max(0, yEnd)),
      length: input.stubLength,
      width: input.stubWidth,
    });
    if (input.termination === 'short' && input.via) {
      const v = input.via;
      for (let k = 0; k < v.count; k++) {
        const centre: Point = [snap(xStub + (k - (v.count - 1) / 2) * v.pitch), snap(yEnd)];
        const n = vias.length + 1;
        vias.push({ x: centre[0], y: centre[1], drill: v.drill, pad: v.pad });
        padRings.push(circlePolygon(centre, v.pad / 2));
        features.push({
          id: `via-pad-${n}`,
          kind: 'pad',
          rect: rectOf(centre[0] - v.pad / 2, centre[1] - v.pad / 2, centre[0] + v.pad / 2, centre[1] + v.pad / 2),
          length: v.pad,
          width: v.pad,
        });
      }
    }
  });

  const shapes = [...features.filter((f) => f.kind !== 'pad' && hasArea(f.rect)).map((f) => ringOf(f.rect)), ...padRings];
  const islands = unionRings(shapes);
  const copper: CopperIsland[] = islands.map((island, i) => ({
    id: islands.length === 1 ? 'copper' : `copper-${i + 1}`,
    outline: island.outline,
    holes: island.holes,
  }));

  const ports: Port[] = [
    { role: 'load', x: 0, y: 0, directionDeg: 0, width: input.seriesWidth },
    { role: 'source', x: snap(xEnd), y: 0, directionDeg: 180, width: input.seriesWidth },
  ];

  const geometry: BoardGeometry = {
    copper,
    vias,
    ports,
    features,
    keepouts: input.keepouts ? [...input.keepouts] : [],
    bounds: boundsOfRings(copper.map((c) => c.outline)),
  };
  return input.area ? { ...geometry, area: input.area } : geometry;
}
