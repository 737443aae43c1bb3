// Fabrication design rules on the finished copper: trace widths, via annular ring, space between
// via pads, and copper to the board edge. Broken rules are error diagnostics (data, not throws).
import type { BoardGeometry, FabRules, Region } from '../seams.js';
import { diagnostic, type Diagnostic } from '../diagnostics.js';
import { mm } from '../format.js';
import { areaSlack } from './fit.js';

/** Comparisons allow 1 nm for the board grid's rounding. */
const EPS = 1e-9;

export function checkDesignRules(g: BoardGeometry, fab: FabRules, area?: Region): Diagnostic[] {
  const out: Diagnostic[] = [];
  for (const f of g.features) {
    if (f.kind !== 'pad' && f.width < fab.minTrace - EPS)
      out.push(diagnostic('fab.too-narrow', f.id, `${f.id} is ${mm(f.width)} mm wide, below the ${mm(fab.minTrace)} mm minimum trace`));
  }
  g.vias.forEach((v, i) => {
    // Annular ring = (pad − drill) / 2 (IPC-2221B land-size rule, physics.md §9.1 [M]).
    const ring = (v.pad - v.drill) / 2;
    if (ring < fab.minAnnularRing - EPS)
      out.push(diagnostic('fab.annular-ring', `via-${i + 1}`, `via ${i + 1} leaves a ${mm(ring)} mm annular ring, below the ${mm(fab.minAnnularRing)} mm minimum`));
  });
  for (let i = 0; i < g.vias.length; i++)
    for (let j = i + 1; j < g.vias.length; j++) {
      const a = g.vias[i]!;
      const b = g.vias[j]!;
      const gap = Math.hypot(a.x - b.x, a.y - b.y) - (a.pad + b.pad) / 2;
      // Pads that overlap are one piece of copper; only a thin gap between separate pads breaks the space rule.
      if (gap > EPS && gap < fab.minSpace - EPS)
        out.push(diagnostic('fab.rule', `via-${i + 1}`, `via pads ${i + 1} and ${j + 1} are ${mm(gap)} mm apart, below the ${mm(fab.minSpace)} mm minimum space`));
    }
  if (area && g.copper.length > 0) {
    const slack = areaSlack(g, area);
    if (slack < fab.copperToEdge - EPS)
      out.push(diagnostic('fab.rule', 'area', `copper comes ${mm(slack)} mm from the board edge, below the ${mm(fab.copperToEdge)} mm copper-to-edge minimum`));
  }
  return out;
}
