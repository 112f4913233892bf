// The build step that makes uPlot build its Intl formatters on first use, run on the uPlot
// this project installs: the patched module is loaded in Node with Intl's constructors counted.
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterEach, describe, expect, test, vi } from 'vitest';
import { lazyUplotFormatters } from '../../scripts/lazy-uplot-formatters';

const uplotSource = readFileSync(
  createRequire(import.meta.url).resolve('uplot/dist/uPlot.esm.js'),
  'utf8',
);

/** Intl objects built while `work` runs. */
async function intlBuiltDuring(work: () => Promise<unknown>): Promise<number> {
  let built = 0;
  const counting = <T extends new (...args: never[]) => object>(Real: T) =>
    new Proxy(Real, {
      construct(target, args) {
        built++;
        return Reflect.construct(target, args);
      },
    });
  vi.stubGlobal('Intl', {
    ...Intl,
    NumberFormat: counting(Intl.NumberFormat),
    DateTimeFormat: counting(Intl.DateTimeFormat),
  });
  await work();
  return built;
}

/** Loads `code` as a fresh ES module and returns its default export (uPlot). */
async function load(code: string) {
  const file = join(mkdtempSync(join(tmpdir(), 'uplot-')), 'uPlot.mjs');
  writeFileSync(file, code);
  return (await import(/* @vite-ignore */ pathToFileURL(file).href)).default as {
    fmtNum(value: number): string;
    tzDate(date: Date, tz: string): Date;
  };
}

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('uPlot with its formatters built on first use', () => {
  test('builds no Intl object as it loads (as installed it builds two)', async () => {
    expect(await intlBuiltDuring(() => load(uplotSource))).toBe(2);
    expect(await intlBuiltDuring(() => load(lazyUplotFormatters(uplotSource)))).toBe(0);
  });

  test('still formats numbers and local dates as installed uPlot does', async () => {
    const installed = await load(uplotSource);
    const patched = await load(lazyUplotFormatters(uplotSource));
    for (const value of [0, 1770, -1234.5678, 29.97002997, 1e9]) {
      expect(patched.fmtNum(value)).toBe(installed.fmtNum(value));
    }
    const localTz = new Intl.DateTimeFormat().resolvedOptions().timeZone;
    const when = new Date(Date.UTC(2026, 11, 2, 15, 8));
    expect(patched.tzDate(when, localTz).getTime()).toBe(installed.tzDate(when, localTz).getTime());
    expect(patched.tzDate(when, 'UTC').getTime()).toBe(installed.tzDate(when, 'UTC').getTime());
  });

  test('refuses a uPlot whose text has changed, rather than shipping it unpatched', () => {
    expect(() =>
      lazyUplotFormatters(uplotSource.replace('const localTz', 'const theLocalTz')),
    ).toThrow(/uPlot's text has changed/);
  });
});
