// @vitest-environment happy-dom
import 'fake-indexeddb/auto';
import { cleanup, fireEvent, render, screen, waitFor, within } from '@testing-library/preact';
import { afterEach, beforeAll, beforeEach, describe, expect, test } from 'vitest';
import {
  apparentMotion,
  blurDegrees,
  exposureFromShutterAngle,
  rollingSkewDegrees,
} from '../../../src/core';
import { App } from '../../../src/app/app';
import { formatNumber, formatRpmWithDirection } from '../../../src/words/format';
import { formatRate } from '../../../src/words/rates';
import { openScreen } from '../../../src/state/navigation';
import { check } from '../../../src/state/check';
import { defaultSetup } from '../../../src/state/model';
import { flashUnit, replaceSetup, setup, speedUnit } from '../../../src/state/setup';
import { startSession } from '../../../src/state/session';
import { listsCaughtUp } from '../../helpers/screen-queries';

beforeAll(async () => {
  await startSession();
});

beforeEach(() => {
  replaceSetup(defaultSetup);
  speedUnit.value = 'rpm';
  flashUnit.value = 'fpm';
  openScreen('check');
  render(<App />);
});

afterEach(cleanup);

function field(label: string): HTMLInputElement {
  return screen.getByLabelText(label, { exact: true }) as HTMLInputElement;
}

function type(label: string, text: string) {
  fireEvent.input(field(label), { target: { value: text } });
}

function verdict(): string {
  return screen.getByTestId('verdict').firstChild?.textContent ?? '';
}

