// The service worker is asked for an update when the app comes back to the foreground and once
// an hour while it stays on screen, never more often (fake timers, a fake registration).
import { afterEach, beforeEach, describe, expect, test, vi } from 'vitest';
import {
  keepCheckingForUpdates,
  UPDATE_CHECK_EVERY_MS,
  type UpdatableRegistration,
  type UpdateCheckPage,
} from '../../src/app/update-notice/update-checks';

const MINUTE = 60 * 1000;
const HOUR = 60 * MINUTE;

/** A registration that records the (fake) time of each update() call; `answer` decides how each ends. */
function fakeRegistration(answer: () => Promise<unknown> = () => Promise.resolve()) {
  const registration = {
    installing: null as unknown,
    checkedAt: [] as number[],
    update() {
      registration.checkedAt.push(Date.now());
      return answer();
    },
  };
  return registration satisfies UpdatableRegistration;
}

/** A page whose visibility and network the test sets; `show`/`hide` fire the change as a browser would. */
function fakePage(visible = true) {
  let listener: (() => void) | null = null;
  const page = {
    isVisible: visible,
    isOnline: true,
    visible: () => page.isVisible,
    online: () => page.isOnline,
    onVisibilityChange(l: () => void) {
      listener = l;
      return () => (listener = null);
    },
    fire() {
      listener?.();
    },
    show() {
      page.isVisible = true;
      page.fire();
    },
    hide() {
      page.isVisible = false;
      page.fire();
    },
    get listening() {
      return listener !== null;
    },
  };
  return page satisfies UpdateCheckPage;
}

beforeEach(() => {
  vi.useFakeTimers();
  vi.setSystemTime(0);
});
afterEach(() => {
  vi.useRealTimers();
});

describe('checks for a new version while the app is open', () => {
  test('checks once an hour while on screen, and never sooner', async () => {
    const registration = fakeRegistration();
    keepCheckingForUpdates(registration, fakePage());
    await vi.advanceTimersByTimeAsync(59 * MINUTE);
    expect(registration.checkedAt).toEqual([]);
    // Minute by minute over five hours: exactly one check at each full hour.
    for (let t = 59; t < 5 * 60; t++) await vi.advanceTimersByTimeAsync(MINUTE);
    expect(registration.checkedAt).toEqual([1, 2, 3, 4, 5].map((h) => h * HOUR));
    expect(UPDATE_CHECK_EVERY_MS).toBe(HOUR);
  });

  test('checks once each time the app comes back to the foreground', async () => {
    const registration = fakeRegistration();
    const page = fakePage();
    keepCheckingForUpdates(registration, page);
    page.hide();
    await vi.advanceTimersByTimeAsync(10 * MINUTE);
    expect(registration.checkedAt).toEqual([]);
    page.show();
    await vi.advanceTimersByTimeAsync(0);
    expect(registration.checkedAt).toEqual([10 * MINUTE]);
    // A repeated "visible" with no hiding in between is not another return.
    page.show();
    page.fire();
    await vi.advanceTimersByTimeAsync(0);
    expect(registration.checkedAt).toEqual([10 * MINUTE]);
    await vi.advanceTimersByTimeAsync(5 * MINUTE);
    page.hide();
    page.show();
    await vi.advanceTimersByTimeAsync(0);
    expect(registration.checkedAt).toEqual([10 * MINUTE, 15 * MINUTE]);
  });

  test('leaves the hourly check out while the app is hidden; coming back checks', async () => {
    const registration = fakeRegistration();
    const page = fakePage();
    keepCheckingForUpdates(registration, page);
    page.hide();
    await vi.advanceTimersByTimeAsync(3 * HOUR + 30 * MINUTE);
    expect(registration.checkedAt).toEqual([]);
    page.show();
    await vi.advanceTimersByTimeAsync(0);
    expect(registration.checkedAt).toEqual([3 * HOUR + 30 * MINUTE]);
  });

  test('skips checks while offline, while a worker installs, or while a check is under way', async () => {
    let finish: () => void = () => {};
    const registration = fakeRegistration(() => new Promise<void>((done) => (finish = done)));
    const page = fakePage();
    keepCheckingForUpdates(registration, page);
    page.isOnline = false;
    await vi.advanceTimersByTimeAsync(HOUR);
    expect(registration.checkedAt).toEqual([]);
    page.isOnline = true;
    registration.installing = {};
    page.hide();
    page.show();
    await vi.advanceTimersByTimeAsync(0);
    expect(registration.checkedAt).toEqual([]);
    registration.installing = null;
    await vi.advanceTimersByTimeAsync(HOUR);
    expect(registration.checkedAt).toEqual([2 * HOUR]);
    // That check has not answered yet: coming back meanwhile asks nothing more.
    page.hide();
    page.show();
    await vi.advanceTimersByTimeAsync(0);
    expect(registration.checkedAt).toEqual([2 * HOUR]);
    finish();
    await vi.advanceTimersByTimeAsync(0);
    page.hide();
    page.show();
    await vi.advanceTimersByTimeAsync(0);
    expect(registration.checkedAt).toEqual([2 * HOUR, 2 * HOUR]);
  });

  test('a failed check (no network) is tried again at the next occasion, and raises nothing', async () => {
    const registration = fakeRegistration(() => Promise.reject(new TypeError('Failed to fetch')));
    const page = fakePage();
    keepCheckingForUpdates(registration, page);
    await vi.advanceTimersByTimeAsync(HOUR);
    page.hide();
    page.show();
    await vi.advanceTimersByTimeAsync(0);
    expect(registration.checkedAt).toEqual([HOUR, HOUR]);
  });

  test('stops checking when told to', async () => {
    const registration = fakeRegistration();
    const page = fakePage();
    const stop = keepCheckingForUpdates(registration, page);
    stop();
    expect(page.listening).toBe(false);
    await vi.advanceTimersByTimeAsync(5 * HOUR);
    page.hide();
    page.show();
    expect(registration.checkedAt).toEqual([]);
  });
});
