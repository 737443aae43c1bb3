import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { errorOf } from '../helpers/errors.js';
import { repoPresets, repoRoot, yamlFiles } from '../helpers/templates.js';
import { TunestripError } from '../../src/diagnostics.js';
import { listFields, parseFabPreset, parseSpec, parseSubstratePreset, type Presets } from '../../src/spec/parse.js';
import { closest, editDistance } from '../../src/spec/suggest.js';

const root = repoRoot;
const presets: Presets = repoPresets();
const examples = yamlFiles('templates/examples');


const minimal = 'name: t\nfrequency: 2.4 GHz\nload: 30-j10\nsubstrate:\n  er: 4.4\n  height: 1.6 mm\n';

describe('example specs', () => {
  it('there are the three examples', () => {
    expect(Object.keys(examples).sort()).toEqual(['mixer-10g', 'receiver-5g8', 'sensor-915']);
  });
  it.each(Object.entries(examples))('%s parses without warnings', (name, text) => {
    const { spec, diagnostics } = parseSpec(text, presets, `${name}.yaml`);
    expect(diagnostics).toEqual([]);
    expect(spec.name).toBe(name);
    expect(spec.sweep.start).toBeLessThan(spec.frequency);
    expect(spec.sweep.stop).toBeGreaterThan(spec.frequency);
  });
  it('receiver-5g8 holds the values written in it, in SI', () => {
    const { spec } = parseSpec(examples['receiver-5g8'] ?? '', presets);
    expect(spec.frequency).toBe(5.8e9);
    expect(spec.load).toEqual({ re: 22, im: -31 });
    expect(spec.substrate).toEqual({ preset: 'hydrocarbon-ceramic-0.51', er: 3.66, height: 0.508e-3, copper: 35e-6, tanDelta: 0.0037, roughness: 1e-6, conductivity: 5.8e7 });
    expect(spec.area).toEqual({ kind: 'rect', x: [-1e-3, 25e-3], y: [-4e-3, 14e-3] });
    expect(spec.keepouts).toEqual([{ kind: 'circle', center: [22e-3, 11e-3], radius: 1.5e-3 }]);
    expect(spec.clearance).toBe(0.2e-3);
  });
  it('mixer-10g is a short-stub design with two vias', () => {
    const { spec } = parseSpec(examples['mixer-10g'] ?? '', presets);
    expect(spec.stub).toBe('short');
    expect(spec.fab.viasPerStub).toBe(2);
    expect(spec.stubSide).toBe('right');
  });
});

