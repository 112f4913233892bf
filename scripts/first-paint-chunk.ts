// One chunk for everything the first screen needs to answer. Left to itself, the bundler splits
// the modules the app's start shares with the later chunks (Preact, the signals, the state, the
// core's first formulas) into several small chunks, each a request and a gzip stream of its own,
// and the check screen's styles into several style sheets. This plugin notes, once the module
// graph is known, every module the start (src/app/start.tsx, which the page's entry imports once
// the prerendered screen is painted) reaches by static imports; vite.config.ts puts them all in
// one chunk. What the entry itself imports stays in the entry's chunk, so that nothing of this
// chunk is fetched before the first paint. Its style sheet is linked from the page (below): the
// prerendered screen needs it for that paint.
import type { Plugin } from 'vite';

export interface FirstPaintChunk {
  plugin: Plugin;
  /** True for a module the start reaches by static imports (known once the build has read them all). */
  holds(id: string): boolean;
  entryHolds(id: string): boolean;
}

/** The name vite.config.ts gives the chunk. */
export const FIRST_PAINT_CHUNK = 'first-paint';

export function firstPaintChunk(
  entryEnd = '/src/app/main.tsx',
  startEnd = '/src/app/start.tsx',
): FirstPaintChunk {
  const reached = new Set<string>();
  const entryOwn = new Set<string>();
  let base = '/';
  const plugin: Plugin = {
    name: 'trueturn-first-paint-chunk',
    apply: 'build',
    configResolved(config) {
      base = config.base;
    },
    buildEnd() {
      reached.clear();
      entryOwn.clear();
      const ids = [...this.getModuleIds()];
      const entry = ids.find((id) => id.endsWith(entryEnd));
      const start = ids.find((id) => id.endsWith(startEnd));
      // A build without the app's start (the prerender's server-side build) has no such chunk.
      if (!entry || !start) return;
      const fromEntry = staticallyReached(entry, (id) => this.getModuleInfo(id)?.importedIds);
      for (const id of staticallyReached(start, (id) => this.getModuleInfo(id)?.importedIds)) {
        if (!fromEntry.has(id)) reached.add(id);
      }
      for (const id of fromEntry) entryOwn.add(id);
    },
    // The chunk is imported by script, so the bundler would load its style sheet by script too,
    // after the paint: the page links it instead, and the loader finds it there and skips it.
    transformIndexHtml: {
      order: 'post',
      handler(html, context) {
        const chunk = Object.values(context.bundle ?? {}).find(
          (file) => file.type === 'chunk' && file.name === FIRST_PAINT_CHUNK,
        );
        if (!chunk || chunk.type !== 'chunk') return html;
        const sheets = [...(chunk.viteMetadata?.importedCss ?? [])];
        return {
          html,
          tags: sheets.map((sheet) => ({
            tag: 'link',
            attrs: { rel: 'stylesheet', crossorigin: true, href: base + sheet },
            injectTo: 'head' as const,
          })),
        };
      },
    },
  };
  return { plugin, holds: (id) => reached.has(id), entryHolds: (id) => entryOwn.has(id) };
}

function staticallyReached(
  root: string,
  importsOf: (id: string) => readonly string[] | undefined,
): Set<string> {
  const reached = new Set<string>();
  const queue = [root];
  while (queue.length) {
    const id = queue.pop()!;
    if (reached.has(id)) continue;
    reached.add(id);
    for (const next of importsOf(id) ?? []) {
      // The core is entered through its index, which re-exports every core module: the
      // bundler drops what goes unused (vite.config.ts), so the core and what only it
      // imports (fft.js) are left to the bundler, not pulled in whole.
      if (!next.includes('/src/core/')) queue.push(next);
    }
  }
  return reached;
}
