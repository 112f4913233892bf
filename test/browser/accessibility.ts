// What the accessibility tests share: axe-core run in the page, the sticky parts that could
// cover the focused control, and the focus indicator drawn around it.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Page } from 'playwright-core';

const require = createRequire(import.meta.url);
const AXE_SOURCE = readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

/** WCAG 2.0, 2.1 and 2.2 at levels A and AA: axe-core's tags for them (axe-core API, "runOnly"). */
export const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22a', 'wcag22aa'];

export interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  helpUrl: string;
  nodes: Array<{ target: string[]; html: string; failureSummary: string }>;
}

/**
 * Runs axe-core over the whole page with the WCAG A and AA rules and returns its violations.
 * The script is evaluated through the debugging protocol, which the page's
 * Content-Security-Policy does not govern (an injected <script> tag would be refused).
 */
export async function axeViolations(page: Page): Promise<AxeViolation[]> {
  // The browser skips drawing result panels while they are off screen (content-visibility),
  // keeping their last drawn size: scroll through once, as a person would, so every panel is
  // drawn at its present size before axe measures where things are.
  await page.evaluate(async () => {
    const frame = () => new Promise((drawn) => requestAnimationFrame(() => drawn(null)));
    for (let y = 0; y < document.documentElement.scrollHeight; y += innerHeight / 2) {
      window.scrollTo(0, y);
      await frame();
      await frame();
    }
  });
  // From the top of the page, so no sticky part covers text whose contrast axe must measure.
  await page.evaluate(() => window.scrollTo(0, 0));
  const loaded = await page.evaluate(() => 'axe' in window);
  if (!loaded) await page.evaluate(AXE_SOURCE);
  return page.evaluate(async (tags) => {
    const axe = (
      window as unknown as {
        axe: {
          run: (context: Document, options: object) => Promise<{ violations: AxeViolation[] }>;
        };
      }
    ).axe;
    const result = await axe.run(document, {
      runOnly: { type: 'tag', values: tags },
      resultTypes: ['violations'],
    });
    return result.violations.map((v) => ({
      id: v.id,
      impact: v.impact,
      help: v.help,
      helpUrl: v.helpUrl,
      nodes: v.nodes.map((n) => ({
        target: n.target.map(String),
        html: n.html,
        failureSummary: n.failureSummary,
      })),
    }));
  }, WCAG_TAGS);
}

/** Violations as a person reads them: rule, impact, help, then each element and what fails. */
export function describeViolations(where: string, violations: readonly AxeViolation[]): string {
  return violations
    .map((v) =>
      [
        `${where}: ${v.id} (${v.impact ?? 'no impact given'}): ${v.help} — ${v.helpUrl}`,
        ...v.nodes.map(
          (n) =>
            `    at ${n.target.join(' ')}\n      ${n.html.slice(0, 200)}\n      ${n.failureSummary.replace(/\n\s*/g, ' / ')}`,
        ),
      ].join('\n'),
    )
    .join('\n');
}

/** The focused element, described, and whether a sticky or fixed part of the page covers it. */
export interface FocusStop {
  /** Tag, id, name or text: enough to find it in a message. */
  name: string;
  /** Why it counts as covered, or null when nothing covers it. */
  covered: string | null;
}

/**
 * Where focus is now, and whether anything stuck to the screen covers it: any element positioned
 * sticky or fixed (and not holding the focused element) whose box overlaps the focused
 * element's box, or an element other than the focused one (or its label) at its box's centre.
 * Null when nothing on the page has focus.
 */
export function focusStop(page: Page): Promise<FocusStop | null> {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body || el === document.documentElement) return null;
    const label = el.getAttribute('aria-label') ?? (el as HTMLInputElement).labels?.[0]?.innerText;
    const name = `${el.tagName.toLowerCase()}${el.id ? `#${el.id}` : ''} "${(label ?? el.innerText ?? '').trim().slice(0, 40)}"`;
    const box = el.getBoundingClientRect();
    const stuck = [...document.querySelectorAll<HTMLElement>('body *')].filter((e) => {
      const position = getComputedStyle(e).position;
      return (position === 'sticky' || position === 'fixed') && !e.contains(el);
    });
    for (const s of stuck) {
      const r = s.getBoundingClientRect();
      const overlaps =
        box.top < r.bottom && box.bottom > r.top && box.left < r.right && box.right > r.left;
      if (overlaps && r.width > 0 && r.height > 0) {
        return {
          name,
          covered: `box ${Math.round(box.top)}–${Math.round(box.bottom)} px under a stuck part ${Math.round(r.top)}–${Math.round(r.bottom)} px`,
        };
      }
    }
    // The centre must show the element itself, something inside it, or its label (a radio
    // button drawn by its label is found through the label).
    const hit = document.elementFromPoint(box.left + box.width / 2, box.top + box.height / 2);
    const labels = [...((el as HTMLInputElement).labels ?? [])];
    const shown = hit !== null && (el.contains(hit) || labels.some((l) => l.contains(hit)));
    return {
      name,
      covered: shown
        ? null
        : `its centre (${Math.round(box.left + box.width / 2)}, ${Math.round(box.top + box.height / 2)} px in a ${innerWidth} × ${innerHeight} window) shows ${hit ? `${hit.tagName.toLowerCase()}.${hit.className}` : 'nothing'}`,
    };
  });
}

/**
 * The focus indicator of the focused control: a computed outline or box-shadow on the control,
 * or, for a control drawn by its label (a radio button hidden under its face), on the label or
 * what the label holds. Null when there is none.
 */
export function focusIndicator(page: Page): Promise<string | null> {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body) return null;
    const drawnBy = [...((el as HTMLInputElement).labels ?? [])].flatMap((l) => [
      l,
      ...l.querySelectorAll<HTMLElement>('*'),
    ]);
    for (const candidate of [el, ...drawnBy]) {
      const css = getComputedStyle(candidate);
      const width = parseFloat(css.outlineWidth);
      if (css.outlineStyle !== 'none' && width > 0) return `outline ${css.outlineStyle} ${width}px`;
      if (css.boxShadow !== 'none') return `box-shadow ${css.boxShadow}`;
    }
    return null;
  });
}