describe('presets', () => {
  it.each(Object.entries(presets.substrates))('substrate %s parses and carries the fabricator note', (name, text) => {
    const s = parseSubstratePreset(text, name);
    expect(s.preset).toBe(name);
    expect(s.er).toBeGreaterThanOrEqual(1);
    expect(text).toMatch(/^note: typical, check your fabricator's stackup$/m);
  });
  it('substrate presets hold the stated typical values (common practice, no source)', () => {
    const fr4 = parseSubstratePreset(presets.substrates['fr4-1.6'] ?? '', 'fr4-1.6');
    expect([fr4.er, fr4.height, fr4.copper, fr4.tanDelta]).toEqual([4.4, 1.6e-3, 35e-6, 0.02]);
    const ptfe = parseSubstratePreset(presets.substrates['ptfe-glass-0.79'] ?? '', 'ptfe-glass-0.79');
    expect([ptfe.er, ptfe.height, ptfe.tanDelta]).toEqual([2.2, 0.787e-3, 0.0009]);
    // Design Dk 3.66 for the hydrocarbon-ceramic laminate: physics.md §9.3, common practice, no source.
    const hc = parseSubstratePreset(presets.substrates['hydrocarbon-ceramic-0.51'] ?? '', 'hydrocarbon-ceramic-0.51');
    expect([hc.er, hc.height, hc.copper, hc.tanDelta]).toEqual([3.66, 0.508e-3, 35e-6, 0.0037]);
    const al = parseSubstratePreset(presets.substrates['alumina-0.635'] ?? '', 'alumina-0.635');
    expect([al.er, al.height]).toEqual([9.8, 0.635e-3]);
  });
  it('the standard fab preset equals the built-in defaults', () => {
    const standard = parseFabPreset(presets.fab.standard ?? '', 'standard');
    const { spec } = parseSpec(minimal, presets);
    expect(standard).toEqual(spec.fab);
    // IPC-6012 class 3 external annular ring 0.05 mm (physics.md §9.1 [R], from a PCB-fab article).
    expect(spec.fab.minAnnularRing).toBe(0.05e-3);
  });
  it('the fine fab preset is finer than standard', () => {
    const fine = parseFabPreset(presets.fab.fine ?? '', 'fine');
    const standard = parseFabPreset(presets.fab.standard ?? '', 'standard');
    expect(fine.minTrace).toBeLessThan(standard.minTrace);
    expect(fine.viaDrill).toBeLessThan(standard.viaDrill);
    // The pad must leave the ring it asks for (pad − drill ≥ 2 × ring).
    expect(fine.viaPad - fine.viaDrill).toBeGreaterThanOrEqual(2 * fine.minAnnularRing);
  });
  it('explicit keys override a preset', () => {
    const { spec } = parseSpec('name: t\nfrequency: 1 GHz\nload: 50\nsubstrate:\n  preset: fr4-1.6\n  er: 4.2\n  copper: 1 oz\n', presets);
    expect(spec.substrate.preset).toBe('fr4-1.6');
    expect(spec.substrate.er).toBe(4.2);
    expect(spec.substrate.height).toBe(1.6e-3);
    expect(spec.substrate.copper).toBeCloseTo(34.8e-6, 15);
    expect(spec.defaulted.filter((p) => p.startsWith('substrate.'))).toEqual([]);
  });
  it('a broken preset text is reported against the preset', () => {
    const broken: Presets = { substrates: { odd: 'er: 4.4\nheight: 1.6\n' }, fab: {} };
    const error = errorOf(() => parseSpec('name: t\nfrequency: 1 GHz\nload: 50\nsubstrate: { preset: odd }\n', broken));
    expect(error.diagnostic.where).toBe('substrates/odd.height');
    expect(error.diagnostic.message).toContain('has no unit');
  });
  it('prototype names are not presets', () => {
    const error = errorOf(() => parseSpec('name: t\nfrequency: 1 GHz\nload: 50\nsubstrate: { preset: constructor }\n', presets));
    expect(error.diagnostic.where).toBe('substrate.preset');
  });
});

describe('defaults', () => {
  it('are filled from the field table and listed as JSON paths', () => {
    const { spec, diagnostics } = parseSpec(minimal, presets);
    expect(diagnostics).toEqual([]);
    expect(spec.target).toEqual({ re: 50, im: 0 });
    expect([spec.lineZ0, spec.stubZ0, spec.stub, spec.style, spec.stubSide]).toEqual([50, 50, 'best', 'single', 'left']);
    expect(spec.substrate).toEqual({ er: 4.4, height: 1.6e-3, copper: 35e-6, tanDelta: 0, roughness: 0, conductivity: 5.8e7 });
    expect(spec.leads).toEqual({ load: 0, source: 2e-3 });
    expect(spec.keepouts).toEqual([]);
    expect(spec.clearance).toBe(0);
    expect(spec.area).toBeUndefined();
    // f0 ± 20 %, 201 points.
    expect(spec.sweep).toEqual({ start: 0.8 * 2.4e9, stop: 1.2 * 2.4e9, points: 201 });
    expect([...spec.defaulted].sort()).toEqual(
      [
        'target', 'line_z0', 'stub_z0', 'stub', 'style', 'stub_side',
        'substrate.copper', 'substrate.tan_delta', 'substrate.roughness', 'substrate.conductivity',
        'fab.min_trace', 'fab.min_space', 'fab.via_drill', 'fab.via_pad', 'fab.min_annular_ring', 'fab.copper_to_edge', 'fab.vias_per_stub',
        'leads.load', 'leads.source', 'place.x', 'place.y', 'place.rotation_deg', 'place.mirror', 'keepouts', 'clearance', 'sweep.start', 'sweep.stop', 'sweep.points', 'tolerance.width', 'tolerance.er_fraction', 'tolerance.height_fraction', 'tolerance.copper_fraction', 'tolerance.runs', 'tolerance.seed',
      ].sort(),
    );
  });
  it('stub_z0 follows line_z0', () => {
    const { spec } = parseSpec(`${minimal}line_z0: 70 ohm\n`, presets);
    expect(spec.stubZ0).toBe(70);
    expect(spec.defaulted).toContain('stub_z0');
    expect(spec.defaulted).not.toContain('line_z0');
  });
  it('a partial sweep keeps the given end', () => {
    const { spec } = parseSpec(`${minimal}sweep: { stop: 3 GHz }\n`, presets);
    expect(spec.sweep).toEqual({ start: 0.8 * 2.4e9, stop: 3e9, points: 201 });
  });
  it('listFields documents every key with its default', () => {
    const fields = listFields();
    const byPath = new Map(fields.map((f) => [f.path, f]));
    for (const path of ['name', 'frequency', 'load', 'substrate.er', 'substrate.preset', 'fab.vias_per_stub', 'leads.source', 'area', 'keepouts', 'sweep.points']) {
      expect(byPath.has(path), path).toBe(true);
    }
    expect(byPath.get('substrate.copper')?.default).toBe('35 um');
    expect(byPath.get('leads.source')?.default).toBe('2 mm');
    expect(byPath.get('frequency')?.default).toBe('required');
    expect(fields.every((f) => f.doc.length > 0 && !f.doc.includes('\n'))).toBe(true);
  });
});

describe('reading the file', () => {
  it('accepts JSON', () => {
    const json = JSON.stringify({ name: 'j', frequency: '5.8 GHz', load: '22-j31', substrate: { preset: 'fr4-1.6' }, area: { polygon: [[0, 0], ['10 mm', 0], ['0', '10 mm']] } });
    const { spec } = parseSpec(json, presets, 'j.json');
    expect(spec.load).toEqual({ re: 22, im: -31 });
    expect(spec.area).toEqual({ kind: 'polygon', points: [[0, 0], [0.01, 0], [0, 0.01]] });
  });
  it('stores a polygon without a repeated closing point', () => {
    const { spec } = parseSpec(`${minimal}area:\n  polygon: [[0, 0], [10 mm, 0], [0, 10 mm], [0, 0]]\n`, presets);
    expect(spec.area).toEqual({ kind: 'polygon', points: [[0, 0], [0.01, 0], [0, 0.01]] });
  });
  it('reads impedances in the trade notation from YAML plain scalars', () => {
    expect(parseSpec(minimal.replace('30-j10', '-j5'), presets).spec.load).toEqual({ re: 0, im: -5 });
    expect(parseSpec(minimal.replace('30-j10', '12.5 + j4 ohm'), presets).spec.load).toEqual({ re: 12.5, im: 4 });
    expect(parseSpec(`${minimal}target: 75\n`, presets).spec.target).toEqual({ re: 75, im: 0 });
  });
  it('accepts a byte-order mark and CRLF line ends', () => {
    const { spec } = parseSpec(`\ufeff${minimal.replace(/\n/g, '\r\n')}`, presets);
    expect(spec.frequency).toBe(2.4e9);
  });
  it('warns about unknown keys with a suggestion, at every level', () => {
    const { diagnostics } = parseSpec(`${minimal}  tanDelta: 0.01\nlineZ0: 50\nkeepouts:\n  - { x: [0, 1 mm], y: [0, 1 mm], radus: 1 mm }\nwhatever: 1\n`, presets);
    const byWhere = Object.fromEntries(diagnostics.map((d) => [d.where, d]));
    expect(Object.keys(byWhere).sort()).toEqual(['keepouts[0].radus', 'lineZ0', 'substrate.tanDelta', 'whatever']);
    expect(diagnostics.every((d) => d.code === 'spec.unknown-key' && d.severity === 'warning')).toBe(true);
    expect(byWhere['substrate.tanDelta']?.message).toContain('did you mean tan_delta?');
    expect(byWhere.lineZ0?.message).toContain('did you mean line_z0?');
    expect(byWhere['keepouts[0].radus']?.message).toContain('did you mean radius?');
    expect(byWhere.whatever?.message).toContain('allowed: name, frequency');
  });
  it('refuses a key of a group written at the wrong level, naming the group it belongs in', () => {
    // A fab rule or a substrate value where it would be ignored would draw copper to other rules.
    const top = errorOf(() => parseSpec(`${minimal}via_drill: 0.4 mm\n`, presets, 'board.yaml'));
    expect(top.diagnostic.code).toBe('spec.invalid');
    expect(top.diagnostic.where).toBe('via_drill');
    expect(top.message).toMatch(/^via_drill: belongs in fab:, as fab: \{ via_drill: … \}; where it stands it would be ignored \(board\.yaml:\d+\)$/);
    const inGroup = errorOf(() => parseSpec(`${minimal}  min_trace: 0.2 mm\n`, presets));
    expect(inGroup.diagnostic.where).toBe('substrate.min_trace');
    expect(inGroup.message).toContain('belongs in fab:');
    const er = errorOf(() => parseSpec(`${minimal}er: 3.0\n`, presets));
    expect(er.message).toContain('belongs in substrate:');
    // A plain typo stays a warning with a suggestion (above), and preset or note alone are left to it.
    expect(parseSpec(`${minimal}preset: standard\n`, presets).diagnostics.map((d) => d.where)).toEqual(['preset']);
  });
  it('names the file and line of a bad value', () => {
    const error = errorOf(() => parseSpec(minimal.replace('1.6 mm', '1.6 furlongs'), presets, 'board.yaml'));
    expect(error.message).toBe('substrate.height: "1.6 furlongs" is not a length; use mm, um, mil or m (e.g. 0.508 mm) (board.yaml:6)');
  });
  it('refuses a file over 1 MiB', () => {
    const huge = `${minimal}# ${'x'.repeat(1024 * 1024)}\n`;
    const error = errorOf(() => parseSpec(huge, presets, 'huge.yaml'));
    expect(error.diagnostic.code).toBe('spec.too-large');
    expect(error.diagnostic.where).toBe('huge.yaml');
  });
  it('counts bytes, not characters, against the limit', () => {
    // 400 Ki three-byte characters: 1.2 MiB of UTF-8 in fewer than 1 Mi characters.
    const wide = `${minimal}# ${'€'.repeat(400 * 1024)}\n`;
    expect(wide.length).toBeLessThan(1024 * 1024);
    expect(errorOf(() => parseSpec(wide, presets)).diagnostic.code).toBe('spec.too-large');
  });
  it('does not blow up on alias bombs', () => {
    const bomb = ['a: &a [x, x, x, x, x, x, x, x, x]', ...Array.from({ length: 8 }, (_, i) => `${String.fromCharCode(98 + i)}: &${String.fromCharCode(98 + i)} [*${String.fromCharCode(97 + i)}, *${String.fromCharCode(97 + i)}, *${String.fromCharCode(97 + i)}, *${String.fromCharCode(97 + i)}, *${String.fromCharCode(97 + i)}, *${String.fromCharCode(97 + i)}, *${String.fromCharCode(97 + i)}, *${String.fromCharCode(97 + i)}, *${String.fromCharCode(97 + i)}]`)].join('\n');
    const error = errorOf(() => parseSpec(bomb, presets, 'bomb.yaml'));
    expect(error.diagnostic.code).toBe('spec.syntax');
  });
  it('does not change the presets it is given', () => {
    const copy = structuredClone(presets);
    parseSpec(examples['receiver-5g8'] ?? '', presets);
    expect(presets).toEqual(copy);
  });
});

describe('bad-spec corpus', () => {
  const dir = join(root, 'test', 'fixtures', 'bad-specs');
  const cases = readdirSync(dir)
    .filter((f) => f.endsWith('.yaml'))
    .map((f) => f.replace(/\.yaml$/, ''))
    .sort();
  it('has at least 25 cases, each with its expectation', () => {
    expect(cases.length).toBeGreaterThanOrEqual(25);
  });
  it.each(cases)('%s', (name) => {
    const text = readFileSync(join(dir, `${name}.yaml`), 'utf8');
    const expected = JSON.parse(readFileSync(join(dir, `${name}.expect.json`), 'utf8')) as { where: string; message_contains: string };
    const error = errorOf(() => parseSpec(text, presets, `${name}.yaml`));
    expect(error.diagnostic.where).toBe(expected.where);
    expect(error.diagnostic.message).toContain(expected.message_contains);
    expect(error.diagnostic.severity).toBe('error');
    // One line, naming the field (or file position) first.
    expect(error.message).not.toMatch(/[\n\r]/);
    expect(error.message.startsWith(`${expected.where}: `)).toBe(true);
  });
});

describe('suggestions', () => {
  it('edit distance matches the textbook example', () => {
    // kitten → sitting is 3 edits (Levenshtein distance; the classic example in Wagner & Fischer-style
    // treatments, from memory).
    expect(editDistance('kitten', 'sitting')).toBe(3);
    // A swap of neighbours counts once (optimal string alignment; Damerau 1964, from memory).
    expect(editDistance('opne', 'open')).toBe(1);
    expect(editDistance('', 'abc')).toBe(3);
  });
  it('suggests only near words', () => {
    expect(closest('frequncy', ['name', 'frequency', 'load'])).toBe('frequency');
    expect(closest('colour', ['name', 'frequency', 'load'])).toBeUndefined();
  });
  it('warns about a frequency without a unit', () => {
    const { spec, diagnostics } = parseSpec(minimal.replace('2.4 GHz', '5.8'), presets);
    expect(spec.frequency).toBe(5.8);
    expect(diagnostics.map((d) => [d.code, d.where, d.severity])).toEqual([['spec.bare-number', 'frequency', 'warning']]);
    expect(parseSpec(minimal.replace('2.4 GHz', '2.4e9'), presets).diagnostics).toEqual([]);
  });
});
