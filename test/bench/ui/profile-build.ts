// The build `bench:ui --profile` records: the app as it ships but not minified (function and
// component names kept), with source maps, and with render-counter.ts bundled in front of
// src/app/main.tsx (the app's source is not changed).
import { resolve } from 'node:path';
import { build, type Plugin } from 'vite';

const root = resolve(import.meta.dirname, '../../..');
const counter = resolve(import.meta.dirname, 'render-counter.ts');

function countRenders(): Plugin {
  return {
    name: 'trueturn-bench-count-renders',
    transform(code, id) {
      // package.json's "sideEffects" list would let the bundler drop a bare import of the
      // counter: it is kept by saying it has effects.
      if (id === counter) return { code, map: null, moduleSideEffects: true };
      if (!id.endsWith('/src/app/main.tsx')) return null;
      return { code: `import ${JSON.stringify(counter)};\n${code}`, map: null };
    },
  };
}

export async function buildForProfile(outDir: string): Promise<void> {
  // As `vite build` sets it: the Preact preset leaves its debug helpers out only then.
  const before = process.env.NODE_ENV;
  process.env.NODE_ENV = 'production';
  try {
    await build({
      root,
      configFile: resolve(root, 'vite.config.ts'),
      mode: 'production',
      logLevel: 'warn',
      plugins: [countRenders()],
      build: { outDir, emptyOutDir: true, minify: false, sourcemap: true, manifest: true },
    });
  } finally {
    if (before === undefined) delete process.env.NODE_ENV;
    else process.env.NODE_ENV = before;
  }
}
