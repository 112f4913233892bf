// The prerender build step (scripts/prerender.ts) and the markup it puts in the page
// (src/app/prerender.tsx). The built page itself is checked in a browser:
// test/browser/first-screen-html.test.ts.
import { describe, expect, test } from 'vitest';
import { MOUNT, withFirstScreen } from '../../scripts/prerender';
import { firstScreenHtml } from '../../src/app/prerender';
import { STILLNESS_CAUTION } from '../../src/words/cautions';

describe('withFirstScreen', () => {
  test('fills the mount point, inert, and leaves the rest of the page as it was', () => {
    const page = `<body>\n  ${MOUNT}\n  <script type="module" src="/main.js"></script>\n</body>`;
    expect(withFirstScreen(page, '<p>$& $1 verdict</p>')).toBe(
      '<body>\n  <div id="app" inert><p>$& $1 verdict</p></div>\n  <script type="module" src="/main.js"></script>\n</body>',
    );
  });

  test('refuses a page without the mount point, or with two', () => {
    expect(() => withFirstScreen('<body><div id="root"></div></body>', 'x')).toThrow(
      /exactly once/,
    );
    expect(() => withFirstScreen(`${MOUNT}${MOUNT}`, 'x')).toThrow(/exactly once/);
  });
});

describe('firstScreenHtml', () => {
  const html = firstScreenHtml();

  test('holds the check screen with the starting machine, its verdict and the stillness caution', () => {
    expect(html).toContain('data-testid="verdict"');
    expect(html).toContain('value="1770"');
    expect(html).toContain(STILLNESS_CAUTION);
    expect(html.match(/<h1[\s>]/g)).toHaveLength(1);
  });

  test('has no style attribute: the page policy (style-src self) would refuse it in markup', () => {
    expect(html).not.toMatch(/\sstyle=/);
  });
});
