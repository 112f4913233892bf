// Saved machines in a real browser: they survive a reload, go out to a file and come back.
import { afterEach, describe, expect, inject, test } from 'vitest';
import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { openApp, openBrowser, storedSetup, typeInto, type Session, reloadApp } from './browser';

let session: Session | undefined;

afterEach(async () => {
  await session?.close();
  session = undefined;
});

async function saveMachine(session: Session, name: string) {
  const { page } = session;
  await page.getByLabel('Machine name').fill(name);
  await page.getByRole('button', { name: 'Save as new machine' }).click();
  await page.getByText(`Saved as "${name}".`).waitFor();
}

/**
 * What has focus: its tag and its accessible name as the page gives it (the text of the element
 * aria-labelledby names, else its own text). "BODY" means focus fell to the page.
 */
function focused(page: Page): Promise<string> {
  return page.evaluate(() => {
    const el = document.activeElement;
    if (!el || el === document.body) return 'BODY';
    const labelledBy = el.getAttribute('aria-labelledby');
    const name = labelledBy
      ? (document.getElementById(labelledBy)?.textContent ?? '')
      : (el.textContent ?? '');
    return `${el.tagName} ${name.trim()}`;
  });
}

describe('saved machines', () => {
  test('survive a reload, with the set-up last on screen', async () => {
    session = await openBrowser();
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    await typeInto(page, 'Speed', '1480');
    await saveMachine(session, 'Sifter drive');
    await typeInto(page, 'Blades or marks', '4');
    // The reload must come after the page has stored that change.
    await expect.poll(async () => (await storedSetup(page))?.parts[0].features).toBe(4);

    await reloadApp(page);
    await page.getByTestId('verdict').waitFor();
    await expect.poll(() => page.getByLabel('Speed', { exact: true }).inputValue()).toBe('1480');
    await expect.poll(() => page.getByLabel('Blades or marks').inputValue()).toBe('4');
    await page.getByRole('button', { name: 'Machines' }).click();
    const list = page.getByTestId('machine-list');
    await expect.poll(() => list.innerText()).toContain('Sifter drive');
    // The first-run example is there too.
    expect(await list.innerText()).toContain('Example: cooler fan, pellet line 2');

    // Closing the tab and opening the app again keeps them as well.
    await page.close();
    const again = await session.context.newPage();
    await openApp(again, inject('baseUrl'));
    await again.getByRole('button', { name: 'Machines' }).click();
    await expect
      .poll(() => again.getByTestId('machine-list').innerText())
      .toContain('Sifter drive');
  });

  test('export to a file and import it back after deleting', async () => {
    session = await openBrowser({ width: 1280, height: 800 });
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    await saveMachine(session, 'Granulator rotor');
    await page.getByRole('button', { name: 'Machines' }).click();

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('button', { name: 'Export all machines' }).click(),
    ]);
    expect(download.suggestedFilename()).toMatch(/^trueturn-machines-\d{4}-\d{2}-\d{2}\.json$/);
    const path = await download.path();
    const file = JSON.parse(readFileSync(path, 'utf8'));
    expect(file.format).toBe('trueturn-machines');
    expect(file.machines.map((m: { name: string }) => m.name)).toContain('Granulator rotor');

    const row = page.locator('article', {
      has: page.getByRole('heading', { name: 'Granulator rotor' }),
    });
    await row.getByRole('button', { name: 'Delete' }).click();
    await page.getByTestId('undo-bar').waitFor();
    // The last machine of the list went: focus is on Undo, never on the page itself.
    await expect.poll(() => focused(page)).toBe('BUTTON Undo');
    await page.getByTestId('undo-bar').getByRole('button', { name: 'Close' }).click();
    await expect
      .poll(() => page.getByTestId('machine-list').innerText())
      .not.toContain('Granulator rotor');
    // The undo bar went too: focus is on the list's heading.
    await expect.poll(() => focused(page)).toBe('H2 Saved machines');

    await page.getByTestId('import-file').setInputFiles(path);
    await expect
      .poll(() => page.getByTestId('machines-outcome').innerText())
      .toMatch(/^Imported 2 machines/);
    expect(await page.getByTestId('machine-list').innerText()).toContain('Granulator rotor');

    // Deleting a machine with others after it puts focus on the next one, read by its name.
    const example = page.locator('article', {
      has: page.getByRole('heading', { name: 'Example: cooler fan, pellet line 2', exact: true }),
    });
    await example.getByRole('button', { name: 'Delete' }).click();
    await expect
      .poll(() => focused(page))
      .toBe('ARTICLE Example: cooler fan, pellet line 2 (imported)');
  });

  test('a bad import file shows a message and changes nothing', async () => {
    session = await openBrowser();
    const { page } = session;
    await openApp(page, inject('baseUrl'));
    await page.getByRole('button', { name: 'Machines' }).click();
    const list = page.getByTestId('machine-list');
    await expect.poll(() => list.innerText()).toContain('Example');
    const before = await list.innerText();
    for (const bad of [
      'this is not JSON',
      '{"format":"trueturn-machines","version":1,"machines":"none"}',
      '',
    ]) {
      await page.getByTestId('import-file').setInputFiles({
        name: 'machines.json',
        mimeType: 'application/json',
        buffer: Buffer.from(bad),
      });
      await expect
        .poll(() => page.getByTestId('machines-outcome').innerText())
        .toMatch(/^Nothing was imported/);
      expect(await page.getByRole('alert').count()).toBeGreaterThan(0);
      expect(await list.innerText()).toBe(before);
    }
  });
});
