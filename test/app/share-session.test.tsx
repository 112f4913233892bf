// @vitest-environment happy-dom
import 'fake-indexeddb/auto';
import { cleanup, render, screen } from '@testing-library/preact';
import { afterEach, describe, expect, test } from 'vitest';
import { App } from '../../src/app/app';
import {
  blankHeader,
  defaultSetup,
  defaultToolInputs,
  type MachineContent,
  type Setup,
} from '../../src/state/model';
import { decodeShareFragment, encodeShareFragment } from '../../src/state/shareLink';
import { replaceSetup, setup } from '../../src/state/setup';
import { header } from '../../src/state/work';
import { openSession, sessionMessage, startSession } from '../../src/state/session';

afterEach(cleanup);

const shared: Setup = {
  ...structuredClone(defaultSetup),
  parts: [{ name: 'Pump impeller', speedRpm: 2950, features: 5, tolerancePercent: 2 }],
  samplerKind: 'camera',
};

/** A shared machine holding `s`. */
const machineOf = (s: Setup, name = 'Pump 3'): MachineContent => ({
  ...blankHeader(name),
  setup: s,
  tools: defaultToolInputs(),
});

describe('opening a share link', () => {
  test('a link in the address opens its machine, name included, and the address is cleaned', async () => {
    location.hash = encodeShareFragment(machineOf(shared));
    await startSession();
    expect(setup.value).toEqual(shared);
    expect(header.value.name).toBe('Pump 3');
    expect(location.hash).toBe('');
    render(<App />);
    expect(screen.getByTestId('session-message').textContent).toMatch(
      /^Opened "Pump 3" from a share link\. Save it as a machine to keep it\./,
    );
    expect(screen.getByTestId('part-name').textContent).toContain('Pump impeller');
  });

  test('a tampered link shows a message and leaves what was on screen', async () => {
    replaceSetup(shared);
    const good = encodeShareFragment(machineOf(shared));
    const tampered = good.slice(0, -6) + 'AAAAAA';
    await openSession({
      hash: tampered,
      decodeShare: decodeShareFragment,
      loadLast: async () => null,
      clearHash: () => {},
    });
    expect(setup.value).toEqual(shared);
    render(<App />);
    expect(screen.getByTestId('session-message').textContent).toMatch(
      /Nothing was replaced: what you had on screen is kept\./,
    );
    expect(sessionMessage.value?.kind).toBe('problem');
  });

  test('a 1 MB link is refused by its length: a plain message, and what was on screen stays', async () => {
    replaceSetup(shared);
    let lastLoaded = false;
    let cleared = false;
    await openSession({
      hash: `#s=2.${'A'.repeat(1024 * 1024)}`,
      decodeShare: decodeShareFragment,
      loadLast: async () => {
        lastLoaded = true;
        return null;
      },
      clearHash: () => (cleared = true),
    });
    expect(setup.value).toEqual(shared);
    expect(sessionMessage.value).toEqual({
      kind: 'problem',
      text: 'This share link is too long to be a Trueturn link; it was not opened. Nothing was replaced: what you had on screen is kept.',
    });
    expect(lastLoaded).toBe(true);
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
      hash: encodeShareFragment(machineOf(hostile, '<b onclick="globalThis.__hit=2">x</b>')),
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
