import { useEffect, useRef, useState } from 'preact/hooks';
import style from './style.module.css';

/**
 * How long the text must stand before it is read out, ms: typing a number key by key passes
 * through answers nobody asked for (1, 17, 178, 1780); a pause of this length says the person
 * is done and wants to hear the answer.
 */
export const SETTLE_MS = 700;

interface Props {
  /** The answer in a sentence or two; read out once it has stood unchanged for SETTLE_MS. */
  text: string;
  /**
   * Given (true or false) where the answer can be a hazard: a second, assertive region is kept
   * beside the polite one, and a hazard (true) is said there, still only once typing pauses.
   */
  urgent?: boolean;
  /** Test id of the polite region; the assertive one gets the same with "-urgent". */
  testId?: string;
}

/**
 * A live region that reads out an answer once typing pauses, not every passing value. While
 * the answer is changing the region is empty, so nobody reads an answer it no longer stands for;
 * once the answer has stood for SETTLE_MS the region holds it, and a screen reader says it once.
 * The answer that stands when the region first appears is not read out: its text is on the page
 * already. Out of sight: what is shown on screen updates at every keystroke.
 */
export function SettledStatus({ text, urgent, testId }: Props) {
  // Each change of the text, counted, so a text that comes back to what was read out last is
  // waited on again and read out again (it is an answer the person has typed afresh).
  const changes = useRef({ text, count: 0 });
  if (changes.current.text !== text) changes.current = { text, count: changes.current.count + 1 };
  const count = changes.current.count;
  const [spoken, setSpoken] = useState({ text, count });
  useEffect(() => {
    if (spoken.count === count) return;
    const timer = setTimeout(() => setSpoken({ text, count }), SETTLE_MS);
    return () => clearTimeout(timer);
  }, [count]);
  const said = spoken.count === count ? spoken.text : '';
  // Both regions stay in place whatever they hold: a screen reader must know a region before it
  // speaks (one made, or turned into an alert, as its words arrive is often not read out).
  return (
    <>
      <p
        class={style.status}
        role="status"
        aria-live="polite"
        aria-atomic="true"
        data-testid={testId}
      >
        {urgent ? '' : said}
      </p>
      {urgent !== undefined && (
        <p
          class={style.status}
          role="alert"
          aria-atomic="true"
          data-testid={testId && `${testId}-urgent`}
        >
          {urgent ? said : ''}
        </p>
      )}
    </>
  );
}
