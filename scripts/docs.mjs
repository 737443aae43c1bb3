// Regenerates the README's worked example from the bundled example: docs/receiver-5g8-layout.svg
// and the quoted summary block. Run with `npm run docs` (builds first).
import { readFileSync, writeFileSync, readdirSync } from 'node:fs';
import { join, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { designFromText } from '../dist/index.js';
import { designSummary } from '../dist/cli/print.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const folder = (f) => Object.fromEntries(readdirSync(join(root, 'templates', f)).filter((n) => n.endsWith('.yaml')).sort().map((n) => [n.replace(/\.yaml$/, ''), readFileSync(join(root, 'templates', f, n), 'utf8')]));
const version = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')).version;
const run = designFromText(readFileSync(join(root, 'templates', 'examples', 'receiver-5g8.yaml'), 'utf8'), { substrates: folder('substrates'), fab: folder('fab') }, { version });
writeFileSync(join(root, 'docs', 'receiver-5g8-layout.svg'), run.artifacts.find((a) => a.path === 'layout.svg').text);
const summary = designSummary(run, run.artifacts.map((a) => a.path), 'out/receiver-5g8').trimEnd();
const readme = readFileSync(join(root, 'README.md'), 'utf8');
const start = readme.indexOf('```\nreceiver-5g8:');
const end = readme.indexOf('```', start + 4);
if (start < 0 || end < 0) throw new Error('README: worked-example summary block not found');
writeFileSync(join(root, 'README.md'), `${readme.slice(0, start)}\`\`\`\n${summary}\n${readme.slice(end)}`);
console.log('docs: wrote docs/receiver-5g8-layout.svg and the README summary');
