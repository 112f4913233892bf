// Pasting 10,000 characters into every text field of every screen: the page keeps answering
// and the field says, in words, what is wrong. This is the one place where a time is checked
// (issue 11): measured inside the page, from the input event the paste makes to the next
// animation frame, and then one more frame round trip. A reader that backtracked blocked the
// page for seconds to minutes here (3,000 spaces and a letter in the exposure time: 6.9 s on
// this machine; 10,000: 174 s).
//
// A frame can come late on a busy shared machine for reasons of its own, so a field passes when
// any of three pastes answers within the budget; a reader that really blocks misses all three.
import { afterEach, describe, expect, inject, test } from 'vitest';
import type { Locator, Page } from 'playwright-core';
import { openApp, openBrowser, type Session } from './browser';
import { TOURS, type Tour } from './every-screen';

/** The budget from input event to frame, and for the frame round trip after it. */
const ANSWER_MS = 100;
const TRIES = 3;

/** 10,000 characters each, in the shapes that made the former number readers backtrack. */
const HOSTILE = [
  ' '.repeat(9_999) + 'x',
  '1'.repeat(9_999) + 'x',
  '1e'.repeat(5_000),
  '1, '.repeat(3_333) + '1',
  '6' + ' '.repeat(9_993) + 'blades',
];

let session: Session | undefined;

afterEach(async () => {
  await session?.close();
  session = undefined;
});

interface Answer {
  /** From the input event (before the app's own handler) to the next animation frame. */
  answerMs: number;
  /** The frame round trip after that one: nothing left blocking the page. */
  followMs: number;
}

/**
 * Pastes `text` over the field's text as a person would (select all, then one insertion through
 * the browser's editing, which also applies the field's maxlength) and measures in the page.
 */
async function paste(page: Page, field: Locator, text: string): Promise<Answer> {
  await field.selectText();
  await page.evaluate(() => {
    const w = window as unknown as { pasteAnswer: Promise<Answer> };
    w.pasteAnswer = new Promise((done) => {
      // Capturing on the document runs before the field's own input handler.
      const start = () => {
        const t0 = performance.now();
        requestAnimationFrame(() => {
          const t1 = performance.now();
          requestAnimationFrame(() =>
            done({ answerMs: t1 - t0, followMs: performance.now() - t1 }),
          );
        });
      };
      document.addEventListener('input', start, { capture: true, once: true });
    });
  });
  await page.keyboard.insertText(text);
  return page.evaluate(() => (window as unknown as { pasteAnswer: Promise<Answer> }).pasteAnswer);
}

/** The texts of the elements that describe the field (its message, note or hint). */
function descriptions(field: Locator): Promise<string[]> {
  return field.evaluate((el) =>
    (el.getAttribute('aria-describedby') ?? '')
      .split(' ')
      .filter(Boolean)
      .map((id) => document.getElementById(id)?.innerText ?? ''),
  );
}

/** Marks the editable text fields on screen that have not been pasted into yet; returns their marks. */
function unvisitedFields(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const inputs = [...document.querySelectorAll<HTMLInputElement>('main input[type="text"]')];
    const marks: string[] = [];
    for (const el of inputs) {
      // checkVisibility: a field inside a closed <details> keeps its layout box but is not shown.
      if (el.readOnly || el.disabled || !el.checkVisibility()) continue;
      if (el.dataset.pasted) continue;
      const mark = el.id || `unnamed-${document.querySelectorAll('[data-pasted]').length}`;
      el.dataset.pasted = mark;
      marks.push(mark);
    }
    return marks;
  });
}

/** The visible text of the page (input values are not part of it). */
const shownText = (page: Page) => page.locator('body').innerText();

async function pasteEverywhere(
  page: Page,
  tour: Tour,
): Promise<{ done: string[]; slowestMs: number }> {
  const done: string[] = [];
  let slowestMs = 0;
  for (const step of tour.steps) {
    await step.go(page);
    for (const mark of await unvisitedFields(page)) {
      const field = page.locator(`[data-pasted="${mark}"]`);
      const label = await field.evaluate(
        (el) => (el as HTMLInputElement).labels?.[0]?.innerText.trim() ?? el.id,
      );
      const where = `${tour.tab} › ${step.name} › ${label}`;
      const before = await field.inputValue();
      const text = HOSTILE[done.length % HOSTILE.length];
      const answers: Answer[] = [];
      for (let i = 0; i < TRIES; i++) {
        if (i > 0) await field.fill(before);
        const answer = await paste(page, field, text);
        answers.push(answer);
        if (answer.answerMs <= ANSWER_MS && answer.followMs <= ANSWER_MS) break;
      }
      const best = answers.reduce((a, b) =>
        Math.max(b.answerMs, b.followMs) < Math.max(a.answerMs, a.followMs) ? b : a,
      );
      slowestMs = Math.max(slowestMs, best.answerMs, best.followMs);
      expect(best.answerMs, `${where}: ms from paste to frame`).toBeLessThanOrEqual(ANSWER_MS);
      expect(best.followMs, `${where}: ms of the next frame`).toBeLessThanOrEqual(ANSWER_MS);

      // A readable message says what is wrong: too long for a number, cut at 80 for a name.
      const maxLength = await field.evaluate((el) => (el as HTMLInputElement).maxLength);
      const said = (await descriptions(field)).join(' | ');
      if (maxLength > 0) {
        expect((await field.inputValue()).length, where).toBe(maxLength);
        expect(said, where).toContain(`A name holds at most ${maxLength} characters`);
      } else {
        expect(await field.getAttribute('aria-invalid'), where).toBe('true');
        expect(said, where).toMatch(
          /^Too long: type at most (64|1,000) characters\.|^A part's name holds at most 80 characters/,
        );
      }
      expect(said.length, where).toBeLessThan(400);
      expect(await shownText(page), where).not.toMatch(/NaN|Infinity/);

      await field.fill(before);
      done.push(where);
    }
  }
  return { done, slowestMs };
}

describe('pasting 10,000 characters into every field', () => {
  for (const tour of TOURS) {
    test(`on the ${tour.tab} screen, every field answers within ${ANSWER_MS} ms and says what is wrong`, async () => {
      session = await openBrowser();
      const { page } = session;
      await openApp(page, inject('baseUrl'));
      const { done, slowestMs } = await pasteEverywhere(page, tour);
      console.log(`${tour.tab}: ${done.length} fields, slowest answer ${slowestMs.toFixed(0)} ms`);
      expect(done.length).toBeGreaterThan(0);
    });
  }
});
