// One chunk for everything the first screen needs. Left to itself, the bundler splits the
// modules the entry shares with the later chunks (Preact, the signals, the state, the core's
// first formulas) into several small chunks, each a request and a gzip stream of its own in
// front of the first paint, and the check screen's styles into a second render-blocking style
// sheet. This plugin notes, once the module graph is known, every module the entry reaches by
// static imports; vite.config.ts puts them all in one chunk.
import type { Plugin } from 'vite';

export interface FirstPaintChunk {
  plugin: Plugin;
  /** True for a module the entry reaches by static imports (known once the build has read them all). */
  holds(id: string): boolean;
}

export function firstPaintChunk(entryEnd = '/src/app/main.tsx'): FirstPaintChunk {
  const reached = new Set<string>();
  const plugin: Plugin = {
    name: 'trueturn-first-paint-chunk',
    apply: 'build',
    buildEnd() {
      reached.clear();
      const entry = [...this.getModuleIds()].find((id) => id.endsWith(entryEnd));
      if (!entry) return;
      const queue = [entry];
      while (queue.length) {
        const id = queue.pop()!;
        if (reached.has(id)) continue;
        reached.add(id);
        for (const next of this.getModuleInfo(id)?.importedIds ?? []) {
          // The core is entered through its index, which re-exports every core module: the
          // bundler drops what goes unused (vite.config.ts), so the core and what only it
          // imports (fft.js) are left to the bundler, not pulled in whole.
          if (!next.includes('/src/core/')) queue.push(next);
        }
      }
      // main.tsx itself stays the entry chunk, which loads this one.
      reached.delete(entry);
    },
  };
  return { plugin, holds: (id) => reached.has(id) };
}
