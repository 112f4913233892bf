// @vitest-environment happy-dom
import 'fake-indexeddb/auto';
import { cleanup, fireEvent, render, screen, waitFor } from '@testing-library/preact';
import { afterEach, beforeAll, beforeEach, describe, expect, test, vi } from 'vitest';
import { App } from '../../../src/app/app';
import { results } from '../../../src/screens/check/lazy-results';
import { listsBehind } from '../../../src/state/check';
import { openScreen } from '../../../src/state/navigation';
import { defaultSetup } from '../../../src/state/model';
import { flashUnit, replaceSetup } from '../../../src/state/setup';
import { startSession } from '../../../src/state/session';
import { listsCaughtUp, type } from '../../helpers/screen-queries';

const saved: string[] = [];
vi.mock('../../../src/ui/download', () => ({
  downloadText: (_name: string, text: string) => {
    saved.push(text);
    return true;
  },
  fileStem: (s: string) => s,
}));

beforeAll(async () => {
  await startSession();
  await results.load();
});

beforeEach(async () => {
  saved.length = 0;
  replaceSetup(defaultSetup);
  flashUnit.value = 'fpm';
  openScreen('check');
  render(<App />);
  await listsCaughtUp();
});

afterEach(cleanup);

describe('the check screen’s report', () => {
  test('a table saved right after a keystroke is of the set-up on screen, not of the lists behind it', () => {
    type('Speed', '3600');
    type('Blades or marks', '1');
    // The lists have not caught up yet: the table must not come from them.
    expect(listsBehind.peek()).toBe(true);
    fireEvent.click(screen.getByRole('button', { name: 'Save table (CSV)' }));
    expect(saved).toHaveLength(1);
    const rows = saved[0].split('\r\n');
    expect(rows).toContain('true speed,3600,rpm');
    expect(rows).toContain('identical features,1,');
  });

  test('the printed cautions follow each keystroke: the stillness caution comes and goes with the verdict', async () => {
    const printed = () =>
      Array.from(document.querySelectorAll('[data-print="only"] li'), (li) => li.textContent);
    const stillness = /still turning at full speed/;
    // 10 rpm, 6 blades: one blade pass a second under 29.5 flashes a second, far above twice as
    // many (Nyquist), one image: the view is true, and no stillness caution is printed.
    type('Speed', '10');
    await waitFor(() => expect(printed().some((l) => stillness.test(l ?? ''))).toBe(false));
    // 1780 rpm: 178 passes a second, aliased under the same strobe: the caution is printed.
    type('Speed', '1780');
    await waitFor(() => expect(printed().some((l) => stillness.test(l ?? ''))).toBe(true));
    fireEvent.click(screen.getByRole('button', { name: 'Save table (CSV)' }));
    expect(saved.at(-1)).toMatch(stillness);
  });
});
