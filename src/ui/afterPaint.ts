// A value that follows its source one paint later, for work a keystroke need not wait for.
import { useEffect, useState } from 'preact/hooks';

/**
 * `value` as it stood before the last change of `key`, until the browser has painted that
 * change; then `value`. A keystroke that changes `key` is painted first and the value follows
 * in a task of its own (Preact runs effects after the paint). `key` says what the value holds,
 * so a new object that holds the same is no change.
 */
export function useAfterPaint<T>(value: T, key: string): T {
  const [shown, setShown] = useState({ value, key });
  useEffect(() => {
    if (shown.key !== key) setShown({ value, key });
  }, [key]);
  return shown.key === key ? value : shown.value;
}
