// Offline use: after the first visit the app and the saved machines must work with the server
// gone. This test runs its own preview server so stopping it does not disturb other tests.
import { afterEach, describe, expect, inject, test } from 'vitest';
import { openApp, openBrowser, storedSetup, typeInto, type Session, reloadApp } from './browser';
import { startPreview, type PreviewServer } from './server';

let session: Session | undefined;
let server: PreviewServer | undefined;

afterEach(async () => {
  await session?.close();
  await server?.stop();
  session = undefined;
  server = undefined;
});

describe('with no network after the first visit', () => {
  test('a reload with the server stopped brings back the app, the set-up and every saved machine', async () => {
    server = await startPreview(inject('distDir'));
    session = await openBrowser();
    const { page } = session;
    await openApp(page, server.url);

    // registerType 'prompt' without clientsClaim leaves the first visit uncontrolled: wait until
    // the worker is active, then reload once so it controls the page.
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready;
    });
    await reloadApp(page);
    await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
    await page.getByTestId('verdict').waitFor();

    await typeInto(page, 'Speed', '2900');
    await page.getByLabel('Machine name').fill('Offline pump');
    await page.getByRole('button', { name: 'Save as new machine' }).click();
    await page.getByText('Saved as "Offline pump".').waitFor();
    await expect.poll(async () => (await storedSetup(page))?.parts[0].speedRpm).toBe(2900);

    await server.stop();
    // The server is really gone: a direct request fails.
    await expect(fetch(server.url)).rejects.toThrow();

    await reloadApp(page);
    await page.getByTestId('verdict').waitFor();
    // The page paints at once and the last set-up arrives from storage a moment later.
    await expect.poll(() => page.getByLabel('Speed', { exact: true }).inputValue()).toBe('2900');
    expect(await page.getByTestId('true-speed').innerText()).toBe('2,900 rpm');

    // Still usable: typing gives new results at once.
    await typeInto(page, 'Blades or marks', '1');
    await typeInto(page, 'Flash rate', '2900');
    await expect.poll(() => page.getByTestId('verdict').innerText()).toMatch(/^Looks still/);

    await page.getByRole('button', { name: 'Machines' }).click();
    await expect.poll(() => page.getByTestId('machine-list').innerText()).toContain('Offline pump');

    // The field tools live in a chunk loaded after the first paint: it must come from the cache.
    for (const [tab, heading] of [
      ['Lighting', 'Under this light'],
      ['Whole machine', 'Parts and drives'],
    ]) {
      await page.getByRole('button', { name: tab, exact: true }).click();
      await page.getByRole('heading', { name: heading }).first().waitFor();
    }
    expect(await page.getByTestId('screen-load-failed').count()).toBe(0);
  });
});
