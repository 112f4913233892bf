/// <reference types="vitest/config" />
import { defineConfig } from 'vite';
import preact from '@preact/preset-vite';
import { VitePWA } from 'vite-plugin-pwa';
import { contentSecurityPolicy } from './scripts/content-security-policy.ts';
import { compileHint } from './scripts/compile-hint.ts';
import { firstPaintChunk } from './scripts/first-paint-chunk.ts';
import { lazyUplotFormattersPlugin } from './scripts/lazy-uplot-formatters.ts';
import { prerenderFirstScreen } from './scripts/prerender.ts';

const firstPaint = firstPaintChunk();

// The app is fully static and must work with no network after the first visit:
// every built file and icon is precached by the generated service worker.
export default defineConfig({
  plugins: [
    preact(),
    firstPaint.plugin,
    // uPlot builds its Intl formatters when first used, not as it loads.
    lazyUplotFormattersPlugin(),
    // The built page holds the first screen as HTML, painted before the script runs.
    prerenderFirstScreen(),
    // The built page allows scripts, styles, workers and connections from its own origin only.
    contentSecurityPolicy(),
    // Chrome compiles these as they load, not function by function: the first screen's script,
    // and the rate map with its chart and uPlot, drawn all at once when the map comes near the
    // screen (scripts/compile-hint.ts).
    compileHint([
      'first-paint',
      '/src/ui/rate-map/index.tsx',
      '/src/ui/rate-map/chart.ts',
      '/node_modules/uplot/dist/uPlot.esm.js',
    ]),
    VitePWA({
      // A new version waits for the user's go-ahead (src/app/update-notice); registration is
      // done by the useRegisterSW hook, so no extra script is injected.
      registerType: 'prompt',
      injectRegister: false,
      // Not matched by globPatterns below; the manifest icons are added by the plugin itself.
      includeAssets: ['favicon.svg', 'robots.txt'],
      manifest: {
        id: '.',
        name: 'Trueturn',
        short_name: 'Trueturn',
        description:
          'What a strobe, camera or flickering light really shows of a turning part, and which rates to use.',
        lang: 'en',
        theme_color: '#0d3b4f',
        background_color: '#f4f1ea',
        display: 'standalone',
        orientation: 'any',
        start_url: '.',
        scope: '.',
        categories: ['utilities', 'productivity'],
        icons: [
          { src: 'icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
          { src: 'icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
          {
            src: 'icon-maskable-512.png',
            sizes: '512x512',
            type: 'image/png',
            purpose: 'maskable',
          },
        ],
      },
      workbox: {
        // The whole app (every script, style sheet and page); icons come through the manifest.
        globPatterns: ['**/*.{js,css,html}'],
        navigateFallback: 'index.html',
        // The first visit's page is served by the worker as soon as it is installed, so the
        // parts that load on first use (the tools, the wheel fields) come from its cache when
        // the connection goes before they were opened. A later version still waits for the
        // user's go-ahead: only the first worker takes the page over by itself.
        clientsClaim: true,
        cleanupOutdatedCaches: true,
      },
    }),
  ],
  build: {
    target: 'es2022',
    // Every browser the app targets (ES2022) preloads modules itself: no polyfill in the page.
    modulePreload: {
      polyfill: false,
      // A chunk loaded on first use is asked for with its style sheets only, not with preload
      // links for the chunks it imports: each link put in the page costs the task that asks
      // (0.5 to 12 ms a link measured at start-up, more on a busy phone), and the imports it
      // would fetch early come from this same origin, or from the service worker's cache.
      resolveDependencies: (_file, deps, { hostType }) => (hostType === 'js' ? [] : deps),
    },
    rolldownOptions: {
      // The core is pure (no DOM, no storage, no clock), so a core module
      // whose exports go unused can be dropped, and src/core/index.ts re-exporting everything
      // does not pull the whole core into the first screen's chunk. Other modules keep the
      // bundler's default.
      treeshake: {
        moduleSideEffects: (id) => (id.includes('/src/core/') ? false : undefined),
      },
      // What the first screen needs, in one script and one style sheet (scripts/first-paint-chunk.ts).
      output: {
        codeSplitting: {
          groups: [{ name: 'first-paint', test: (id) => firstPaint.holds(id), priority: 10 }],
        },
      },
    },
  },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          // Every folder of test/ but the real-browser tests and the benchmarks.
          include: [
            'test/*.test.ts',
            'test/{app,audio,core,render,screens,scripts,state,ui,words}/**/*.test.{ts,tsx}',
          ],
          environment: 'node',
        },
      },
      {
        extends: true,
        test: {
          name: 'browser',
          include: ['test/browser/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['test/browser/global-setup.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
