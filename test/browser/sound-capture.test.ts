// The sound capture module (src/audio) in real Chromium, fed by its fake microphone: a WAV of
// a 6-blade fan at 1750 rpm with 100 Hz hum (test/helpers/sound) plays as the microphone
// (--use-fake-device-for-media-stream --use-file-for-fake-audio-capture). The device starts the
// file when the stream opens, and the recording begins a moment later, later still on a busy
// machine: so the microphone's fan is steady and its file long (30 s), and any 4 s of it holds
// 1750 rpm. The 6 s file, whose speed ramps 0.1 %, gave 1748.8 to 1750.6 rpm by where the 4 s
// fell, and 1752.65 rpm once in a full browser run. The device also keeps its own time, not the
// page's audio clock: what it plays is held to 0.5 % (test/helpers/sound/fakeMicrophone.ts). A
// picked file is decoded whole, so that test keeps the ramping 6 s file and the 2 rpm bar. The
// module is not on any app screen yet, so a small page that only loads it is built here, into
// test-output/, with Vite (as the app is: the worklet bundled as its own file, loaded from the
// page's origin).
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { build, preview, type PreviewServer } from 'vite';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { contentSecurityPolicy } from '../../scripts/content-security-policy';
import { CHROMIUM, CHROMIUM_ARGS } from './browser';
import { freePort } from './server';
import { FAKE_MICROPHONE_SHARE } from '../helpers/sound/fakeMicrophone';
import { fanAt1750Rpm } from '../helpers/sound/machineSound';
import { writeWav } from '../helpers/sound/wav';

const root = resolve(import.meta.dirname, '../..');
const work = resolve(root, 'test-output/sound-capture');
const pageDir = join(work, 'page');
const distDir = join(work, 'dist');
const wavPath = join(work, 'fan-1750rpm.wav');
const micWavPath = join(work, 'fan-1750rpm-steady-30s.wav');

/** The page's script: the capture module and the core, driven from the test. */
const MAIN = `
import { startListening, decodeSoundFile, SoundCaptureError } from '${root}/src/audio';
import { soundSpectrum, speedsFromSound } from '${root}/src/core';

const worklets = [];
const addModule = AudioWorklet.prototype.addModule;
AudioWorklet.prototype.addModule = function (url, options) {
  worklets.push(String(url));
  return addModule.call(this, url, options);
};

function rpmOf(recording) {
  const found = speedsFromSound(soundSpectrum(recording.samples, recording.sampleRateHz), { symmetry: 6 });
  return { rpm: found.candidates[0]?.speedHz * 60, confidence: found.candidates[0]?.confidence };
}
const failure = (e) => ({ error: e instanceof SoundCaptureError ? e.code : String(e), message: e.message });

window.smoke = {
  worklets,
  async listen(seconds, stopAfterS, cancelAfterS) {
    const progress = [];
    let session;
    session = startListening({
      seconds,
      onProgress: (s, total) => {
        progress.push([s, total]);
        if (stopAfterS !== undefined && s >= stopAfterS) session.stop();
        if (cancelAfterS !== undefined && s >= cancelAfterS) session.cancel();
      },
    });
    try {
      const r = await session.recording;
      return { durationS: r.durationS, sampleRateHz: r.sampleRateHz, progress, ...rpmOf(r) };
    } catch (e) {
      return { progress, ...failure(e) };
    }
  },
  async decode(base64, type, maxBytes) {
    const bytes = Uint8Array.from(atob(base64), (c) => c.charCodeAt(0));
    try {
      const r = await decodeSoundFile(new Blob([bytes], { type }), { maxBytes });
      return { durationS: r.durationS, sampleRateHz: r.sampleRateHz, ...rpmOf(r) };
    } catch (e) {
      return failure(e);
    }
  },
};
document.body.dataset.ready = 'yes';
`;

const BASE_ARGS = [...CHROMIUM_ARGS, '--autoplay-policy=no-user-gesture-required'];

let server: PreviewServer;
let url: string;

