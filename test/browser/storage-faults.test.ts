// Every storage fault in real Chromium, counting the machines on the device (read from its
// IndexedDB) before and after: zero machines lost, and what the page says is true.
import { afterEach, describe, expect, inject, test } from 'vitest';
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { openApp, openBrowser, typeInto, type Session, reloadApp } from './browser';
import {
  clearSiteData,
  deleteDatabaseFrom,
  diskMachines,
  diskNames,
  diskWork,
  fullDiskScript,
  noIndexedDbScript,
  persistAnswerScript,
  refusedWrites,
  setDiskFull,
} from './disk';

const EXAMPLE = 'Example: cooler fan, pellet line 2';
/** The app retries refused writes after 1, 2, 4, then every 8 s (src/state/store RETRY_MS). */
const RESUME_WAIT = { timeout: 20_000 };

let session: Session | undefined;

afterEach(async () => {
  await session?.close();
  session = undefined;
});

/** Opens the app in a fresh browser and waits until the first-run example is on the device. */
async function freshApp(): Promise<Session> {
  session = await openBrowser({ width: 1280, height: 800 });
  await openApp(session.page, inject('baseUrl'));
  await expect.poll(() => diskNames(session!.page)).toEqual([EXAMPLE]);
  return session;
}

/** Saves what is on the Check screen as a new machine and returns what the page said. */
async function saveAs(page: Page, name: string): Promise<string> {
  await page.getByRole('button', { name: 'Check', exact: true }).click();
  await page.getByLabel('Machine name').fill(name);
  await page.getByRole('button', { name: 'Save as new machine' }).click();
  await expect.poll(() => shown(page, 'keep-outcome')).toContain(name);
  return shown(page, 'keep-outcome');
}

/** The names on the Machines screen's list. */
async function listedNames(page: Page): Promise<string[]> {
  await page.getByRole('button', { name: 'Machines', exact: true }).click();
  const headings = page.getByTestId('machine-list').getByRole('heading');
  return (await headings.allInnerTexts()).sort((a, b) => a.localeCompare(b));
}

/** Exports every machine from the Machines screen and returns the names in the file. */
async function exportedNames(page: Page): Promise<string[]> {
  await page.getByRole('button', { name: 'Machines', exact: true }).click();
  const [download] = await Promise.all([
    page.waitForEvent('download'),
    page.getByRole('button', { name: 'Export all machines' }).click(),
  ]);
  const file = JSON.parse(readFileSync(await download.path(), 'utf8'));
  return file.machines.map((m: { name: string }) => m.name).sort();
}

const sorted = (names: string[]) => [...names].sort((a, b) => a.localeCompare(b));

/** The text of a message on the page now ('' while it is not shown): never waits for it. */
async function shown(page: Page, testId: string): Promise<string> {
  return (await page.getByTestId(testId).allInnerTexts()).join('\n');
}

