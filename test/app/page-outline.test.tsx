// @vitest-environment happy-dom
// The page's outline on every screen: one h1 naming the open screen, inside the one main
// landmark, under one banner with one navigation (WCAG 2.4.6 Headings and Labels, 1.3.1 Info
// and Relationships), and a window title that names the screen (WCAG 2.4.2 Page Titled).
import 'fake-indexeddb/auto';
import { cleanup, render } from '@testing-library/preact';
import { afterEach, beforeAll, describe, expect, test } from 'vitest';
import { App } from '../../src/app/app';
import { SCREENS, toolScreens } from '../../src/app/screen-list';
import { openScreen } from '../../src/state/navigation';
import { startSession } from '../../src/state/session';

beforeAll(async () => {
  await startSession();
  await toolScreens.load();
});

afterEach(cleanup);

describe('the outline of each screen', () => {
  for (const entry of SCREENS) {
    test(`the ${entry.label} screen has one h1, "${entry.heading}", in its one main landmark`, () => {
      openScreen(entry.id);
      const { container } = render(<App />);
      const h1s = [...container.querySelectorAll('h1')];
      expect(h1s.map((h) => h.textContent)).toEqual([entry.heading]);
      expect(container.querySelectorAll('main')).toHaveLength(1);
      expect(h1s[0].closest('main')).not.toBeNull();
      // A header inside main (a report's print header) is no banner landmark.
      const banners = [...container.querySelectorAll('header')].filter((h) => !h.closest('main'));
      expect(banners).toHaveLength(1);
      expect(container.querySelectorAll('nav')).toHaveLength(1);
      // Headings below it start at h2: no level is skipped on the way down from the h1.
      const levels = [...container.querySelectorAll('h1, h2, h3, h4, h5, h6')].map((h) =>
        Number(h.tagName[1]),
      );
      levels.forEach((level, i) => {
        if (i > 0) expect(level).toBeLessThanOrEqual(levels[i - 1] + 1);
      });
      expect(document.title).toBe(`${entry.heading} · Trueturn`);
    });
  }
});
