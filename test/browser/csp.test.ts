// The built page's Content-Security-Policy (scripts/content-security-policy.ts): it is in the
// page, and the app runs under it without a single violation on every screen and mode, through
// a share link, a download and the offline reload from the service worker. A control at the end
// shows the recorder works: inline code and a style attribute added by the test are refused.
import { afterEach, describe, expect, inject, test } from 'vitest';
import type { Page } from 'playwright-core';
import { policyText } from '../../scripts/content-security-policy';
import { blankHeader, defaultSetup, defaultToolInputs } from '../../src/state/model';
import { encodeShareFragment } from '../../src/state/shareLink';
import { openApp, openBrowser, type Session, reloadApp } from './browser';
import { TOURS } from './every-screen';
import { startPreview, type PreviewServer } from './server';

let session: Session | undefined;
let server: PreviewServer | undefined;

afterEach(async () => {
  await session?.close();
  await server?.stop();
  session = undefined;
  server = undefined;
});

/**
 * Records every violation the page reports (the securitypolicyviolation event, from before any
 * of the page's own scripts run, after every reload) and every console line about the policy.
 */
async function recordViolations(session: Session): Promise<string[]> {
  const seen: string[] = [];
  await session.context.exposeBinding('reportViolation', (_source, text: string) => {
    seen.push(text);
  });
  await session.context.addInitScript(() => {
    document.addEventListener(
      'securitypolicyviolation',
      (e) => {
        const report = (window as unknown as { reportViolation: (t: string) => void })
          .reportViolation;
        void report(
          `${e.effectiveDirective} blocked ${e.blockedURI || 'inline'} at ${e.sourceFile}`,
        );
      },
      { capture: true },
    );
  });
  session.page.on('console', (message) => {
    if (/Content.Security.Policy/i.test(message.text())) seen.push(`console: ${message.text()}`);
  });
  return seen;
}

/** Every screen, with every choice that brings more on screen, or (`onlyTabs`) each tab's first view. */
async function visitEveryScreen(page: Page, onlyTabs = false): Promise<void> {
  for (const tour of TOURS) {
    for (const step of onlyTabs ? tour.steps.slice(0, 1) : tour.steps) await step.go(page);
  }
}

describe('the Content-Security-Policy of the built page', () => {
  test('stands first in the head, before any script or style sheet, allowing the own origin only', async () => {
    const html = await (await fetch(inject('baseUrl'))).text();
    const meta = `<meta http-equiv="Content-Security-Policy" content="${policyText()}" />`;
    expect(html).toContain(meta);
    expect(html.indexOf(meta)).toBeLessThan(
      html.search(/<script|<link rel="(stylesheet|modulepreload)"/),
    );
    for (const directive of [
      "default-src 'self'",
      "script-src 'self'",
      "style-src 'self'",
      "worker-src 'self'",
      "img-src 'self'",
      "connect-src 'self'",
      "object-src 'none'",
      "base-uri 'none'",
      "form-action 'none'",
    ]) {
      expect(policyText()).toContain(directive);
    }
    expect(policyText()).not.toMatch(/unsafe|\*|data:|blob:|https?:/);
  });

  test('the app records zero violations on every screen, through a share link, a download and the offline reload', async () => {
    server = await startPreview(inject('distDir'));
    session = await openBrowser();
    const { page } = session;
    const violations = await recordViolations(session);

    // Opened from a share link.
    const shared = {
      ...blankHeader('Shared kiln fan'),
      setup: { ...structuredClone(defaultSetup), creepRpm: 7 },
      tools: defaultToolInputs(),
    };
    await openApp(page, server.url + encodeShareFragment(shared));
    await expect
      .poll(() => page.getByTestId('session-message').innerText())
      .toMatch(/Opened "Shared kiln fan" from a share link/);
    await expect.poll(() => page.getByLabel('Creep speed wanted').inputValue()).toBe('7');

    await visitEveryScreen(page);
    // A download made in the page (a file from a blob).
    const download = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Export all machines' }).click();
    expect((await download).suggestedFilename()).toMatch(/^trueturn-machines-.*\.json$/);

    // The offline reload: once the worker controls the page, stop the server and reload.
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready;
    });
    await reloadApp(page);
    await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
    await page.getByTestId('verdict').waitFor();
    await server.stop();
    await expect(fetch(server.url)).rejects.toThrow();
    await reloadApp(page);
    await page.getByTestId('verdict').waitFor();
    await visitEveryScreen(page, true);
    expect(await page.getByTestId('screen-load-failed').count()).toBe(0);

    expect(violations).toEqual([]);

    // The control: the recorder hears a violation, and inline code and style attributes are refused.
    const control = await page.evaluate(() => {
      const script = document.createElement('script');
      script.textContent = 'window.inlineRan = true';
      document.head.append(script);
      document.body.setAttribute('style', '--probe: applied');
      return {
        ran: (window as unknown as { inlineRan?: boolean }).inlineRan === true,
        probe: getComputedStyle(document.body).getPropertyValue('--probe'),
      };
    });
    expect(control).toEqual({ ran: false, probe: '' });
    await expect
      .poll(() => violations.filter((v) => !v.startsWith('console:')))
      .toEqual([
        expect.stringMatching(/^script-src-elem blocked inline/),
        expect.stringMatching(/^style-src-attr blocked inline/),
      ]);
  });
});