async function openPage(
  args: string[],
  grant: boolean,
): Promise<{ page: Page; close: () => Promise<void> }> {
  const profile = mkdtempSync(join(tmpdir(), 'trueturn-sound-'));
  const context: BrowserContext = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: [...BASE_ARGS, ...args],
  });
  if (grant) await context.grantPermissions(['microphone'], { origin: new URL(url).origin });
  const page = context.pages()[0] ?? (await context.newPage());
  await context.addInitScript(() => {
    const seen: string[] = [];
    (window as unknown as { violations: string[] }).violations = seen;
    document.addEventListener('securitypolicyviolation', (e) =>
      seen.push(`${e.effectiveDirective} ${e.blockedURI}`),
    );
  });
  await page.goto(url);
  await page.locator('body[data-ready="yes"]').waitFor({ state: 'attached' });
  return {
    page,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

type Listened = {
  durationS?: number;
  sampleRateHz?: number;
  rpm?: number;
  confidence?: string;
  progress: Array<[number, number]>;
  error?: string;
};

beforeAll(async () => {
  rmSync(work, { recursive: true, force: true });
  mkdirSync(pageDir, { recursive: true });
  writeFileSync(
    join(pageDir, 'index.html'),
    '<!doctype html><meta charset="utf-8"><title>sound capture</title><body><script type="module" src="./main.js"></script></body>',
  );
  writeFileSync(join(pageDir, 'main.js'), MAIN);
  writeWav(wavPath, fanAt1750Rpm(48_000, 6), 48_000);
  writeWav(micWavPath, fanAt1750Rpm(48_000, 30, 1750, 0), 48_000);
  await build({
    root: pageDir,
    configFile: false,
    logLevel: 'warn',
    build: { outDir: distDir, emptyOutDir: true, target: 'es2022' },
    // The app's own policy, so the worklet is shown to load under it (worker-src 'self').
    plugins: [contentSecurityPolicy()],
  });
  server = await preview({
    root: pageDir,
    configFile: false,
    logLevel: 'warn',
    build: { outDir: distDir },
    preview: { host: '127.0.0.1', port: await freePort(), strictPort: true },
  });
  url = server.resolvedUrls!.local[0];
});

afterAll(async () => {
  await server?.close();
});

describe('sound capture in Chromium', () => {
  it('bundles the worklet as a file of its own and loads it from the page’s origin, under the app’s security policy', async () => {
    const assets = readdirSync(join(distDir, 'assets'));
    expect(assets.some((f) => /^recorderWorklet-.*\.js$/.test(f))).toBe(true);
    const session = await openPage(
      [
        '--use-fake-ui-for-media-stream',
        '--use-fake-device-for-media-stream',
        `--use-file-for-fake-audio-capture=${micWavPath}`,
      ],
      true,
    );
    try {
      const result = await session.page.evaluate<Listened>(() =>
        (window as never as { smoke: { listen: (s: number) => Promise<Listened> } }).smoke.listen(
          1,
        ),
      );
      expect(result.error).toBeUndefined();
      const worklets = await session.page.evaluate<string[]>(
        () => (window as never as { smoke: { worklets: string[] } }).smoke.worklets,
      );
      expect(worklets).toHaveLength(1);
      const loaded = new URL(worklets[0], url); // relative to the page, as addModule resolves it
      expect(loaded.protocol).toBe('http:'); // not blob: or data:
      expect(loaded.origin).toBe(new URL(url).origin);
      expect(loaded.pathname).toMatch(/\/assets\/recorderWorklet-.*\.js$/);
      // Under the app's Content-Security-Policy, with nothing refused.
      expect(readFileSync(join(distDir, 'index.html'), 'utf8')).toContain(
        'http-equiv="Content-Security-Policy"',
      );
      expect(
        await session.page.evaluate(
          () => (window as unknown as { violations: string[] }).violations,
        ),
      ).toEqual([]);
    } finally {
      await session.close();
    }
  });

  it('records the fan through the fake microphone and hears 1750 rpm (± 0.5 %: the device is real-time)', async () => {
    const session = await openPage(
      [
        '--use-fake-ui-for-media-stream',
        '--use-fake-device-for-media-stream',
        `--use-file-for-fake-audio-capture=${micWavPath}`,
      ],
      true,
    );
    try {
      const result = await session.page.evaluate<Listened>(() =>
        (window as never as { smoke: { listen: (s: number) => Promise<Listened> } }).smoke.listen(
          4,
        ),
      );
      console.log(
        `fake microphone: ${result.durationS?.toFixed(2)} s at ${result.sampleRateHz} Hz, ${result.progress.length} progress reports, ${result.rpm?.toFixed(2)} rpm (${result.confidence})`,
      );
      expect(result.error).toBeUndefined();
      expect(result.durationS).toBeCloseTo(4, 1);
      expect(Math.abs(result.rpm! - 1750)).toBeLessThan(1750 * FAKE_MICROPHONE_SHARE);
      // Progress rises to the total asked for.
      const seconds = result.progress.map(([s]) => s);
      expect(seconds).toEqual([...seconds].sort((a, b) => a - b));
      expect(result.progress.at(-1)).toEqual([result.durationS, 4]);
    } finally {
      await session.close();
    }
  });

  it('stops early keeping what was recorded, and cancels keeping nothing', async () => {
    const session = await openPage(
      [
        '--use-fake-ui-for-media-stream',
        '--use-fake-device-for-media-stream',
        `--use-file-for-fake-audio-capture=${micWavPath}`,
      ],
      true,
    );
    try {
      const early = await session.page.evaluate<Listened>(() =>
        (
          window as never as { smoke: { listen: (s: number, stop: number) => Promise<Listened> } }
        ).smoke.listen(20, 2.5),
      );
      expect(early.error).toBeUndefined();
      expect(early.durationS!).toBeGreaterThanOrEqual(2.5);
      expect(early.durationS!).toBeLessThan(4);
      expect(Math.abs(early.rpm! - 1750)).toBeLessThan(1750 * FAKE_MICROPHONE_SHARE);
      const cancelled = await session.page.evaluate<Listened>(() =>
        (
          window as never as {
            smoke: { listen: (s: number, stop: undefined, cancel: number) => Promise<Listened> };
          }
        ).smoke.listen(20, undefined, 1),
      );
      expect(cancelled.error).toBe('cancelled');
    } finally {
      await session.close();
    }
  });

  it('says the microphone was refused when permission is denied', async () => {
    const session = await openPage(
      ['--use-fake-device-for-media-stream', '--deny-permission-prompts'],
      false,
    );
    try {
      const result = await session.page.evaluate<Listened>(() =>
        (window as never as { smoke: { listen: (s: number) => Promise<Listened> } }).smoke.listen(
          2,
        ),
      );
      expect(result.error).toBe('mic-refused');
    } finally {
      await session.close();
    }
  });

  it('decodes a picked WAV file to 1750 ± 2 rpm, and refuses a file that is not audio or too large', async () => {
    const session = await openPage([], false);
    const decode = (base64: string, type: string, maxBytes?: number) =>
      session.page.evaluate<Listened, [string, string, number | undefined]>(
        ([b, t, m]) =>
          (
            window as never as {
              smoke: { decode: (b: string, t: string, m?: number) => Promise<Listened> };
            }
          ).smoke.decode(b, t, m),
        [base64, type, maxBytes],
      );
    try {
      const wav = readFileSync(wavPath).toString('base64');
      const fan = await decode(wav, 'audio/wav');
      console.log(
        `picked file: ${fan.durationS?.toFixed(2)} s at ${fan.sampleRateHz} Hz, ${fan.rpm?.toFixed(2)} rpm (${fan.confidence})`,
      );
      expect(fan.error).toBeUndefined();
      expect(fan.durationS).toBeCloseTo(6, 2);
      expect(Math.abs(fan.rpm! - 1750)).toBeLessThan(2);
      const text = Buffer.from('Brackenfold Feed Mill, fan 3: 1750 rpm\n'.repeat(50)).toString(
        'base64',
      );
      expect((await decode(text, 'text/plain')).error).toBe('not-audio');
      expect((await decode(wav, 'audio/wav', 100_000)).error).toBe('file-too-large');
    } finally {
      await session.close();
    }
  });
});
