// @vitest-environment happy-dom
import 'fake-indexeddb/auto';
import { cleanup, render, screen } from '@testing-library/preact';
import { afterEach, describe, expect, test } from 'vitest';
import { App } from '../../src/app/app';
import { defaultSetup, type Setup } from '../../src/state/model';
import { decodeShareFragment, encodeShareFragment } from '../../src/state/shareLink';
import { replaceSetup, setup } from '../../src/state/setup';
import { openSession, sessionMessage, startSession } from '../../src/state/session';

afterEach(cleanup);

const shared: Setup = {
  ...structuredClone(defaultSetup),
  parts: [{ name: 'Pump impeller', speedRpm: 2950, features: 5, tolerancePercent: 2 }],
  samplerKind: 'camera',
};

describe('opening a share link', () => {
  test('a link in the address opens its set-up, and the address is cleaned', async () => {
    location.hash = encodeShareFragment(shared);
    await startSession();
    expect(setup.value).toEqual(shared);
    expect(location.hash).toBe('');
    render(<App />);
    expect(screen.getByTestId('session-message').textContent).toMatch(/shared set-up/);
    expect(screen.getByTestId('part-name').textContent).toContain('Pump impeller');
  });

  test('a tampered link shows a message and the default set-up', async () => {
    replaceSetup(shared);
    const good = encodeShareFragment(shared);
    const tampered = good.slice(0, -6) + 'AAAAAA';
    await openSession({
      hash: tampered,
      decodeShare: decodeShareFragment,
      loadLast: async () => null,
      clearHash: () => {},
    });
    expect(setup.value).toEqual(defaultSetup);
    render(<App />);
    expect(screen.getByTestId('session-message').textContent).toMatch(/default set-up is shown/);
    expect(sessionMessage.value?.kind).toBe('problem');
  });

  test('a 1 MB link is refused by its length: a plain message, the default set-up, nothing loaded', async () => {
    replaceSetup(shared);
    let lastLoaded = false;
    let cleared = false;
    await openSession({
      hash: `#s=1.${'A'.repeat(1024 * 1024)}`,
      decodeShare: decodeShareFragment,
      loadLast: async () => {
        lastLoaded = true;
        return null;
      },
      clearHash: () => (cleared = true),
    });
    expect(setup.value).toEqual(defaultSetup);
    expect(sessionMessage.value).toEqual({
      kind: 'problem',
      text: 'This share link is too long to be a Trueturn link; it was not opened. The default set-up is shown instead.',
    });
    expect(lastLoaded).toBe(false);
    expect(cleared).toBe(true);
  });

  test('markup inside a link is shown as text', async () => {
    const hostile: Setup = {
      ...structuredClone(defaultSetup),
      parts: [
        {
          name: '<img src=x onerror="globalThis.__hit=1">',
          speedRpm: 1000,
          features: 2,
          tolerancePercent: 0,
        },
      ],
    };
    await openSession({
      hash: encodeShareFragment(hostile),
      decodeShare: decodeShareFragment,
      loadLast: async () => null,
      clearHash: () => {},
    });
    render(<App />);
    expect(screen.getByTestId('part-name').textContent).toContain('<img src=x');
    expect(document.querySelector('main img')).toBeNull();
    expect((globalThis as { __hit?: number }).__hit).toBeUndefined();
  });
});
