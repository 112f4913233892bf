// Builds the app and serves the build with `vite preview`, as separate processes, so the
// browser tests run against exactly what ships (service worker and precache included).
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import { resolve } from 'node:path';

const root = resolve(import.meta.dirname, '../..');
const viteBin = resolve(root, 'node_modules/vite/bin/vite.js');

/** Where the browser tests build the app: apart from dist/, so other builds cannot race with it. */
export const testDistDir = resolve(root, 'test-output/browser-dist');

/** Builds the app into `outDir` with `vite build`. Throws with Vite's output when the build fails. */
export function buildApp(outDir = testDistDir): void {
  const r = spawnSync(
    process.execPath,
    [viteBin, 'build', '--outDir', outDir, '--emptyOutDir', '--logLevel', 'warn'],
    {
      cwd: root,
      env: { ...process.env, NODE_ENV: 'production' },
      encoding: 'utf8',
    },
  );
  if (r.status !== 0) throw new Error(`vite build failed:\n${r.stdout}\n${r.stderr}`);
}

/** A free TCP port on 127.0.0.1, as the system hands it out. */
export function freePort(): Promise<number> {
  return new Promise((done, fail) => {
    const s = createServer();
    s.once('error', fail);
    s.listen(0, '127.0.0.1', () => {
      const address = s.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      s.close(() => done(port));
    });
  });
}

export interface PreviewServer {
  url: string;
  stop: () => Promise<void>;
}

/**
 * Starts `vite preview --host 127.0.0.1 --strictPort` on a free port and waits until it answers.
 * The port is free when asked for, but another process may take it before vite binds it: then
 * vite exits at once, and another free port is tried.
 */
export async function startPreview(outDir = testDistDir): Promise<PreviewServer> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await startPreviewOnce(outDir, await freePort());
    } catch (error) {
      if (!(error instanceof PortTakenError) || attempt >= 5) throw error;
    }
  }
}

class PortTakenError extends Error {}

async function startPreviewOnce(outDir: string, port: number): Promise<PreviewServer> {
  const child: ChildProcess = spawn(
    process.execPath,
    [
      viteBin,
      'preview',
      '--host',
      '127.0.0.1',
      '--port',
      String(port),
      '--strictPort',
      '--outDir',
      outDir,
    ],
    { cwd: root, stdio: ['ignore', 'pipe', 'pipe'] },
  );
  let output = '';
  child.stdout?.on('data', (d) => (output += String(d)));
  child.stderr?.on('data', (d) => (output += String(d)));
  const url = `http://127.0.0.1:${port}/`;
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (child.exitCode !== null) {
      const Failure = /already in use|EADDRINUSE/i.test(output) ? PortTakenError : Error;
      throw new Failure(`vite preview exited early:\n${output}`);
    }
    try {
      const res = await fetch(url);
      if (res.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) {
      child.kill();
      throw new Error(`vite preview did not answer on ${url}:\n${output}`);
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  const stop = () =>
    new Promise<void>((done) => {
      if (child.exitCode !== null || child.signalCode !== null) return done();
      child.once('exit', () => done());
      child.kill('SIGTERM');
    });
  return { url, stop };
}
