// A share link made on one phone opens the same set-up on another (a separate browser with its
// own storage); a damaged or hostile link shows a message, the default set-up and no markup.
import { afterEach, describe, expect, inject, test } from 'vitest';
import { defaultSetup, type Setup } from '../../src/state/model';
import { encodeShareFragment } from '../../src/state/shareLink';
import { openApp, openBrowser, typeInto, type Session } from './browser';

const sessions: Session[] = [];

afterEach(async () => {
  for (const s of sessions.splice(0)) await s.close();
});

async function browser(): Promise<Session> {
  const s = await openBrowser();
  sessions.push(s);
  return s;
}

describe('share links', () => {
  test('round trip: the link reopens the same set-up in another browser', async () => {
    const first = await browser();
    await openApp(first.page, inject('baseUrl'));
    await typeInto(first.page, 'Speed', '2950');
    await typeInto(first.page, 'Blades or marks', '5');
    await first.page.getByRole('radio', { name: 'Camera' }).check();
    await first.page.getByLabel('Frame rate preset').selectOption({ label: '59.94 (60000/1001)' });
    await first.page.getByRole('button', { name: 'Make a share link' }).click();
    const link = await first.page.getByTestId('share-link').inputValue();
    expect(link.startsWith(inject('baseUrl'))).toBe(true);
    expect(link).toMatch(/#s=1\./);
    const verdict = await first.page.getByTestId('verdict').innerText();
    const seen = await first.page.getByTestId('apparent-speed').innerText();

    const second = await browser();
    await second.page.goto(link);
    await second.page.getByTestId('verdict').waitFor();
    await expect
      .poll(() => second.page.getByLabel('Speed', { exact: true }).inputValue())
      .toBe('2950');
    expect(await second.page.getByLabel('Blades or marks').inputValue()).toBe('5');
    expect(await second.page.getByLabel('Frame rate', { exact: true }).inputValue()).toBe(
      '59.94006',
    );
    expect(await second.page.getByTestId('verdict').innerText()).toBe(verdict);
    expect(await second.page.getByTestId('apparent-speed').innerText()).toBe(seen);
    expect(await second.page.getByTestId('session-message').innerText()).toMatch(/shared set-up/);
    // The address no longer carries the set-up, so a reload keeps later changes.
    expect(new URL(second.page.url()).hash).toBe('');
  });

  test('a damaged link shows a message and the default set-up', async () => {
    const s = await browser();
    const good = encodeShareFragment({ ...structuredClone(defaultSetup), creepRpm: 9 });
    for (const bad of [
      good.slice(0, -5),
      good.replace('#s=1.', '#s=1.@@'),
      '#s=9.abc',
      '#s=1.' + 'A'.repeat(40),
      // A 1 MB link is refused by its length before anything reads it.
      '#s=1.' + 'A'.repeat(1024 * 1024),
    ]) {
      // Work on a set-up of one's own first, so showing the default is a real change.
      await openApp(s.page, inject('baseUrl') + 'index.html');
      await typeInto(s.page, 'Speed', '2000');
      await s.page.goto(inject('baseUrl') + bad);
      await s.page.getByTestId('verdict').waitFor();
      await expect
        .poll(() => s.page.getByTestId('session-message').innerText())
        .toMatch(/default set-up is shown/);
      expect(await s.page.getByLabel('Speed', { exact: true }).inputValue()).toBe('1770');
      expect(await s.page.getByLabel('Creep speed wanted').inputValue()).toBe('2');
    }
  });

  test('a link carrying markup shows it as text and runs nothing', async () => {
    const s = await browser();
    const hostile: Setup = {
      ...structuredClone(defaultSetup),
      parts: [
        {
          name: '<img src=x onerror="window.__hit=1">',
          speedRpm: 1000,
          features: 2,
          tolerancePercent: 0,
        },
      ],
    };
    await s.page.goto(inject('baseUrl') + encodeShareFragment(hostile));
    await s.page.getByTestId('verdict').waitFor();
    await expect
      .poll(() => s.page.getByTestId('part-name').innerText())
      .toContain('<img src=x onerror=');
    expect(await s.page.locator('main img').count()).toBe(0);
    expect(await s.page.evaluate(() => (window as { __hit?: number }).__hit)).toBeUndefined();
  });
});
