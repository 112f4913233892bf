// Chrome compiles a script's functions one by one, the first time each is called, unless the
// script starts with the magic comment `//# allFunctionsCalledOnLoad` (V8's explicit compile
// hints, shipped in Chrome 136): then it compiles them all as the script loads, off the main
// thread while it streams. The first keystroke on the check screen runs the field parser, the
// check and the verdict for the first time; with the hint on their chunk, it no longer waits
// for them to be compiled (bench:ui, 4× slowdown: the first key's task fell from about 40–60 ms
// to 30–40 ms). Other browsers read a comment.
//
// The same holds for the rate map: it is drawn the first time it comes near the screen (on a
// phone, when the Speed field is tapped and the page scrolls), and compiling the map, its chart
// and uPlot function by function then made that one task 40 % longer.
//
// The comment must be the file's first line: this plugin puts it there once the bundle is
// complete (after minification, which drops comments, and after Vite's own first line), and
// shifts the chunk's source map by that line.
import type { Plugin } from 'vite';

export const COMPILE_HINT = '//# allFunctionsCalledOnLoad';

/**
 * Hints the chunks named in `targets`: a target is a chunk's name (a group of
 * `codeSplitting`) or the end of the path of a module (e.g. `/src/ui/rate-map/chart.ts`): the
 * chunk that holds it. Throws at build time when a target matches no chunk, so a
 * renamed file cannot silently lose its hint.
 */
export function compileHint(targets: readonly string[]): Plugin {
  return {
    name: 'trueturn-compile-hint',
    // The page's own build: a server-side build (the prerender) has no such chunks.
    apply: (_config, env) => env.command === 'build' && !env.isSsrBuild,
    enforce: 'post',
    generateBundle: {
      // After Vite's own generateBundle, which puts its list of preloaded files on the first line.
      order: 'post',
      handler(_options, bundle) {
        const unmatched = new Set(targets);
        for (const file of Object.values(bundle)) {
          if (file.type !== 'chunk') continue;
          const target = targets.find(
            (t) => file.name === t || file.moduleIds.some((id) => id.endsWith(t)),
          );
          if (target === undefined) continue;
          unmatched.delete(target);
          file.code = `${COMPILE_HINT}\n${file.code}`;
          // One more line in front: every mapped line moves down one, in the chunk's map and in
          // the map file already emitted beside it.
          if (file.map) file.map.mappings = `;${file.map.mappings}`;
          const mapFile = bundle[`${file.fileName}.map`];
          if (mapFile?.type === 'asset') {
            const map = JSON.parse(String(mapFile.source)) as { mappings: string };
            map.mappings = `;${map.mappings}`;
            mapFile.source = JSON.stringify(map);
          }
        }
        if (unmatched.size > 0) {
          this.error(`compile hint: no chunk for ${[...unmatched].join(', ')}`);
        }
      },
    },
  };
}
