// The build step that puts V8's compile hint on the first line of one chunk: run through a real
// Vite build of two small modules, with source maps, as the app's build runs it.
import { mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { build } from 'vite';
import { describe, expect, test } from 'vitest';
import { COMPILE_HINT, compileHint } from '../../scripts/compile-hint';
import { moduleAt, readScriptMap } from '../bench/ui/source-map';

/**
 * Builds an entry that imports `shared.js` at once and `later.js` on demand, hinting `targets`;
 * returns the output folder.
 */
async function buildFixture(targets: readonly string[]): Promise<string> {
  const root = mkdtempSync(join(tmpdir(), 'compile-hint-'));
  writeFileSync(
    join(root, 'index.html'),
    '<!doctype html><html><body><script type="module" src="./main.js"></script></body></html>',
  );
  writeFileSync(
    join(root, 'main.js'),
    "import { twice } from './shared.js';\n" +
      'document.body.textContent = String(twice(21));\n' +
      "document.body.onclick = () => import('./later.js').then((m) => m.thrice(2));\n",
  );
  writeFileSync(join(root, 'shared.js'), 'export function twice(x) {\n  return x * 2;\n}\n');
  writeFileSync(join(root, 'later.js'), 'export function thrice(x) {\n  return x * 3;\n}\n');
  const outDir = join(root, 'dist');
  await build({
    root,
    configFile: false,
    logLevel: 'silent',
    plugins: [compileHint(targets)],
    build: {
      outDir,
      sourcemap: true,
      rolldownOptions: {
        output: {
          codeSplitting: {
            groups: [{ name: 'shared', test: (id: string) => id.endsWith('/shared.js') }],
          },
        },
      },
    },
  });
  return join(outDir, 'assets');
}

describe('compileHint', () => {
  test('starts the named chunk with the hint, leaves the others alone, and keeps its source map true', async () => {
    const assets = await buildFixture(['shared']);
    const scripts = readdirSync(assets).filter((f) => f.endsWith('.js'));
    const hinted = scripts.filter((f) =>
      readFileSync(join(assets, f), 'utf8').startsWith(`${COMPILE_HINT}\n`),
    );
    expect(hinted).toHaveLength(1);
    expect(hinted[0]).toMatch(/^shared-/);
    // Only its first line: nowhere else, in no other file.
    for (const f of scripts) {
      const count = readFileSync(join(assets, f), 'utf8').split(COMPILE_HINT).length - 1;
      expect(count).toBe(f === hinted[0] ? 1 : 0);
    }
    // The source map still puts the multiplication where shared.js has it.
    const path = join(assets, hinted[0]);
    const map = readScriptMap(path);
    const lines = map.code.split('\n');
    const line = lines.findIndex((l) => l.includes('*2'));
    expect(line).toBeGreaterThan(0);
    expect(moduleAt(map, line, lines[line].indexOf('*2'))).toMatch(/shared\.js$/);
    expect(map.lines[0]).toEqual([]);
  }, 60_000);

  test('also finds a chunk by a module it holds, and fails the build for a target with no chunk', async () => {
    const assets = await buildFixture(['shared', '/later.js']);
    const hinted = readdirSync(assets)
      .filter((f) => f.endsWith('.js'))
      .filter((f) => readFileSync(join(assets, f), 'utf8').startsWith(`${COMPILE_HINT}\n`))
      .sort();
    expect(hinted).toHaveLength(2);
    expect(hinted[0]).toMatch(/^later-/);
    expect(hinted[1]).toMatch(/^shared-/);
    await expect(buildFixture(['shared', '/gone.js'])).rejects.toThrow(
      /compile hint: no chunk for \/gone\.js/,
    );
  }, 60_000);
});
