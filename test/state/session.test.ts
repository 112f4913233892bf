import { beforeEach, describe, expect, test } from 'vitest';
import { defaultSetup, type MachineContent, type Setup } from '../../src/state/model';
import {
  acceptOfferedShare,
  offerShare,
  offeredShare,
  openSession,
  sessionMessage,
} from '../../src/state/session';
import { encodeShareFragment } from '../../src/state/shareLink';
import { activePart, setFeatures, setup } from '../../src/state/setup';
import { harmonics } from '../../src/state/toolInputs';
import { header, startNewMachine, workRecord } from '../../src/state/work';
import { sampleContent } from './fixtures';

beforeEach(() => {
  startNewMachine();
  sessionMessage.value = null;
  offeredShare.value = null;
});

const holding = (setup: Setup, name = ''): MachineContent => ({
  ...sampleContent({ setup, name }),
});

describe('opening the session', () => {
  const shared = holding({ ...structuredClone(defaultSetup), creepRpm: 7 }, 'Shared press');
  const last = holding({ ...structuredClone(defaultSetup), creepRpm: 3 }, 'Last visit');
  const lastRecord = { openId: null, baseVersion: null, content: last };

  test('a share link wins over the last visit, carries the machine name, and is cleared from the address', async () => {
    let cleared = false;
    await openSession({
      hash: '#s=2.x',
      decodeShare: () => ({ ok: true, content: shared }),
      loadLast: async () => lastRecord,
      clearHash: () => (cleared = true),
    });
    expect(setup.value.creepRpm).toBe(7);
    expect(header.value.name).toBe('Shared press');
    expect(cleared).toBe(true);
    expect(sessionMessage.value).toEqual({
      kind: 'info',
      text: 'Opened "Shared press" from a share link. Save it as a machine to keep it.',
    });
  });

  test('a refused link says why and replaces nothing: the last visit comes back', async () => {
    await openSession({
      hash: '#s=2.broken',
      decodeShare: () => ({ ok: false, error: 'This share link is damaged.' }),
      loadLast: async () => lastRecord,
      clearHash: () => undefined,
    });
    expect(setup.value.creepRpm).toBe(3);
    expect(sessionMessage.value).toEqual({
      kind: 'problem',
      text: 'This share link is damaged. Nothing was replaced: what you had on screen is kept.',
    });
  });

  test('without a link, the last visit comes back, every tool included', async () => {
    const withTools = structuredClone(lastRecord);
    withTools.content.tools.logger.harmonics = 9;
    await openSession({
      hash: '',
      decodeShare: () => ({ ok: false, error: null }),
      loadLast: async () => withTools,
      clearHash: () => undefined,
    });
    expect(setup.value.creepRpm).toBe(3);
    expect(harmonics.value).toBe(9);
    expect(sessionMessage.value).toBeNull();
  });

  test('a change made while storage was opening is not overwritten', async () => {
    await openSession({
      hash: '',
      decodeShare: () => ({ ok: false, error: null }),
      loadLast: async () => {
        setFeatures(11);
        return lastRecord;
      },
      clearHash: () => undefined,
    });
    expect(activePart.value.features).toBe(11);
    expect(setup.value.creepRpm).toBe(defaultSetup.creepRpm);
  });

  test('a change finished before the last visit is asked for is not overwritten either', async () => {
    const untouched = workRecord.peek();
    setFeatures(12);
    await openSession(
      {
        hash: '',
        decodeShare: () => ({ ok: false, error: null }),
        loadLast: async () => lastRecord,
        clearHash: () => undefined,
      },
      untouched,
    );
    expect(activePart.value.features).toBe(12);
    expect(setup.value.creepRpm).toBe(defaultSetup.creepRpm);
  });
});

describe('a share link opened while the app is open', () => {
  test('is offered, not opened over what is on screen, until the user accepts it', () => {
    setFeatures(5);
    let cleared = false;
    offerShare(encodeShareFragment(sampleContent({ name: 'Offered fan' })), () => (cleared = true));
    expect(cleared).toBe(true);
    expect(offeredShare.value?.name).toBe('Offered fan');
    expect(activePart.value.features).toBe(5);
    acceptOfferedShare();
    expect(header.value.name).toBe('Offered fan');
    expect(setup.value).toEqual(sampleContent().setup);
    expect(offeredShare.value).toBeNull();
  });

  test('a refused one says why and changes nothing', () => {
    setFeatures(5);
    offerShare('#s=2.AAAA', () => undefined);
    expect(offeredShare.value).toBeNull();
    expect(activePart.value.features).toBe(5);
    expect(sessionMessage.value?.kind).toBe('problem');
    expect(sessionMessage.value?.text).toMatch(/Nothing was replaced/);
  });

  test('an address with no share data is left alone', () => {
    let cleared = false;
    offerShare('#about', () => (cleared = true));
    expect(cleared).toBe(false);
    expect(sessionMessage.value).toBeNull();
  });
});
