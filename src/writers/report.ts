// report.md: a design record for a person — what was asked, what was chosen and why, how each
// length was corrected, what the model predicts, and the cautions that go with RF hardware.
import type { Artifact, Section } from '../seams.js';
import type { DesignRecordInput } from './json.js';
import { fixed, ghz, impedanceText, mm, modelS11Text, signedPercent, trimmed } from '../format.js';

export type ReportInput = DesignRecordInput;

export const CAUTIONS: readonly string[] = [
  'This design comes from closed-form models. Verify it by EM simulation or by measurement before it is used in a product or connected to a transmitter.',
  'RF power can burn skin and heat parts and boards; exposure to RF fields has legal limits. Follow your local RF-exposure and electrical-safety rules.',
  'Radiated emissions and the use of radio frequencies are regulated. Operate only within the limits of your local regulations and licences, and defer to licensed practice where it applies.',
];

const ROLE_LABEL: Record<Section['role'], string> = {
  series: 'series line (load plane to stub centre-line)',
  stub: 'stub (line edge to end)',
  'lead-source': 'source lead (stub centre-line to source plane)',
  'lead-load': 'load lead',
};

export function writeReport(input: ReportInput): Artifact {
  const { spec, ideal, physical, response, geometry } = input;
  const s = physical.solution;
  const out: string[] = [];
  out.push(`# Match design: ${spec.name}`, '');
  out.push(`Made by tunestrip ${input.version}.`, '');
  out.push('## Cautions', '', ...CAUTIONS.map((c) => `- ${c}`), '');
  out.push('## Request', '');
  out.push('| quantity | value |', '| --- | --- |');
  out.push(`| design frequency | ${ghz(spec.frequency)} |`);
  out.push(`| load impedance | ${impedanceText(spec.load.re, spec.load.im)} Ω |`);
  out.push(`| target at the source port | ${impedanceText(spec.target.re, spec.target.im)} Ω |`);
  out.push(`| series line / stub impedance | ${trimmed(spec.lineZ0, 3)} Ω / ${trimmed(spec.stubZ0, 3)} Ω |`);
  out.push(`| stub requested | ${spec.stub}, ${spec.style} |`);
  const sub = spec.substrate;
  out.push(`| substrate | ${sub.preset ? `${sub.preset}: ` : ''}εr ${trimmed(sub.er, 4)}, h ${mm(sub.height, 4)} mm, copper ${trimmed(sub.copper * 1e6, 2)} µm, tan δ ${trimmed(sub.tanDelta, 5)} |`);
  out.push('');
  out.push('## Chosen match', '');
  if (ideal.alreadyMatched) {
    out.push('The load already presents the target at the design frequency: no stub is needed, a plain line is drawn.', '');
  } else {
    out.push(
      `Branch ${s.branch}, ${s.termination}-circuit ${s.style === 'balanced' ? 'balanced stubs' : 'stub'}: stub ${fixed(s.stubWl, 5)} λ ${s.style === 'balanced' ? 'each ' : ''}at ${fixed(s.positionWl, 5)} λ from the load (ideal lines).`,
      '',
    );
  }
  out.push('| section | width (mm) | Z0 (Ω) | εeff | ideal length (mm) | drawn length (mm) |', '| --- | --- | --- | --- | --- | --- |');
  for (const sec of physical.sections) {
    out.push(`| ${ROLE_LABEL[sec.role]} | ${mm(sec.width)} | ${fixed(sec.z0, 2)} | ${fixed(sec.epsEff, 4)} | ${mm(sec.idealLength)} | ${mm(sec.length)} |`);
  }
  out.push('');
  out.push('### Length corrections', '');
  for (const sec of physical.sections) {
    for (const c of sec.corrections) {
      if (Math.abs(c.delta) < 5e-10) continue;
      out.push(`- ${sec.role}: ${c.delta >= 0 ? '+' : ''}${mm(c.delta)} mm, ${c.model}`);
    }
  }
  if (physical.via) {
    out.push(`- via: ${physical.via.count} × ${mm(physical.via.drill)} mm drill in ${mm(physical.via.pad)} mm pads, ${fixed(physical.via.inductance * 1e9, 4)} nH together`);
  }
  out.push('');
  out.push('## All ideal branches', '');
  out.push('| branch | termination | position (λ) | stub (λ) | residual |Γ| |', '| --- | --- | --- | --- | --- |');
  for (const b of ideal.solutions) {
    out.push(`| ${b.branch} | ${b.termination} | ${fixed(b.positionWl, 5)} | ${fixed(b.stubWl, 5)} | ${b.residualGamma.toExponential(1)} |`);
  }
  out.push('');
  out.push('## Predicted response', '');
  out.push(`- |S11| at ${ghz(spec.frequency)} in the physical model: ${modelS11Text(physical.s11DbAtF0)}`);
  out.push(
    response.band10dB
      ? `- return loss ≥ 10 dB from ${ghz(response.band10dB.low)} to ${ghz(response.band10dB.high)} (within the swept ${ghz(spec.sweep.start)} to ${ghz(spec.sweep.stop)})`
      : '- return loss does not reach 10 dB at the design frequency',
  );
  out.push('- the load impedance is held constant over the band; a real device changes with frequency.');
  if (response.sheetEquivalent) {
    out.push(
      `- the lines are sized for ${trimmed(spec.substrate.copper * 1e6, 2)} µm copper. An EM model that draws this artwork as a zero-thickness sheet sees other lines (thickness lowers εeff and Z0) and should put the return-loss minimum at ${ghz(response.sheetEquivalent.minimumFrequency)} (${signedPercent(response.sheetEquivalent.offset)}), not at ${ghz(spec.frequency)}; to compare like with like, model the copper's thickness or design with \`copper: 0\`.`,
    );
  }
  const tol = response.tolerance;
  if (tol) {
    const t = spec.tolerance;
    out.push('', '### Fabrication spread', '');
    out.push(
      `${tol.runs} seeded runs (seed ${tol.seed}), uniform within ± width ${mm(t.width)} mm (every line), εr ${trimmed(t.erFraction * 100, 2)} %, height ${trimmed(t.heightFraction * 100, 2)} %, copper ${trimmed(t.copperFraction * 100, 2)} %; drawn lengths kept.`,
      '',
    );
    out.push(`- |S11| at f0: median ${fixed(tol.s11DbAtF0.median, 1)} dB, 95th percentile ${fixed(tol.s11DbAtF0.p95, 1)} dB, worst ${fixed(tol.s11DbAtF0.worst, 1)} dB`);
    out.push(`- return loss ≥ 10 dB at f0 in ${fixed(tol.yield10dB * 100, 1)} % of runs`);
    out.push(`- frequency of the return-loss peak: ${ghz(tol.minimumFrequency.p5)} to ${ghz(tol.minimumFrequency.p95)} (5th to 95th percentile)`);
  }
  out.push(`- footprint: x ${mm(geometry.bounds.xmin)} to ${mm(geometry.bounds.xmax)} mm, y ${mm(geometry.bounds.ymin)} to ${mm(geometry.bounds.ymax)} mm`);
  out.push('');
  out.push('## Placement', '');
  if (Number.isFinite(input.fit.margin)) {
    out.push(`- ${input.fit.fits ? 'fits' : 'does not fit'} the allowed space: worst margin ${mm(input.fit.margin)} mm, set by ${input.fit.limitedBy}`);
    out.push(input.fit.changed.length ? `- changed from the preferred layout to fit: ${input.fit.changed.join(', ')}` : '- the preferred layout fits as it is');
  } else {
    out.push('- the spec sets no area or keep-outs');
  }
  out.push('');
  out.push('## Diagnostics', '');
  if (input.diagnostics.length === 0) out.push('None.');
  for (const d of input.diagnostics) out.push(`- ${d.severity} ${d.code} at ${d.where}: ${d.message}`);
  out.push('');
  return { path: 'report.md', mediaType: 'text/markdown', text: out.join('\n') };
}