describe('two tabs of the app', () => {
  test('each saving a different machine: both on the device, both tabs list both', async () => {
    const { context, page: first } = await freshApp();
    const second = await context.newPage();
    await openApp(second, inject('baseUrl'));
    expect(await diskNames(first)).toEqual([EXAMPLE]);

    expect(await saveAs(first, 'Kiln fan')).toBe('Saved as "Kiln fan".');
    expect(await saveAs(second, 'Auger')).toBe('Saved as "Auger".');

    const both = sorted(['Auger', EXAMPLE, 'Kiln fan']);
    expect(await diskNames(first)).toEqual(both);
    // Each tab hears of the other's save and reads the list again.
    await expect.poll(() => listedNames(first)).toEqual(both);
    await expect.poll(() => listedNames(second)).toEqual(both);
  });

  test('editing the same machine: both edits kept, the later as a copy, and said so', async () => {
    const { context, page: first } = await freshApp();
    await typeInto(first, 'Speed', '1480');
    expect(await saveAs(first, 'Press')).toBe('Saved as "Press".');
    const second = await context.newPage();
    await openApp(second, inject('baseUrl'));
    await expect.poll(() => listedNames(second)).toContain('Press');
    await second
      .locator('article', { has: second.getByRole('heading', { name: 'Press', exact: true }) })
      .getByRole('button', { name: 'Open' })
      .click();
    await second.getByText('Opened from Press').waitFor();
    const example = (await diskMachines(first)).find((m) => m.name === EXAMPLE)!;
    expect((await diskMachines(first)).length).toBe(2);

    await first.getByRole('button', { name: 'Check', exact: true }).click();
    await typeInto(first, 'Speed', '1500');
    await first.getByRole('button', { name: 'Save changes to this machine' }).click();
    await expect.poll(() => shown(first, 'keep-outcome')).toBe('Changes saved to "Press".');

    await typeInto(second, 'Speed', '1600');
    await second.getByRole('button', { name: 'Save changes to this machine' }).click();
    await expect
      .poll(() => shown(second, 'keep-outcome'))
      .toBe('Another tab saved "Press" meanwhile: both are kept, this one as "Press (kept copy)".');

    const disk = await diskMachines(first);
    expect(disk.map((m) => [m.name, m.speedRpm])).toEqual([
      [EXAMPLE, example.speedRpm],
      ['Press', 1500],
      ['Press (kept copy)', 1600],
    ]);
    expect(disk.find((m) => m.name === 'Press')?.version).toBe(2);
    const all = sorted([EXAMPLE, 'Press', 'Press (kept copy)']);
    await expect.poll(() => listedNames(first)).toEqual(all);
    await expect.poll(() => listedNames(second)).toEqual(all);
    // The second tab now works on its copy: saving again goes to the copy, not over the first's.
    await second.getByRole('button', { name: 'Check', exact: true }).click();
    await second.getByText('Opened from Press (kept copy)').waitFor();
    await typeInto(second, 'Speed', '1650');
    await second.getByRole('button', { name: 'Save changes to this machine' }).click();
    await expect
      .poll(() => shown(second, 'keep-outcome'))
      .toBe('Changes saved to "Press (kept copy)".');
    expect((await diskMachines(first)).map((m) => [m.name, m.speedRpm])).toEqual([
      [EXAMPLE, example.speedRpm],
      ['Press', 1500],
      ['Press (kept copy)', 1650],
    ]);
  });
});

