// Runs every test (unit, behaviour, real-browser) and ends with "N passed, N failed".
// On a fresh machine it installs Debian's Chromium first when it is missing and we are
// root (as in CI); the browser tests drive that Chromium through playwright-core.
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, mkdirSync } from 'node:fs';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

function run(cmd, args, opts = {}) {
  const r = spawnSync(cmd, args, { stdio: 'inherit', ...opts });
  return r.status ?? 1;
}

if (!existsSync(CHROMIUM)) {
  if (process.getuid?.() === 0) {
    console.log("Chromium is missing: installing Debian's package (about 30 s).");
    run('apt-get', ['update', '-qq']);
    run('apt-get', ['install', '-y', '-qq', 'chromium'], {
      env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
    });
  } else {
    console.log(
      `Chromium not found at ${CHROMIUM}; install it (apt-get install chromium) or set CHROMIUM_PATH.`,
    );
  }
}

mkdirSync('test-output', { recursive: true });
const report = 'test-output/vitest-results.json';
const status = run('npx', [
  'vitest',
  'run',
  '--reporter=default',
  '--reporter=json',
  `--outputFile=${report}`,
]);

let passed = 0;
let failed = 0;
if (existsSync(report)) {
  const json = JSON.parse(readFileSync(report, 'utf8'));
  passed = json.numPassedTests ?? 0;
  failed = (json.numFailedTests ?? 0) + (status !== 0 && (json.numFailedTests ?? 0) === 0 ? 1 : 0);
} else {
  failed = 1;
}
console.log(`${passed} passed, ${failed} failed`);
process.exit(status === 0 && failed === 0 ? 0 : 1);
