// The layout's one rule, checked on every import in src/ (DEVELOPERS.md, "What each folder may
// import"): imports go down only, screens do not reach into each other, only the core's public
// entry is used from outside it, and each layer uses only the packages that fit its job.
// The compiler checks the other half: tsconfig.core.json compiles the core without the DOM.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import ts from 'typescript';
import { describe, expect, test } from 'vitest';

const SRC = path.resolve(__dirname, '../src');

/** Layers from the top down: a file may import its own layer (within limits) and any below. */
const RANK: Record<string, number> = {
  app: 6,
  screens: 5,
  ui: 4,
  words: 3,
  state: 2,
  render: 1,
  audio: 1,
  core: 0,
};

/** Packages each layer may use; the rest of src uses none beyond these. */
const PACKAGES: Record<string, readonly string[]> = {
  // preact-render-to-string: only app/prerender.tsx, run at build time (scripts/prerender.ts).
  app: [
    'preact',
    'preact/hooks',
    '@preact/signals',
    'virtual:pwa-register/preact',
    'preact-render-to-string',
  ],
  screens: ['preact', 'preact/hooks', '@preact/signals'],
  ui: ['preact', 'preact/hooks', '@preact/signals', 'uplot', 'uplot/dist/uPlot.min.css'],
  words: [],
  state: ['@preact/signals', 'idb-keyval'],
  render: [],
  audio: [],
  core: ['fft.js'],
};

interface Import {
  from: string;
  /** The file imported (relative specifiers), or the package name. */
  to: string;
  relative: boolean;
}

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    if (statSync(full).isDirectory()) return sourceFiles(full);
    return /\.(ts|tsx)$/.test(name) ? [full] : [];
  });
}

function resolve(from: string, spec: string): string {
  const base = path.resolve(path.dirname(from), spec);
  for (const ending of ['', '.ts', '.tsx', '/index.ts', '/index.tsx']) {
    const file = base + ending;
    try {
      if (statSync(file).isFile()) return file;
    } catch {
      // not this ending
    }
  }
  return base;
}

/** Every import and re-export of a file, static or dynamic, as the compiler's own scanner reads them. */
function importsOf(file: string): Import[] {
  const scan = ts.preProcessFile(readFileSync(file, 'utf8'), true, true);
  return scan.importedFiles.map(({ fileName: spec }) => {
    const relative = spec.startsWith('.');
    return { from: file, to: relative ? resolve(file, spec) : spec, relative };
  });
}

/** 'screens', 'core', …: the top folder of src a file lies in. */
const layerOf = (file: string) => path.relative(SRC, file).split(path.sep)[0];
/** The screen a file belongs to ('check', 'camera', …), for files in src/screens. */
const screenOf = (file: string) => path.relative(SRC, file).split(path.sep)[1];
const shown = (file: string) => path.relative(SRC, file);

const files = sourceFiles(SRC);
const imports = files.flatMap(importsOf);
const local = imports.filter((i) => i.relative);

describe('the layout of src/', () => {
  test('every file lies in a known layer', () => {
    const unknown = files.filter((f) => !(layerOf(f) in RANK)).map(shown);
    expect(unknown).toEqual([]);
    // A check that reads nothing proves nothing: the tree really was read.
    expect(files.length).toBeGreaterThan(100);
    expect(local.length).toBeGreaterThan(400);
  });

  test('imports go down only (app → screens → ui → words → state → core)', () => {
    const upward = local
      .filter((i) => RANK[layerOf(i.to)] > RANK[layerOf(i.from)])
      .map((i) => `${shown(i.from)} → ${shown(i.to)}`);
    expect(upward).toEqual([]);
  });

  test('render and audio stand apart: neither imports the other', () => {
    const across = local
      .filter((i) => RANK[layerOf(i.from)] === 1 && RANK[layerOf(i.to)] === 1)
      .filter((i) => layerOf(i.from) !== layerOf(i.to))
      .map((i) => `${shown(i.from)} → ${shown(i.to)}`);
    expect(across).toEqual([]);
  });

  test('a screen imports no other screen (what two screens share lives in ui/)', () => {
    const across = local
      .filter((i) => layerOf(i.from) === 'screens' && layerOf(i.to) === 'screens')
      .filter((i) => screenOf(i.from) !== screenOf(i.to))
      .map((i) => `${shown(i.from)} → ${shown(i.to)}`);
    expect(across).toEqual([]);
  });

  test('outside the core, the core is used through its one public entry, src/core/index.ts', () => {
    const entry = path.join(SRC, 'core', 'index.ts');
    const deep = local
      .filter((i) => layerOf(i.from) !== 'core' && layerOf(i.to) === 'core' && i.to !== entry)
      .map((i) => `${shown(i.from)} → ${shown(i.to)}`);
    expect(deep).toEqual([]);
  });

  test('each layer uses only the packages that fit its job (no DOM libraries below the UI)', () => {
    const foreign = imports
      .filter((i) => !i.relative && !PACKAGES[layerOf(i.from)]?.includes(i.to))
      .map((i) => `${shown(i.from)} → ${i.to}`);
    expect(foreign).toEqual([]);
  });

  test('the rules catch a wrong import (the checks above can fail)', () => {
    const sample = path.join(SRC, 'core', 'physics', 'x.ts');
    const wrong = { from: sample, to: path.join(SRC, 'state', 'setup.ts'), relative: true };
    expect(RANK[layerOf(wrong.to)] > RANK[layerOf(wrong.from)]).toBe(true);
    const a = path.join(SRC, 'screens', 'camera', 'index.tsx');
    const b = path.join(SRC, 'screens', 'check', 'index.tsx');
    expect(screenOf(a)).not.toBe(screenOf(b));
  });
});
