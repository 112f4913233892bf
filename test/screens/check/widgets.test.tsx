// @vitest-environment happy-dom
// The preview and the rate map mounted on the check screen: fed from the set-up, and the
// stillness caution on screen whenever either can show stillness. happy-dom has no 2D canvas,
// so the map says it cannot draw; the chart itself is checked in Chromium (test/browser/rate-map).
import { act, cleanup, render, screen, waitFor, within } from '@testing-library/preact';
import { afterEach, beforeEach, describe, expect, test, vi } from 'vitest';
import { apparentMotion } from '../../../src/core';
import { defaultSetup, type Setup } from '../../../src/state/model';
import { picturesBehind } from '../../../src/state/check';
import { replaceSetup, setSamplerRateHz, setup } from '../../../src/state/setup';
import { CheckScreen } from '../../../src/screens/check';
import { listsCaughtUp } from '../../helpers/screen-queries';
import { reportIntersections } from '../../helpers/intersection';

const stillness = /still turning at full speed/;

function open(s: Setup) {
  replaceSetup(s);
  render(<CheckScreen />);
}

async function widgets() {
  const preview = await screen.findByRole('region', { name: 'Preview of the turning part' });
  const map = await screen.findByRole('slider', { name: /Rate map/ });
  return { preview, map: map.closest('section')! };
}

beforeEach(() => {
  // The rate map draws once it is near the screen.
  reportIntersections();
  replaceSetup(defaultSetup);
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('the check screen’s preview and rate map', () => {
  test('show the part being checked at the current rate, in the strobe’s own unit', async () => {
    open(defaultSetup);
    const { map } = await widgets();
    // The default: 6 blades at 1770 rpm under 1770 flashes a minute, one image standing still.
    expect(apparentMotion({ speedHz: 29.5, symmetry: 6 }, 29.5).look).toBe('still');
    expect(screen.getByRole('img', { name: 'As the flashes show it: looks still' })).toBeTruthy();
    const slider = within(map).getByRole('slider');
    expect(slider.getAttribute('aria-valuetext')).toBe('1,770 fpm');
    expect(slider.getAttribute('aria-valuemin')).toBe('30');
    expect(slider.getAttribute('aria-valuemax')).toBe('12000');
    expect(within(map).getByText('Fan')).toBeTruthy();
  });

  test('follow a rate set elsewhere, as the rate field does', async () => {
    open(defaultSetup);
    const { map } = await widgets();
    setSamplerRateHz(3000 / 60);
    await waitFor(() =>
      expect(within(map).getByRole('slider').getAttribute('aria-valuetext')).toBe('3,000 fpm'),
    );
    expect(setup.value.strobe.rateFpm).toBe(3000);
  });

  test('leave the stillness caution to the screen while it shows one, and give it themselves otherwise', async () => {
    open(defaultSetup);
    const { preview, map } = await widgets();
    // The screen's own caution is up: the widgets do not repeat it.
    expect(screen.getByTestId('safety-notice')).toBeTruthy();
    expect(within(preview).queryByText(stillness)).toBeNull();
    expect(within(map).queryByText(stillness)).toBeNull();

    // One mark at 60 rev/s under 125 flashes a second: above twice the pattern rate, so the
    // strobe shows the true motion (Shannon 1949) and the screen shows no stillness caution.
    // The map, which marks the still rates, then carries it; the preview, which shows the
    // true motion, has nothing to warn of.
    replaceSetup({
      ...structuredClone(defaultSetup),
      parts: [{ name: 'Disc', speedRpm: 3600, features: 1, tolerancePercent: 0 }],
      strobe: { rateFpm: 125 * 60, minFpm: 30, maxFpm: 12000 },
    });
    // The screen's caution leaves once the entries have stood still (SETTLE_MS).
    await waitFor(() => expect(screen.queryByTestId('safety-notice')).toBeNull(), {
      timeout: 5000,
    });
    await listsCaughtUp();
    expect(apparentMotion({ speedHz: 60, symmetry: 1 }, 125).look).toBe('true');
    expect(within(preview).queryByText(stillness)).toBeNull();
    expect(within(map).getByText(stillness)).toBeTruthy();
  });

  test('change their own caution with what they picture, while the screen gives its caution at once', async () => {
    // One mark at 60 rev/s under 125 flashes a second: the true motion (Shannon 1949), so
    // the screen shows no stillness caution and the map gives it.
    open({
      ...structuredClone(defaultSetup),
      parts: [{ name: 'Disc', speedRpm: 3600, features: 1, tolerancePercent: 0 }],
      strobe: { rateFpm: 125 * 60, minFpm: 30, maxFpm: 12000 },
    });
    const { map } = await widgets();
    await listsCaughtUp();
    expect(screen.queryByTestId('safety-notice')).toBeNull();
    expect(within(map).getByText(stillness)).toBeTruthy();

    // The default set-up looks still. The screen's caution comes in the same render as the
    // change; the map, still drawn for the set-up before, keeps the caution of that picture.
    act(() => replaceSetup(defaultSetup));
    expect(picturesBehind.peek()).toBe(true);
    expect(screen.getByTestId('safety-notice')).toBeTruthy();
    expect(within(map).getByText(stillness)).toBeTruthy();
    // Once the map shows the new set-up, the screen's caution is the one given.
    await listsCaughtUp();
    expect(within(map).queryByText(stillness)).toBeNull();
    expect(screen.getByTestId('safety-notice')).toBeTruthy();
  });

  test('say so where the browser cannot draw the chart, instead of failing', async () => {
    open(defaultSetup);
    const { map } = await widgets();
    await waitFor(() =>
      expect(within(map).getByText('This browser cannot draw the rate map.')).toBeTruthy(),
    );
  });

  test('have nothing to play under steady light, and say why', async () => {
    open({
      ...structuredClone(defaultSetup),
      samplerKind: 'lighting',
      lighting: { mainsHz: 50, flicker: 'double', customHz: 300, modulationPercent: 0 },
    });
    // Once the map is there, the widgets have loaded.
    await screen.findByRole('slider', { name: /Rate map/ });
    await listsCaughtUp();
    expect(screen.getByText(/Steady light samples nothing/)).toBeTruthy();
    expect(screen.queryByRole('region', { name: 'Preview of the turning part' })).toBeNull();
  });
});
