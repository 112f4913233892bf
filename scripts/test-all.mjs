// Runs every check CI makes and ends with "N passed, N failed": the type checks (the app, and
// the core alone without the DOM library), Prettier's check of every file, then every test
// (unit, behaviour, real-browser). Each of the first three counts as one test in that line.
// On a fresh machine it installs Debian's Chromium first when it is missing and we are root
// (as in CI); the browser tests drive that Chromium through playwright-core.
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

let passed = 0;
let failed = 0;

/** A check that is one command: it passes when the command exits 0. */
function check(name, cmd, args) {
  console.log(`\n${name}: ${cmd} ${args.join(' ')}`);
  const ok = run(cmd, args) === 0;
  console.log(`${ok ? 'passed' : 'FAILED'}: ${name}`);
  if (ok) passed++;
  else failed++;
}

check('type check of the app', 'npx', ['tsc', '--noEmit', '-p', 'tsconfig.json']);
check('type check of the core without the DOM', 'npx', [
  'tsc',
  '--noEmit',
  '-p',
  'tsconfig.core.json',
]);
check('formatting (Prettier)', 'npx', ['prettier', '--check', '.']);

mkdirSync('test-output', { recursive: true });
const report = 'test-output/vitest-results.json';
const status = run('npx', [
  'vitest',
  'run',
  '--reporter=default',
  '--reporter=json',
  `--outputFile=${report}`,
]);

if (existsSync(report)) {
  const json = JSON.parse(readFileSync(report, 'utf8'));
  const testsFailed = json.numFailedTests ?? 0;
  passed += json.numPassedTests ?? 0;
  // A run that failed without a failed test (a file that did not load) still counts as one.
  failed += testsFailed + (status !== 0 && testsFailed === 0 ? 1 : 0);
} else {
  failed += 1;
}
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed === 0 ? 0 : 1);
