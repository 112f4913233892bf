// One fresh Chromium per test: Debian's /usr/bin/chromium driven by playwright-core, with a
// throw-away profile, so no test sees another's storage or service worker.
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { MachineContent, Setup } from '../../src/state/model';

export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

/** Chromium's flags for a quiet, reproducible headless run: nothing fetched or synced behind the test. */
export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
];

/** The two sizes every screen is looked at: a phone and a desktop. */
export const SIZES = [
  { name: 'phone', width: 390, height: 844 },
  { name: 'desktop', width: 1280, height: 800 },
] as const;

/** Text that is no number, which every number field must refuse beside itself. */
export const GARBAGE = [
  'abc',
  'NaN',
  '-Infinity',
  '1e999',
  '<script>alert(1)</script>',
  '1/0',
  '0x10',
  '12abc',
  '--5',
  '1..2',
];

/** The visible text of the page without what the user typed back in quotes. */
export async function shownText(page: Page): Promise<string> {
  return (await page.locator('body').innerText()).replace(/"[^"]*"/g, '');
}

export interface Session {
  context: BrowserContext;
  page: Page;
  close: () => Promise<void>;
}

export async function openBrowser(
  options: {
    width?: number;
    height?: number;
    colorScheme?: 'light' | 'dark';
    /** false: the page's scripts do not run (what the built HTML shows on its own). */
    javaScript?: boolean;
    /** A phone's screen: touch input and no mouse pointer over the page (nothing hovered). */
    touch?: boolean;
  } = {},
): Promise<Session> {
  const profile = mkdtempSync(join(tmpdir(), 'trueturn-browser-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    viewport: { width: options.width ?? 390, height: options.height ?? 844 },
    colorScheme: options.colorScheme ?? 'light',
    javaScriptEnabled: options.javaScript ?? true,
    isMobile: options.touch ?? false,
    hasTouch: options.touch ?? false,
    acceptDownloads: true,
    args: CHROMIUM_ARGS,
  });
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/**
 * Opens the app and waits until the first verdict is on screen and its starting machine is in
 * place (src/app/main.tsx marks the page): typing before that could race the last visit's
 * working copy as it loads.
 */
export async function openApp(page: Page, url: string): Promise<void> {
  await page.goto(url);
  await page.getByTestId('verdict').waitFor();
  await page.locator('html[data-session="open"]').waitFor({ state: 'attached' });
}

/** Reloads the app and waits, as openApp does, until its starting machine is in place. */
export async function reloadApp(page: Page): Promise<void> {
  await page.reload();
  await page.getByTestId('verdict').waitFor();
  await page.locator('html[data-session="open"]').waitFor({ state: 'attached' });
}

/** Replaces a field's text as a person would: select all, type. */
export async function typeInto(page: Page, label: string | RegExp, text: string): Promise<void> {
  const field = page.getByLabel(label, { exact: typeof label === 'string' });
  await field.fill('');
  await field.pressSequentially(text);
}

/**
 * What the app has stored in IndexedDB under `key` (the database and store of
 * src/state/store/backend.ts), or undefined. A test that reloads waits on this for the write it
 * relies on: the page writes after each change, and a reload could otherwise come before the write.
 */
export function storedRecord(page: Page, key: string): Promise<unknown> {
  return page.evaluate(async (k) => {
    // Opening a database that does not exist would create it empty, under the app's feet.
    const names = (await indexedDB.databases()).map((d) => d.name);
    if (!names.includes('trueturn')) return undefined;
    return new Promise<unknown>((done, fail) => {
      const open = indexedDB.open('trueturn');
      open.onerror = () => fail(open.error);
      open.onsuccess = () => {
        const db = open.result;
        if (!db.objectStoreNames.contains('records')) {
          db.close();
          return done(undefined);
        }
        const get = db.transaction('records', 'readonly').objectStore('records').get(k);
        get.onsuccess = () => {
          db.close();
          done(get.result);
        };
        get.onerror = () => fail(get.error);
      };
    });
  }, key);
}

/**
 * The working copy kept for the next visit (src/state/store/records.ts, "trueturn/work"): the
 * machine on screen, with its header, set-up and every tool's inputs.
 */
export async function storedWork(page: Page): Promise<MachineContent | undefined> {
  const record = (await storedRecord(page, 'trueturn/work')) as
    { work?: { content?: MachineContent } } | undefined;
  return record?.work?.content;
}

/** The set-up of the working copy kept for the next visit (see storedWork). */
export async function storedSetup(page: Page): Promise<Setup | undefined> {
  return (await storedWork(page))?.setup;
}

/** The saved machines on the device ("trueturn/machine/<id>" records), by name. */
export function storedMachineNames(page: Page): Promise<string[]> {
  return page.evaluate(async () => {
    const names = (await indexedDB.databases()).map((d) => d.name);
    if (!names.includes('trueturn')) return [];
    return new Promise<string[]>((done, fail) => {
      const open = indexedDB.open('trueturn');
      open.onerror = () => fail(open.error);
      open.onsuccess = () => {
        const db = open.result;
        if (!db.objectStoreNames.contains('records')) {
          db.close();
          return done([]);
        }
        const range = IDBKeyRange.bound('trueturn/machine/', 'trueturn/machine/\uffff');
        const all = db.transaction('records', 'readonly').objectStore('records').getAll(range);
        all.onsuccess = () => {
          db.close();
          done(
            (all.result as Array<{ machine: { name: string } }>).map((r) => r.machine.name).sort(),
          );
        };
        all.onerror = () => fail(all.error);
      };
    });
  });
}

/**
 * A report CSV file (src/words/report.ts) in its two parts: the report's head (title, header
 * lines and cautions, as [label, value] rows) and the tool's table lines. Checks the UTF-8
 * byte-order mark that opens it and the blank line between the two.
 */
export function splitReportCsv(text: string): { head: Array<[string, string]>; table: string[] } {
  if (!text.startsWith('\uFEFF'))
    throw new Error('the CSV file does not start with a byte-order mark');
  const gap = text.indexOf('\r\n\r\n');
  if (gap < 0) throw new Error('the CSV file has no blank line after its report head');
  const head = text
    .slice(1, gap)
    .split('\r\n')
    .map((line): [string, string] => {
      const comma = line.indexOf(',');
      const value = line.slice(comma + 1);
      // A value with a comma or a quote is quoted (RFC 4180): unquote it.
      const plain = /^".*"$/.test(value) ? value.slice(1, -1).replace(/""/g, '"') : value;
      return [line.slice(0, comma), plain];
    });
  return { head, table: text.slice(gap + 4).split('\r\n') };
}

/** The printed report header's lines (Site, Machine, Assessed by, Date, Notes) by label. */
export async function printedHeaderLines(page: Page): Promise<Record<string, string>> {
  return page
    .locator('header[data-print="only"] dl')
    .first()
    .evaluate((dl) => {
      const out: Record<string, string> = {};
      for (const row of dl.querySelectorAll('div')) {
        out[row.querySelector('dt')?.textContent ?? ''] =
          row.querySelector('dd')?.textContent ?? '';
      }
      return out;
    });
}

/**
 * A picture of the whole page with every part drawn. Chromium skips drawing result panels off
 * screen (content-visibility) and a plain full-page capture can come before it draws them, so
 * the window is made as tall as the page for the capture, then put back.
 */
export async function wholePageScreenshot(page: Page, path: string): Promise<void> {
  const size = page.viewportSize()!;
  const height = await page.evaluate(() => document.documentElement.scrollHeight);
  await page.setViewportSize({ width: size.width, height });
  // Two frames: one to find the panels now on screen, one to draw them.
  await page.evaluate(
    () =>
      new Promise((drawn) => requestAnimationFrame(() => requestAnimationFrame(() => drawn(null)))),
  );
  await page.screenshot({ path, fullPage: true });
  await page.setViewportSize(size);
}
