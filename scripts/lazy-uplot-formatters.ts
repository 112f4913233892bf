// uPlot (1.6.32) builds an Intl number formatter and a date formatter as its module loads.
// The first Intl object a page builds costs about 18 ms at full speed (the browser sets up its
// locale data; four times that on a mid-range phone), and uPlot is otherwise the only thing
// here that builds one, so that cost landed wherever the rate map first loaded: at start-up, or
// under the first keystroke. The rate map gives uPlot its own tick labels and no time axis, so
// neither formatter is ever used: this build step makes uPlot build each on first use instead.
// Each replacement must match exactly once; a uPlot whose text differs fails the build with a
// message saying so, rather than shipping unpatched.
import type { Plugin } from 'vite';

/** What is replaced in uPlot's ES module, and with what. */
export const UPLOT_REPLACEMENTS: ReadonlyArray<readonly [string, string]> = [
  [
    "const numFormatter = new Intl.NumberFormat(domEnv ? nav.language : 'en-US');\nconst fmtNum = val => numFormatter.format(val);",
    "let numFormatter;\nconst fmtNum = val => (numFormatter ??= new Intl.NumberFormat(domEnv ? nav.language : 'en-US')).format(val);",
  ],
  ['const localTz = new Intl.DateTimeFormat().resolvedOptions().timeZone;', 'let localTz;'],
  [
    'else if (tz == localTz)',
    'else if (tz == (localTz ??= new Intl.DateTimeFormat().resolvedOptions().timeZone))',
  ],
];

/** uPlot's module text with its formatters built on first use. Throws when a piece is not found once. */
export function lazyUplotFormatters(code: string): string {
  let out = code;
  for (const [from, to] of UPLOT_REPLACEMENTS) {
    const count = out.split(from).length - 1;
    if (count !== 1) {
      throw new Error(
        `uPlot's text has changed: "${from.split('\n')[0]}" is found ${count} times, not once (scripts/lazy-uplot-formatters.ts)`,
      );
    }
    out = out.replace(from, () => to);
  }
  return out;
}

/** The build step: applies lazyUplotFormatters to uPlot's ES module. */
export function lazyUplotFormattersPlugin(): Plugin {
  return {
    name: 'trueturn-lazy-uplot-formatters',
    transform(code, id) {
      if (!id.replace(/\\/g, '/').endsWith('/uplot/dist/uPlot.esm.js')) return null;
      return { code: lazyUplotFormatters(code), map: null };
    },
  };
}
