// Human-readable summaries for the terminal. Formatting only; every number comes from the run.
import type { Diagnostic } from '../diagnostics.js';
import type { DesignRun } from '../design.js';
import type { IdealSolution, LineProperties } from '../seams.js';
import { fixed, ghz, impedanceText, mm, modelS11Text, signedPercent } from '../format.js';


const ROLE_LABEL = { series: 'series line', stub: 'stub', 'lead-source': 'source lead', 'lead-load': 'load lead' } as const;

export function designSummary(run: DesignRun, written: readonly string[], outDir: string): string {
  const { spec, physical, response, geometry } = run;
  const s = physical.solution;
  const lines: string[] = [];
  lines.push(`${spec.name}: ${impedanceText(spec.load.re, spec.load.im)} Ω load to ${impedanceText(spec.target.re, spec.target.im)} Ω at ${ghz(spec.frequency)}`);
  if (run.ideal.alreadyMatched) lines.push('  already matched: no stub needed, a plain line is drawn');
  else
    lines.push(
      `  branch ${s.branch}: ${s.termination}-circuit ${s.style === 'balanced' ? 'balanced stubs' : `stub on the ${physical.stubSides[0]}`}, ${fixed(s.stubWl, 4)} λ at ${fixed(s.positionWl, 4)} λ from the load`,
    );
  for (const sec of physical.sections) {
    const shift = sec.length - sec.idealLength;
    lines.push(
      `  ${ROLE_LABEL[sec.role].padEnd(12)} width ${mm(sec.width).padStart(7)} mm  length ${mm(sec.length).padStart(8)} mm  (ideal ${mm(sec.idealLength)} mm, ${shift >= 0 ? '+' : ''}${mm(shift)} mm)  Z0 ${fixed(sec.z0, 2)} Ω  εeff ${fixed(sec.epsEff, 3)}`,
    );    const steps = sec.corrections.filter((c) => Math.abs(c.delta) >= 5e-7);
    if (steps.length > 0) lines.push(`  ${''.padEnd(12)} ${steps.map((c) => `${c.delta >= 0 ? '+' : ''}${mm(c.delta)} mm ${shortModel(c.model)}`).join(', ')}`);
  }
  if (physical.via) lines.push(`  via: ${physical.via.count} × ${mm(physical.via.drill)} mm drill, ${mm(physical.via.pad)} mm pad`);
  const b = geometry.bounds;
  lines.push(`  footprint ${mm(b.xmax - b.xmin, 2)} × ${mm(b.ymax - b.ymin, 2)} mm (x ${mm(b.xmin, 2)}…${mm(b.xmax, 2)}, y ${mm(b.ymin, 2)}…${mm(b.ymax, 2)})`);
  lines.push(
    `  predicted |S11| at f0 ${modelS11Text(physical.s11DbAtF0)}; ${response.band10dB ? `return loss ≥ 10 dB from ${ghz(response.band10dB.low)} to ${ghz(response.band10dB.high)}` : 'return loss below 10 dB at f0'}`,
  );
  const sheet = response.sheetEquivalent;
  if (sheet) {
    lines.push(`  an EM model with zero-thickness copper should put the minimum at ${ghz(sheet.minimumFrequency)} (${signedPercent(sheet.offset)})`);
  }
  const tol = response.tolerance;
  if (tol) {
    lines.push(`  fabrication spread (${tol.runs} runs): |S11| at f0 median ${fixed(tol.s11DbAtF0.median, 1)} dB, 95 % ${fixed(tol.s11DbAtF0.p95, 1)} dB; RL ≥ 10 dB in ${fixed(tol.yield10dB * 100, 0)} % of boards`);
  }
  if (Number.isFinite(run.fit.margin)) {
    lines.push(`  fit: ${run.fit.fits ? 'fits' : 'does not fit'}, worst margin ${mm(run.fit.margin)} mm (${run.fit.limitedBy})${run.fit.changed.length ? `; changed to fit: ${run.fit.changed.join(', ')}` : ''}`);
  }
  for (const d of run.diagnostics) if (d.severity === 'info') lines.push(`  note: ${d.message}`);
  lines.push(`  wrote ${written.length} files to ${outDir}`);
  lines.push('  verify by EM simulation or measurement before building');
  return `${lines.join('\n')}\n`;
}

/** The model's name without its source, for the one-line summary (the report keeps the full name). */
const shortModel = (model: string): string => model.replace(/\s*\(.*\)$/, '');

export function solveTable(ideal: IdealSolution): string {
  const lines: string[] = [];
  if (ideal.alreadyMatched) lines.push('already matched: the load presents the target, no stub is needed');
  lines.push('branch  termination  position (λ)  stub (λ)   residual |Γ|');
  for (const s of ideal.solutions) {
    lines.push(`${String(s.branch).padEnd(8)}${s.termination.padEnd(13)}${fixed(s.positionWl, 6).padEnd(14)}${fixed(s.stubWl, 6).padEnd(11)}${s.residualGamma.toExponential(1)}`);
  }
  return `${lines.join('\n')}\n`;
}

export function lineSummary(line: LineProperties): string {
  const lossDbPerM = (line.alphaConductor + line.alphaDielectric) * 20 / Math.LN10;
  return [
    `width ${mm(line.width, 4)} mm`,
    `Z0 ${fixed(line.z0, 3)} Ω at ${ghz(line.frequency)} (static ${fixed(line.z0Static, 3)} Ω)`,
    `εeff ${fixed(line.epsEff, 4)} (static ${fixed(line.epsEffStatic, 4)})`,
    `guided wavelength ${mm(line.wavelength, 3)} mm`,
    `loss ${fixed(lossDbPerM / 1000, 5)} dB/mm, ${fixed(lossDbPerM * line.wavelength, 4)} dB per wavelength`,
    '',
  ].join('\n');
}

export const diagnosticLine = (d: Diagnostic): string => `${d.severity}: ${d.where}: ${d.message}`;

export function fitTable(run: DesignRun): string {
  const lines = ['   style     stub   branch  side         fold      stub (mm)  footprint (mm)   margin (mm)  fits'];
  for (const v of run.variants) {
    const b = v.geometry.bounds;
    const chosen = v.physical === run.physical ? '▶' : ' ';
    const margin = Number.isFinite(v.fit.margin) ? mm(v.fit.margin, 3) : 'no limits';
    lines.push(
      `${chosen}  ${v.style.padEnd(9)} ${v.physical.solution.termination.padEnd(6)} ${String(v.physical.solution.branch).padEnd(7)} ${v.physical.stubSides.join('+').padEnd(12)} ${v.fold.padEnd(9)} ${mm(v.physical.copper.stubLength).padStart(9)}  ${`${mm(b.xmax - b.xmin, 2)} × ${mm(b.ymax - b.ymin, 2)}`.padEnd(16)} ${margin.padStart(11)}  ${v.fit.fits ? 'yes' : `no (${v.fit.limitedBy})`}`,
    );
  }
  if (run.fit.changed.length > 0) lines.push(`changed to fit: ${run.fit.changed.join(', ')}`);
  return `${lines.join('\n')}\n`;
}
