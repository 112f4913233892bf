import { beforeEach, describe, expect, test } from 'vitest';
import { defaultSetup, type Setup } from '../../src/state/model';
import { openSession, sessionMessage } from '../../src/state/session';
import { activePart, replaceSetup, setFeatures, setup } from '../../src/state/setup';

beforeEach(() => {
  replaceSetup(defaultSetup);
  sessionMessage.value = null;
});

describe('opening the session', () => {
  const shared: Setup = { ...structuredClone(defaultSetup), creepRpm: 7 };
  const last: Setup = { ...structuredClone(defaultSetup), creepRpm: 3 };

  test('a share link wins over the last set-up and is cleared from the address', async () => {
    let cleared = false;
    await openSession({
      hash: '#s=1.x',
      decodeShare: () => ({ ok: true, setup: shared }),
      loadLast: async () => last,
      clearHash: () => (cleared = true),
    });
    expect(setup.value.creepRpm).toBe(7);
    expect(cleared).toBe(true);
    expect(sessionMessage.value?.kind).toBe('info');
  });

  test('a refused link shows its message and the default set-up, not the last one', async () => {
    setFeatures(9);
    await openSession({
      hash: '#s=1.broken',
      decodeShare: () => ({ ok: false, error: 'This share link is damaged.' }),
      loadLast: async () => last,
      clearHash: () => undefined,
    });
    expect(setup.value).toEqual(defaultSetup);
    expect(sessionMessage.value).toEqual({
      kind: 'problem',
      text: 'This share link is damaged. The default set-up is shown instead.',
    });
  });

  test('without a link, the last set-up comes back', async () => {
    await openSession({
      hash: '',
      decodeShare: () => ({ ok: false, error: null }),
      loadLast: async () => last,
      clearHash: () => undefined,
    });
    expect(setup.value.creepRpm).toBe(3);
    expect(sessionMessage.value).toBeNull();
  });

  test('a change made while storage was opening is not overwritten', async () => {
    await openSession({
      hash: '',
      decodeShare: () => ({ ok: false, error: null }),
      loadLast: async () => {
        setFeatures(11);
        return last;
      },
      clearHash: () => undefined,
    });
    expect(activePart.value.features).toBe(11);
    expect(setup.value.creepRpm).toBe(defaultSetup.creepRpm);
  });

  test('a change finished before the last set-up is asked for is not overwritten either', async () => {
    // The page opens with `untouched`; the user types while storage is still opening.
    const untouched = setup.peek();
    setFeatures(12);
    await openSession(
      {
        hash: '',
        decodeShare: () => ({ ok: false, error: null }),
        loadLast: async () => last,
        clearHash: () => undefined,
      },
      untouched,
    );
    expect(activePart.value.features).toBe(12);
    expect(setup.value.creepRpm).toBe(defaultSetup.creepRpm);
  });
});
