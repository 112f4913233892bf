// A share link made on one phone opens the same machine on another (a separate browser with its
// own storage), its name included; a damaged or hostile link says why, replaces nothing and
// shows no markup; a link opened while the app is open is offered, not opened over the work.
import { afterEach, describe, expect, inject, test } from 'vitest';
import {
  blankHeader,
  defaultSetup,
  defaultToolInputs,
  type MachineContent,
} from '../../src/state/model';
import { encodeShareFragment } from '../../src/state/shareLink';
import { openApp, openBrowser, storedSetup, typeInto, type Session } from './browser';

const sessions: Session[] = [];

afterEach(async () => {
  for (const s of sessions.splice(0)) await s.close();
});

async function browser(): Promise<Session> {
  const s = await openBrowser();
  sessions.push(s);
  return s;
}

/** A machine's content as a link carries it. */
function content(name: string, change: Partial<MachineContent> = {}): MachineContent {
  return {
    ...blankHeader(name),
    setup: structuredClone(defaultSetup),
    tools: defaultToolInputs(),
    ...change,
  };
}

describe('share links', () => {
  test('round trip: the link reopens the same machine, name included, in another browser', async () => {
    const first = await browser();
    await openApp(first.page, inject('baseUrl'));
    await typeInto(first.page, 'Machine name', 'Kiln 2 exhaust fan');
    await typeInto(first.page, 'Speed', '2950');
    await typeInto(first.page, 'Blades or marks', '5');
    await first.page.getByRole('radio', { name: 'Camera' }).check();
    await first.page.getByLabel('Frame rate preset').selectOption({ label: '59.94 (60000/1001)' });
    await first.page.getByRole('button', { name: 'Make a share link' }).click();
    const link = await first.page.getByTestId('share-link').inputValue();
    expect(link.startsWith(inject('baseUrl'))).toBe(true);
    expect(link).toMatch(/#s=2\./);
    const verdict = await first.page.getByTestId('verdict').innerText();
    const seen = await first.page.getByTestId('apparent-speed').innerText();

    const second = await browser();
    await openApp(second.page, link);
    await second.page.getByTestId('verdict').waitFor();
    await expect
      .poll(() => second.page.getByLabel('Speed', { exact: true }).inputValue())
      .toBe('2950');
    expect(await second.page.getByLabel('Blades or marks').inputValue()).toBe('5');
    expect(await second.page.getByLabel('Frame rate', { exact: true }).inputValue()).toBe(
      '59.94006',
    );
    expect(await second.page.getByLabel('Machine name').inputValue()).toBe('Kiln 2 exhaust fan');
    expect(await second.page.getByTestId('verdict').innerText()).toBe(verdict);
    expect(await second.page.getByTestId('apparent-speed').innerText()).toBe(seen);
    expect(await second.page.getByTestId('session-message').innerText()).toMatch(
      /Opened "Kiln 2 exhaust fan" from a share link/,
    );
    // The address no longer carries the machine, so a reload keeps later changes.
    expect(new URL(second.page.url()).hash).toBe('');
  });

  test('a damaged link says why and replaces nothing: the work on screen stays', async () => {
    const s = await browser();
    const good = encodeShareFragment(
      content('Shared fan', { setup: { ...defaultSetup, creepRpm: 9 } }),
    );
    for (const bad of [
      good.slice(0, -5),
      good.replace('#s=2.', '#s=2.@@'),
      '#s=9.abc',
      '#s=2.' + 'A'.repeat(40),
      // A 1 MB link is refused by its length before anything reads it.
      '#s=2.' + 'A'.repeat(1024 * 1024),
    ]) {
      // Work on a machine of one's own first, kept on the device, so replacing it would show.
      await openApp(s.page, inject('baseUrl') + 'index.html');
      await typeInto(s.page, 'Speed', '2000');
      await expect.poll(async () => (await storedSetup(s.page))?.parts[0].speedRpm).toBe(2000);
      await openApp(s.page, inject('baseUrl') + bad);
      await s.page.getByTestId('verdict').waitFor();
      await expect
        .poll(() => s.page.getByTestId('session-message').innerText())
        .toMatch(/Nothing was replaced: what you had on screen is kept\./);
      await expect
        .poll(() => s.page.getByLabel('Speed', { exact: true }).inputValue())
        .toBe('2000');
      expect(await s.page.getByLabel('Creep speed wanted').inputValue()).toBe('2');
    }
  });

  test('a link opened while the app is open is offered, and opens only when accepted', async () => {
    const s = await browser();
    await openApp(s.page, inject('baseUrl'));
    await typeInto(s.page, 'Speed', '2000');
    const shared = content('Press roll', {
      setup: {
        ...defaultSetup,
        parts: [
          { name: 'Press roll', kind: 'disc', speedRpm: 640, features: 3, tolerancePercent: 1 },
        ],
      },
    });
    await s.page.evaluate((hash) => (location.hash = hash), encodeShareFragment(shared));
    await expect.poll(() => s.page.getByTestId('share-offer').innerText()).toMatch(/"Press roll"/);
    // Offered only: the work on screen is still there.
    expect(await s.page.getByLabel('Speed', { exact: true }).inputValue()).toBe('2000');
    await s.page.getByRole('button', { name: 'Open the shared machine' }).click();
    await expect.poll(() => s.page.getByLabel('Speed', { exact: true }).inputValue()).toBe('640');
    expect(await s.page.getByLabel('Machine name').inputValue()).toBe('Press roll');
    expect(await s.page.getByTestId('share-offer').count()).toBe(0);
  });

  test('a link carrying markup shows it as text and runs nothing', async () => {
    const s = await browser();
    const hostile = content('<img src=x onerror="window.__hit=2">', {
      setup: {
        ...structuredClone(defaultSetup),
        parts: [
          {
            name: '<img src=x onerror="window.__hit=1">',
            speedRpm: 1000,
            features: 2,
            tolerancePercent: 0,
          },
        ],
      },
    });
    await openApp(s.page, inject('baseUrl') + encodeShareFragment(hostile));
    await s.page.getByTestId('verdict').waitFor();
    await expect
      .poll(() => s.page.getByTestId('part-name').innerText())
      .toContain('<img src=x onerror=');
    expect(await s.page.getByTestId('session-message').innerText()).toContain('"<img src=x');
    // The app shows no images of its own: any img element would come from the link.
    expect(await s.page.locator('img').count()).toBe(0);
    expect(await s.page.evaluate(() => (window as { __hit?: number }).__hit)).toBeUndefined();
  });
});
