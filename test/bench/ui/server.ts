// Builds the app for the UI benchmark into a folder of its own (never dist/, which other builds
// use) and serves it with `vite preview` on a free port, as the browser tests do.
import { spawnSync } from 'node:child_process';
import { resolve } from 'node:path';
import { startPreview, type PreviewServer } from '../../browser/server';

const root = resolve(import.meta.dirname, '../../..');
const viteBin = resolve(root, 'node_modules/vite/bin/vite.js');

/** Everything the UI benchmark writes: the build, Lighthouse reports, profiles. */
export const benchOutputDir = resolve(root, 'test-output/bench-ui');
export const benchDistDir = resolve(benchOutputDir, 'dist');

/**
 * A production build with Vite's manifest (.vite/manifest.json, outside the precache), which
 * tells which chunks the entry imports statically: what must load before the first paint.
 * With `sourcemap`, each script gets a .map file (for bundle-modules.ts; the code is the same).
 * Throws with Vite's output when the build fails.
 */
export function buildForBench(outDir = benchDistDir, { sourcemap = false } = {}): void {
  const args = ['build', '--outDir', outDir, '--emptyOutDir', '--manifest', '--logLevel', 'warn'];
  const r = spawnSync(process.execPath, [viteBin, ...args, ...(sourcemap ? ['--sourcemap'] : [])], {
    cwd: root,
    env: { ...process.env, NODE_ENV: 'production' },
    encoding: 'utf8',
  });
  if (r.status !== 0) {
    throw new Error(`vite build failed (exit ${r.status}):\n${r.stdout}\n${r.stderr}`);
  }
}

export function serveBench(outDir = benchDistDir): Promise<PreviewServer> {
  return startPreview(outDir);
}
