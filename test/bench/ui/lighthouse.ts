// One Lighthouse run (mobile preset defaults: phone screen, simulated slow 4G and 4× CPU
// slowdown) of the served app in a freshly launched Chromium, performance category only.
// The JSON and HTML reports are kept for a closer look.
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import * as chromeLauncher from 'chrome-launcher';
import lighthouse, { type Result } from 'lighthouse';
import { CHROMIUM } from '../../browser/browser';

const CHROME_FLAGS = [
  '--headless=new',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

export interface LighthouseFigures {
  /** 0–1, as Lighthouse computes it (its report shows it × 100, rounded). */
  performanceScore: number;
  totalBlockingTimeMs: number;
  largestContentfulPaintMs: number;
  cumulativeLayoutShift: number;
  lhr: Result;
  reportPath: string;
}

export async function lighthouseRun(
  url: string,
  outDir: string,
  label: string,
): Promise<LighthouseFigures> {
  const chrome = await chromeLauncher.launch({
    chromePath: CHROMIUM,
    chromeFlags: CHROME_FLAGS,
    logLevel: 'silent',
  });
  try {
    const result = await lighthouse(url, {
      port: chrome.port,
      output: ['json', 'html'],
      logLevel: 'error',
      onlyCategories: ['performance'],
    });
    if (!result) throw new Error('Lighthouse returned no result');
    const { lhr } = result;
    if (lhr.runtimeError) {
      throw new Error(`Lighthouse: ${lhr.runtimeError.code}: ${lhr.runtimeError.message}`);
    }
    mkdirSync(outDir, { recursive: true });
    const reportPath = join(outDir, `lighthouse-${label}`);
    const [json, html] = result.report as string[];
    writeFileSync(`${reportPath}.json`, json);
    writeFileSync(`${reportPath}.html`, html);
    return {
      performanceScore: required(lhr.categories.performance?.score, 'performance score'),
      totalBlockingTimeMs: numeric(lhr, 'total-blocking-time'),
      largestContentfulPaintMs: numeric(lhr, 'largest-contentful-paint'),
      cumulativeLayoutShift: numeric(lhr, 'cumulative-layout-shift'),
      lhr,
      reportPath,
    };
  } finally {
    await stop(chrome);
  }
}

function numeric(lhr: Result, auditId: string): number {
  const audit = lhr.audits[auditId];
  const value = audit?.numericValue;
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new Error(
      `Lighthouse gave no value for ${auditId}${audit?.errorMessage ? `: ${audit.errorMessage}` : ''}`,
    );
  }
  return value;
}

function required(value: number | null | undefined, what: string): number {
  if (typeof value !== 'number') throw new Error(`Lighthouse gave no ${what}`);
  return value;
}

/** Ends the launched Chromium and waits until it has exited, so runs never overlap. */
function stop(chrome: chromeLauncher.LaunchedChrome): Promise<void> {
  return new Promise((done) => {
    const child = chrome.process;
    if (child.exitCode !== null || child.signalCode !== null) {
      chrome.kill();
      return done();
    }
    child.once('exit', () => done());
    chrome.kill();
  });
}
