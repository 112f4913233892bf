// The running app asks its service worker registration for an update when it comes back to the
// foreground, once per return (src/app/update-notice/update-checks.ts; the hourly check is
// shown with fake timers in test/app/update-checks.test.ts). Visibility is played by the
// test: headless Chromium keeps its one page visible.
import { afterEach, describe, expect, inject, test } from 'vitest';
import type { Page } from 'playwright-core';
import { openApp, openBrowser, type Session } from './browser';

let session: Session | undefined;

afterEach(async () => {
  await session?.close();
  session = undefined;
});

interface Updates {
  asked: number;
  settled: number;
}

/** Sets what document.visibilityState says and fires visibilitychange, as the browser would; returns the update count right after. */
function setVisibility(page: Page, state: 'hidden' | 'visible'): Promise<Updates> {
  return page.evaluate((s) => {
    Object.defineProperty(document, 'visibilityState', { configurable: true, get: () => s });
    document.dispatchEvent(new Event('visibilitychange'));
    return { ...(window as unknown as { updates: Updates }).updates };
  }, state);
}

const updates = (page: Page) =>
  page.evaluate(() => ({ ...(window as unknown as { updates: Updates }).updates }));

describe('a tab left open', () => {
  test('asks for a new version each time it comes back to the foreground, once per return', async () => {
    session = await openBrowser();
    const { page } = session;
    // Count the app's calls of ServiceWorkerRegistration.update() and their answers.
    await session.context.addInitScript(() => {
      const counts = { asked: 0, settled: 0 };
      (window as unknown as { updates: Updates }).updates = counts;
      const update = ServiceWorkerRegistration.prototype.update;
      ServiceWorkerRegistration.prototype.update = function (this: ServiceWorkerRegistration) {
        counts.asked++;
        const answer = update.call(this);
        void answer.then(
          () => counts.settled++,
          () => counts.settled++,
        );
        return answer;
      };
    });
    await openApp(page, inject('baseUrl'));
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready;
    });
    expect(await updates(page)).toEqual({ asked: 0, settled: 0 });

    await setVisibility(page, 'hidden');
    expect(await setVisibility(page, 'visible')).toMatchObject({ asked: 1 });
    // The browser fetches the worker's script and compares it: this can take a second or two.
    await expect.poll(() => updates(page), { timeout: 20_000 }).toEqual({ asked: 1, settled: 1 });
    // Another "visible" with no hiding in between is not a return.
    expect(await setVisibility(page, 'visible')).toMatchObject({ asked: 1 });

    await setVisibility(page, 'hidden');
    expect(await setVisibility(page, 'visible')).toMatchObject({ asked: 2 });
    await expect.poll(() => updates(page), { timeout: 20_000 }).toEqual({ asked: 2, settled: 2 });
  });
});