describe('site data cleared while the app is open', () => {
  test('by the browser (clear site data): the next save writes everything back and says why', async () => {
    const { context, page } = await freshApp();
    await saveAs(page, 'Mixer');
    await saveAs(page, 'Dryer');
    expect(await diskNames(page)).toEqual(sorted([EXAMPLE, 'Mixer', 'Dryer']));

    await clearSiteData(context, page);
    await expect.poll(() => diskNames(page)).toEqual([]);

    expect(await saveAs(page, 'Cooler')).toBe('Saved as "Cooler".');
    const all = sorted([EXAMPLE, 'Mixer', 'Dryer', 'Cooler']);
    expect(await diskNames(page)).toEqual(all);
    await expect
      .poll(() => shown(page, 'storage-message'))
      .toMatch(
        /^Saved data on this device was cleared while Trueturn was open \(by the browser's settings or another page\)\. Everything this tab held was written back: 4 machines and the set-up on screen\./,
      );
    expect(await shown(page, 'storage-message')).not.toMatch(/older version/);

    await reloadApp(page);
    await page.getByTestId('verdict').waitFor();
    await expect.poll(() => listedNames(page)).toEqual(all);
    expect(await page.locator('body').innerText()).not.toMatch(/older version|could not be read/);
    expect(await diskNames(page)).toEqual(all);
  });

  test('by another page deleting the database: the next keystroke writes everything back', async () => {
    const { context, page } = await freshApp();
    await saveAs(page, 'Conveyor');
    const other = await context.newPage();
    await other.goto(`${inject('baseUrl')}manifest.webmanifest`);
    await deleteDatabaseFrom(other);
    await expect.poll(() => diskNames(page)).toEqual([]);

    await page.getByRole('button', { name: 'Check', exact: true }).click();
    await typeInto(page, 'Speed', '2222');
    const all = sorted([EXAMPLE, 'Conveyor']);
    await expect.poll(() => diskNames(page)).toEqual(all);
    await expect.poll(async () => (await diskWork(page))?.speedRpm).toBe(2222);
    await expect
      .poll(() => shown(page, 'storage-message'))
      .toMatch(/^Saved data on this device was cleared while Trueturn was open .*: 2 machines/);

    await reloadApp(page);
    await page.getByTestId('verdict').waitFor();
    await expect.poll(() => listedNames(page)).toEqual(all);
    await page.getByRole('button', { name: 'Check', exact: true }).click();
    await expect.poll(() => page.getByLabel('Speed', { exact: true }).inputValue()).toBe('2222');
  });
});

describe('a device that refuses writes (storage full)', () => {
  test('at start-up: saved machines still listed, a save never says Saved, saving resumes by itself', async () => {
    const { page } = await freshApp();
    await saveAs(page, 'Hammer mill');
    const before = sorted([EXAMPLE, 'Hammer mill']);
    expect(await diskNames(page)).toEqual(before);

    await page.addInitScript(fullDiskScript, true);
    await reloadApp(page);
    await page.getByTestId('verdict').waitFor();
    const status = page.getByTestId('storage-status');
    await expect
      .poll(() => shown(page, 'storage-status'))
      .toMatch(/^Not saved on this device: the storage on this device is full\./);
    expect(await refusedWrites(page)).toBeGreaterThan(0);
    // Reads still work: the list is what is on the device, the example not forced on it.
    await expect.poll(() => listedNames(page)).toEqual(before);

    const said = await saveAs(page, 'Pellet press');
    expect(said).not.toMatch(/Saved/);
    expect(said).toMatch(/^Not saved on this device yet: "Pellet press" is kept in this tab/);
    expect(await diskNames(page)).toEqual(before);
    const held = sorted([...before, 'Pellet press']);
    expect(await listedNames(page)).toEqual(held);
    expect(await page.getByTestId('held-mark').count()).toBe(1);
    // Export works whatever the device does, and holds every machine, the held one too.
    expect(await exportedNames(page)).toEqual(held);

    await setDiskFull(page, false);
    await expect.poll(() => diskNames(page), RESUME_WAIT).toEqual(held);
    await expect.poll(() => status.count()).toBe(0);
    await expect
      .poll(() => shown(page, 'storage-message'))
      .toMatch(/Saving works again: every change held in this tab is now on this device\./);
    await expect.poll(() => page.getByTestId('held-mark').count()).toBe(0);

    await reloadApp(page);
    await page.getByTestId('verdict').waitFor();
    await expect.poll(() => listedNames(page)).toEqual(held);
    expect(await status.count()).toBe(0);
  });

  test('during a save: held in the tab, never "Saved", written by itself once space is back', async () => {
    session = await openBrowser({ width: 1280, height: 800 });
    const { page } = session;
    await page.addInitScript(fullDiskScript, false);
    await openApp(page, inject('baseUrl'));
    await expect.poll(() => diskNames(page)).toEqual([EXAMPLE]);
    expect(await saveAs(page, 'Blower')).toBe('Saved as "Blower".');
    const before = sorted([EXAMPLE, 'Blower']);
    expect(await diskNames(page)).toEqual(before);

    await setDiskFull(page, true);
    await typeInto(page, 'Speed', '3100');
    const said = await saveAs(page, 'Auger');
    expect(said).toMatch(/^Not saved on this device yet: "Auger" is kept in this tab/);
    const status = page.getByTestId('storage-status');
    await expect
      .poll(() => shown(page, 'storage-status'))
      .toMatch(/^Not saved on this device: the storage on this device is full\./);
    expect(await diskNames(page)).toEqual(before);

    await setDiskFull(page, false);
    const held = sorted([...before, 'Auger']);
    await expect.poll(() => diskNames(page), RESUME_WAIT).toEqual(held);
    expect((await diskMachines(page)).find((m) => m.name === 'Auger')?.speedRpm).toBe(3100);
    await expect.poll(async () => (await diskWork(page))?.speedRpm).toBe(3100);
    await expect.poll(() => status.count()).toBe(0);
    // The save's own message follows: it no longer says the machine waits.
    await expect.poll(() => shown(page, 'keep-outcome')).toBe('Saved as "Auger".');
    expect(await listedNames(page)).toEqual(held);

    await reloadApp(page);
    await page.getByTestId('verdict').waitFor();
    await expect.poll(() => listedNames(page)).toEqual(held);
    await page.getByRole('button', { name: 'Check', exact: true }).click();
    await expect.poll(() => page.getByLabel('Speed', { exact: true }).inputValue()).toBe('3100');
  });
});

describe('a browser that offers no storage', () => {
  test.each([
    {
      how: 'no IndexedDB at all',
      script: noIndexedDbScript,
      reason: 'Saving is off: this browser offers no storage to this page.',
    },
    {
      how: 'IndexedDB blocked (opening it throws)',
      script: () => {
        IDBFactory.prototype.open = () => {
          throw new DOMException(
            'The user denied permission to access the database.',
            'SecurityError',
          );
        };
      },
      reason:
        'Saving is off: this browser does not let this page save (a private window, or storage blocked in settings).',
    },
  ])('$how: works in memory, says so, export works', async ({ script, reason }) => {
    const { context, page: clean } = await freshApp();
    await saveAs(clean, 'Kiln');
    const before = sorted([EXAMPLE, 'Kiln']);
    expect(await diskNames(clean)).toEqual(before);

    const page = await context.newPage();
    await page.addInitScript(script);
    await openApp(page, inject('baseUrl'));
    await expect
      .poll(() => shown(page, 'storage-status'))
      .toBe(
        `${reason} Changes are kept only until this tab is closed; export your machines to keep them.`,
      );
    const said = await saveAs(page, 'Scratch');
    expect(said).not.toMatch(/Saved/);
    expect(said).toMatch(/^Kept in this tab only as "Scratch"/);
    expect(await listedNames(page)).toEqual(sorted([EXAMPLE, 'Scratch']));
    expect(await page.getByTestId('storage-state').innerText()).toContain(reason);
    expect(await exportedNames(page)).toEqual(sorted([EXAMPLE, 'Scratch']));
    // What the device held before is untouched.
    expect(await diskNames(clean)).toEqual(before);
  });
});

describe('asking the browser to keep the data', () => {
  test.each([
    { granted: false, notes: 1 },
    { granted: true, notes: 0 },
  ])('persist() answered $granted: a note only when refused', async ({ granted, notes }) => {
    session = await openBrowser({ width: 1280, height: 800 });
    const { page } = session;
    await page.addInitScript(persistAnswerScript, granted);
    await openApp(page, inject('baseUrl'));
    await expect
      .poll(() =>
        page.evaluate(() => (window as unknown as { __persistAsked: number }).__persistAsked),
      )
      .toBe(1);
    await page.getByRole('button', { name: 'Machines', exact: true }).click();
    await page.getByTestId('storage-state').waitFor();
    await expect.poll(() => page.getByTestId('persist-note').count()).toBe(notes);
    if (notes > 0) {
      expect(await page.getByTestId('persist-note').innerText()).toMatch(
        /^This browser did not promise to keep Trueturn's data: it may clear it when the device runs short of space\./,
      );
    }
  });
});

describe('the working copy while typing', () => {
  test('a reload right after the last keystroke keeps it', async () => {
    const { page } = await freshApp();
    await typeInto(page, 'Speed', '1234');
    await reloadApp(page);
    await page.getByTestId('verdict').waitFor();
    await expect.poll(() => page.getByLabel('Speed', { exact: true }).inputValue()).toBe('1234');
    expect((await diskWork(page))?.speedRpm).toBe(1234);
  });

  test('typing before the session has opened keeps what was typed, over the last visit, and saves it', async () => {
    const { page } = await freshApp();
    await typeInto(page, 'Speed', '1234');
    await expect.poll(async () => (await diskWork(page))?.speedRpm).toBe(1234);
    // The session's code loads after the first paint: hold it back, type, then let it in. The
    // service worker would serve it from its cache, past the hold: it is taken off first.
    await page.evaluate(async () => {
      for (const r of await navigator.serviceWorker.getRegistrations()) await r.unregister();
    });
    let release: () => void = () => undefined;
    const held = new Promise<void>((resolve) => (release = resolve));
    await page.route(/\/assets\/session-[^/]*\.js$/, async (route) => {
      await held;
      await route.continue();
    });
    await page.reload();
    const speed = page.getByLabel('Speed', { exact: true });
    await speed.waitFor();
    expect(await page.locator('html[data-session="open"]').count()).toBe(0);
    await typeInto(page, 'Speed', '2468');
    release();
    await page.locator('html[data-session="open"]').waitFor({ state: 'attached' });
    // The last visit's 1234 did not replace the typing, and the typing reaches the device.
    expect(await speed.inputValue()).toBe('2468');
    await expect.poll(async () => (await diskWork(page))?.speedRpm).toBe(2468);
  });

  test('closing the tab right after the last keystroke keeps it', async () => {
    const { context, page } = await freshApp();
    await typeInto(page, 'Speed', '4321');
    await page.close();
    const again = await context.newPage();
    await openApp(again, inject('baseUrl'));
    await expect.poll(() => again.getByLabel('Speed', { exact: true }).inputValue()).toBe('4321');
    expect((await diskWork(again))?.speedRpm).toBe(4321);
  });
});
