// `npm run bench:ui`: loads the TypeScript benchmark (main.ts) through Vite's module runner,
// since Node 20 runs no TypeScript itself, and turns any failure into a clear last line and a
// non-zero exit. Figures over budget are not failures: they are marked OVER and the exit is 0.
import { resolve } from 'node:path';
import { runnerImport } from 'vite';

try {
  const { module } = await runnerImport(resolve(import.meta.dirname, 'main.ts'), {
    root: resolve(import.meta.dirname, '../../..'),
    configFile: false,
    logLevel: 'warn',
  });
  await module.main(process.argv.slice(2));
  process.exit(0);
} catch (error) {
  console.error(error instanceof Error ? (error.stack ?? error.message) : error);
  const message = error instanceof Error ? error.message.split('\n')[0] : String(error);
  console.error(`bench:ui FAILED, nothing measured in full: ${message}`);
  process.exit(1);
}
