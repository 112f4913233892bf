// Puts the first screen into the built page as HTML (src/app/prerender.tsx, rendered in Node by
// a server-side build of the same config), so a phone paints the verdict and the stillness
// caution as soon as the page and its style sheet arrive, without waiting for the script: the
// largest paint no longer waits on script (bench:ui, Lighthouse mobile LCP).
//
// The markup is inert until the script has rendered over it (src/app/main.tsx removes the
// attribute): a field typed into before then would lose its text to the first render.
// The script's first render reuses these elements (Preact's render over existing children), so
// the painted verdict stays where it is and nothing shifts.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { build, type Plugin } from 'vite';

/** The empty mount point in index.html that the markup goes into. */
export const MOUNT = '<div id="app"></div>';
const ENTRY = 'src/app/prerender.tsx';

/** The page with `markup` in its mount point, inert; throws when index.html has no such point. */
export function withFirstScreen(html: string, markup: string): string {
  if (html.split(MOUNT).length !== 2) {
    throw new Error(`prerender: index.html must hold ${MOUNT} exactly once`);
  }
  return html.replace(MOUNT, () => `<div id="app" inert>${markup}</div>`);
}

export function prerenderFirstScreen(): Plugin {
  let root = '';
  let configFile: string | false = false;
  return {
    name: 'trueturn-prerender',
    // The page's own build; the server-side build this plugin starts is not prerendered itself.
    apply: (_config, env) => env.command === 'build' && !env.isSsrBuild,
    configResolved(config) {
      root = config.root;
      configFile = config.configFile ?? false;
    },
    transformIndexHtml: {
      order: 'pre',
      async handler(html) {
        const outDir = mkdtempSync(join(tmpdir(), 'trueturn-prerender-'));
        try {
          await build({
            root,
            configFile,
            logLevel: 'warn',
            // Everything bundled in, so the output runs from a folder with no node_modules.
            ssr: { noExternal: true },
            build: {
              ssr: join(root, ENTRY),
              outDir,
              emptyOutDir: true,
              copyPublicDir: false,
              sourcemap: false,
              minify: false,
            },
          });
          const module = (await import(pathToFileURL(join(outDir, 'prerender.js')).href)) as {
            firstScreenHtml(): string;
          };
          return withFirstScreen(html, module.firstScreenHtml());
        } finally {
          rmSync(outDir, { recursive: true, force: true });
        }
      },
    },
  };
}
