// Runs vitest and prints the plain closing line "N passed, N failed" that CI reads.
import { spawnSync } from 'node:child_process';
import { readFileSync, rmSync } from 'node:fs';

const report = '.vitest.json';
rmSync(report, { force: true });
const args = ['vitest', 'run', '--reporter=default', '--reporter=json', `--outputFile=${report}`, ...process.argv.slice(2)];
const run = spawnSync('npx', args, { stdio: 'inherit' });
let passed = 0;
let failed = 0;
let skipped = 0;
try {
  const json = JSON.parse(readFileSync(report, 'utf8'));
  passed = json.numPassedTests;
  failed = json.numFailedTests;
  skipped = json.numPendingTests + (json.numTodoTests ?? 0);
} catch {
  failed = Math.max(failed, 1);
}
console.log(`${passed} passed, ${failed} failed, ${skipped} skipped`);
process.exit(run.status === 0 && failed === 0 ? 0 : 1);