describe('the check screen', () => {
  test('opens on the default set-up: a 6-blade fan at 1770 rpm under a strobe at 1770 fpm looks still', () => {
    expect(verdict()).toBe('Looks still');
    expect(screen.getByTestId('true-speed').textContent).toBe('1,770 rpm');
    expect(screen.getByTestId('safety-notice')).toBeTruthy();
    // 29.5 flashes per second lies between 3 and 60 (docs/physics.md §10).
    expect(screen.getByTestId('photosensitivity-notice')).toBeTruthy();
  });

  test('follows every keystroke: a disc at 3600 rpm under 3660 fpm turns backward at 60 rpm', () => {
    // Wikipedia, "Stroboscopic effect": 60 rev/s lit at 61 flashes/s seems to turn backwards at 1 rev/s.
    type('Speed', '3600');
    type('Blades or marks', '1');
    type('Flash rate', '3660');
    expect(verdict()).toBe('Turning backward');
    const m = apparentMotion({ speedHz: 60, symmetry: 1 }, 61);
    expect(screen.getByTestId('apparent-speed').textContent).toBe(
      formatRpmWithDirection(m.apparentHz * 60, 1),
    );
    expect(screen.getByTestId('apparent-speed').textContent).toBe('60 rpm backward');
    expect(screen.getByTestId('true-speed').textContent).toBe('3,600 rpm');
  });

  test('the verdict panel holds a polite live region that says the verdict and its speeds', () => {
    const panel = screen.getByRole('region', { name: 'What you will see' });
    const region = within(panel).getByRole('status');
    expect(region.getAttribute('aria-live')).toBe('polite');
    expect(region.getAttribute('aria-atomic')).toBe('true');
    expect(region.textContent).toBe('Looks still. Seen at 0 rpm; true speed 1,770 rpm.');
    // The headline on screen is no live region of its own: it would speak every keystroke.
    expect(screen.getByTestId('verdict').closest('[aria-live]')).toBeNull();
  });

  test('bad text gets a message beside its field, keeps the set-up, and withdraws the verdict', () => {
    const before = check.value;
    type('Speed', 'fast');
    expect(field('Speed').getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByRole('alert').textContent).toMatch(/not a number/);
    expect(setup.value.parts[0].speedRpm).toBe(1770);
    expect(check.value).toBe(before);
    // docs/physics.md §10: a verdict from inputs no longer valid is withdrawn where it stands.
    expect(verdict()).toBe('No verdict until Speed is fixed');
    type('Speed', '1770');
    expect(verdict()).toBe('Looks still');
  });

  test('a speed made invalid after a good one withdraws the verdict where it stands and marks every list not current', async () => {
    // A fan at 1750 rpm, 6 blades, strobe 1748 flashes/min; then "1750x".
    type('Speed', '1750');
    type('Flash rate', '1748');
    expect(verdict()).toBe('Creeping forward');
    type('Speed', '1750x');
    const panel = screen.getByTestId('verdict').closest('section')!;
    expect(panel.textContent).not.toMatch(/Creeping|1,750 rpm/);
    expect(verdict()).toBe('No verdict until Speed is fixed');
    expect(within(panel).getByText(/Speed: "x" is not a unit for speed/)).toBeTruthy();
    // Every list worked out from the speed says so, and is out of reach while it does.
    await listsCaughtUp();
    const marks = screen.getAllByTestId('not-current');
    expect(marks.length).toBeGreaterThanOrEqual(4); // rate map, preview, locks, creep, bands
    for (const m of marks) expect(m.textContent).toMatch(/^Not current: fix Speed first/);
    const locks = screen.getByTestId('lock-list').closest('[data-current]')!;
    expect(locks.getAttribute('data-current')).toBe('false');
    // The fix button takes the cursor to the field.
    fireEvent.click(within(panel).getByRole('button', { name: 'Fix Speed' }));
    expect(document.activeElement).toBe(field('Speed'));
    type('Speed', '1750');
    expect(verdict()).toBe('Creeping forward');
    await listsCaughtUp();
    expect(screen.queryAllByTestId('not-current')).toHaveLength(0);
  });

  test('the answer follows each keystroke at once; the lists follow a paint later, and take no taps until then', async () => {
    await listsCaughtUp();
    type('Speed', '3600');
    type('Blades or marks', '1');
    type('Flash rate', '3500');
    // The answer is new at once: one mark at 60 rev/s under 3500 flashes/min.
    const m = apparentMotion({ speedHz: 60, symmetry: 1 }, 3500 / 60);
    expect(screen.getByTestId('apparent-speed').textContent).toBe(
      formatRpmWithDirection(m.apparentHz * 60, 1),
    );
    expect(screen.getByTestId('true-speed').textContent).toBe('3,600 rpm');
    // The lists still hold the rates worked out for the set-up before: they are marked behind,
    // and a tap on them does nothing until they catch up.
    expect(document.querySelectorAll('[data-behind="true"]').length).toBeGreaterThanOrEqual(1);
    const list = screen.getByTestId('lock-list');
    expect(within(list).queryByText(/^3,600 fpm/)).toBeNull();
    fireEvent.click(within(list).getAllByRole('button')[0]);
    expect(setup.value.strobe.rateFpm).toBe(3500);
    await listsCaughtUp();
    expect(document.querySelectorAll('[data-behind]')).toHaveLength(0);
    expect(
      within(screen.getByTestId('lock-list')).getAllByText(/^3,600 fpm/).length,
    ).toBeGreaterThan(0);
  });

  test('"17OO" typed key by key never shows the verdict for 17 rpm once the text is refused', () => {
    // The letter O typed for a zero.
    const seen: string[] = [];
    for (const text of ['1', '17', '17O', '17OO']) {
      type('Speed', text);
      seen.push(verdict());
    }
    expect(seen[1]).toBe('True motion'); // 17 rpm under 1770 fpm: faithful (Shannon 1949)
    expect(seen.slice(2)).toEqual([
      'No verdict until Speed is fixed',
      'No verdict until Speed is fixed',
    ]);
    expect(screen.getByTestId('verdict').closest('section')!.textContent).not.toMatch(/17 rpm/);
  });

  test('a bad creep speed marks only the creep list not current; the verdict stands', async () => {
    type('Creep speed wanted', 'slow');
    expect(verdict()).toBe('Looks still');
    await listsCaughtUp();
    const marks = screen.getAllByTestId('not-current');
    expect(marks).toHaveLength(1);
    expect(marks[0].textContent).toMatch(/fix Creep speed wanted/);
    expect(marks[0].parentElement!.querySelector('[data-testid="lock-list"]')).toBeNull();
  });

  test('a bad tolerance keeps the verdict but marks the lists not current', () => {
    // The verdict reads the nominal speed only; lock bands and safe bands read the tolerance.
    type('Tolerance', '-1');
    expect(verdict()).toBe('Looks still');
    expect(screen.getAllByTestId('not-current')[0].textContent).toMatch(/fix Tolerance/);
  });

  test('nothing on screen says NaN or Infinity, whatever is typed', async () => {
    for (const text of ['', 'abc', 'NaN', '1e999', '-', '0', '-0', '1e-320', '99999999999']) {
      for (const label of [
        'Speed',
        'Blades or marks',
        'Tolerance',
        'Flash rate',
        'Lowest rate',
        'Highest rate',
        'Creep speed wanted',
      ]) {
        type(label, text);
      }
      await listsCaughtUp();
      const shown = document.body.textContent!.replace(/"[^"]*"/g, '');
      expect(shown, text).not.toMatch(/NaN|Infinity/);
    }
  });

  test('tapping a suggested lock-in rate sets the flash rate', async () => {
    type('Speed', '3600');
    type('Blades or marks', '1');
    type('Flash rate', '3500');
    await listsCaughtUp();
    const list = screen.getByTestId('lock-list');
    const single = within(list)
      .getAllByRole('button')
      .find((b) => b.textContent?.startsWith('3,600 fpm'));
    expect(single).toBeTruthy();
    fireEvent.click(single!);
    expect(setup.value.strobe.rateFpm).toBeCloseTo(3600, 9);
    expect(field('Flash rate').value).toBe('3600');
    expect(verdict()).toBe('Looks still');
  });

  test('tapping the creep rate makes the part creep forward at the wanted speed', async () => {
    type('Speed', '1800');
    type('Blades or marks', '1');
    type('Flash rate', '2000');
    type('Creep speed wanted', '30');
    await listsCaughtUp();
    const button = within(screen.getByTestId('creep-list'))
      .getAllByRole('button')
      .find((b) => b.textContent?.startsWith('1,770 fpm'));
    fireEvent.click(button!);
    // docs/physics.md §4 worked check: f = 30 rev/s, creep 0.5 rev/s → 29.5 flashes/s = 1770 fpm.
    expect(setup.value.strobe.rateFpm).toBeCloseTo(1770, 9);
    expect(verdict()).toBe('Creeping forward');
    // docs/physics.md §4: a creep asked for is still an aliased view; the lock-out caution goes with it.
    expect(screen.getByTestId('safety-notice')).toBeTruthy();
  });

  test('a creep close to a freeze carries the lock-out caution: 6 blades at 1750 rpm under 1748 flashes/min', () => {
    // docs/physics.md §2: a = f − k·s/n = (1750 − 1748)/60 rev/s = 2 rpm forward (k = 6).
    type('Speed', '1750');
    type('Flash rate', '1748');
    expect(verdict()).toBe('Creeping forward');
    expect(screen.getByTestId('apparent-speed').textContent).toBe('2 rpm forward');
    expect(screen.getByTestId('safety-notice').textContent).toMatch(/lock out the machine/);
  });

  test('a strobe rate can be typed in Hz', () => {
    fireEvent.change(screen.getByLabelText('Flash rate unit'), { target: { value: 'Hz' } });
    expect(field('Flash rate').value).toBe('29.5');
    type('Flash rate', '30');
    expect(setup.value.strobe.rateFpm).toBe(1800);
  });

  test('the lowest strobe rate must stay below the highest', () => {
    type('Lowest rate', '20000');
    expect(screen.getByRole('alert').textContent).toMatch(/below the highest/);
    expect(setup.value.strobe.minFpm).toBe(30);
  });

  test('a camera shows blur per frame and the rolling-shutter bend from the core', async () => {
    fireEvent.click(screen.getByLabelText('Camera'));
    await listsCaughtUp();
    const t = exposureFromShutterAngle(180, 30000 / 1001);
    const blur = blurDegrees(1770 / 60, t);
    expect(screen.getByTestId('blur').textContent).toContain(`${formatNumber(blur)}°`);
    const skew = rollingSkewDegrees(1770 / 60, 0.025);
    expect(screen.getByTestId('skew').textContent).toContain(
      `${formatNumber(skew)}° top to bottom`,
    );
    // The strobe's flashing caution leaves once the screen has stood still (SETTLE_MS).
    await waitFor(() => expect(screen.queryByTestId('photosensitivity-notice')).toBeNull(), {
      timeout: 5000,
    });
    // 2.95 pitches of blur per frame: the verdict says the blades cannot be made out.
    expect(screen.getByTestId('smear-note').textContent).toMatch(/even disc/);
    type('Shutter angle', '1');
    expect(screen.queryByTestId('smear-note')).toBeNull();
  });

  test('a camera preset sets the frame rate exactly', () => {
    fireEvent.click(screen.getByLabelText('Camera'));
    fireEvent.change(screen.getByLabelText('Frame rate preset'), {
      target: { value: String(24000 / 1001) },
    });
    expect(setup.value.camera.frameRate).toBe(24000 / 1001);
    expect(field('Frame rate').value).toBe('23.97602');
  });

  test('exposure can be given as 1/x s', () => {
    fireEvent.click(screen.getByLabelText('Camera'));
    fireEvent.click(screen.getByLabelText('As a time'));
    type('Exposure time', '1000');
    expect(setup.value.camera.exposure).toEqual({ mode: 'time', seconds: 1 / 1000 });
  });

  test('lighting shows its flicker risk and visibility', async () => {
    fireEvent.click(screen.getByLabelText('Lighting'));
    await listsCaughtUp();
    expect(screen.getByTestId('flicker-risk').textContent).toBe('Above the low-risk line');
    type('Modulation (percent flicker)', '0');
    expect(verdict()).toBe('Steady light: true motion');
    // The caution leaves once typing pauses (SETTLE_MS), not on the key itself.
    expect(screen.getByTestId('safety-notice')).toBeTruthy();
    await waitFor(() => expect(screen.queryByTestId('safety-notice')).toBeNull(), {
      timeout: 5000,
    });
  });

  test('a wheel part shows its road speed and tyre once they load, and one tap applies the speed', async () => {
    fireEvent.change(screen.getByLabelText('Kind of part'), { target: { value: 'wheel' } });
    await screen.findByLabelText('Ground speed');
    // ISO 4000-1 size designation 205/55R16: rim 16 in (406.4 mm) plus two sidewalls of 55 % of
    // 205 mm makes a 631.9 mm tyre; at the default 50 km/h it turns (50 / 3.6) / (π · 0.6319 m)
    // times a second.
    const rpm = (50 / 3.6 / (Math.PI * ((16 * 25.4 + 2 * 205 * 0.55) / 1000))) * 60;
    expect(formatNumber(rpm)).toBe('419.8');
    fireEvent.click(screen.getByRole('button', { name: /^Use 419\.8 rpm/ }));
    expect(setup.value.parts[0].speedRpm).toBeCloseTo(rpm, 6);
    expect(setup.value.parts[0].origin?.method).toBe('road-speed');
  });

  test('a motor’s nameplate speed becomes the part’s speed, with where it came from', async () => {
    fireEvent.click(screen.getByLabelText('Speed from an induction motor'));
    fireEvent.click(screen.getByLabelText('Its nameplate rpm'));
    // The nameplate goes through the drive chain's code, which loads on first use.
    await screen.findByLabelText('Nameplate speed');
    type('Nameplate speed', '1460');
    await waitFor(() => expect(setup.value.parts[0].speedRpm).toBe(1460));
    expect(setup.value.parts[0].origin?.method).toBe('nameplate');
    expect(field('Speed').value).toBe('1460');
  });

  test('the speed can come from a motor', () => {
    fireEvent.click(screen.getByLabelText('Speed from an induction motor'));
    // Default motor: 4 poles on 50 Hz with 3 % slip: 1500 · 0.97 = 1455 rpm (IEC 60034-1 table for 1500).
    expect(setup.value.parts[0].speedRpm).toBeCloseTo(1455, 9);
    expect(field('Speed').value).toBe('1455');
    type('Poles', '3');
    // Other alerts (a storage notice) may be on screen too: the poles message must be among them.
    expect(
      screen
        .getAllByRole('alert')
        .map((a) => a.textContent)
        .join(' '),
    ).toMatch(/pairs/);
  });

  test('the speed can be typed in Hz', () => {
    fireEvent.change(screen.getByLabelText('Speed unit'), { target: { value: 'Hz' } });
    expect(field('Speed').value).toBe('29.5');
    type('Speed', '30');
    expect(setup.value.parts[0].speedRpm).toBe(1800);
    expect(formatRate(check.value.rateHz, 'strobe', 'fpm')).toBe('1,770 fpm');
  });
});
