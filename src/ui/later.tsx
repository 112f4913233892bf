// Parts that arrive together, made one paint apart.
import type { ComponentChildren } from 'preact';
import { useEffect, useState } from 'preact/hooks';

/**
 * Renders its children `paints` paints after it first mounts, then like anything else: parts
 * that come in one chunk are made in tasks of their own, so no task grows long on a slow phone.
 * Only for what sits below what the person is looking at, or first appears anyway.
 */
export function Later({ paints, children }: { paints: number; children: ComponentChildren }) {
  const [left, setLeft] = useState(paints);
  useEffect(() => {
    // Preact runs effects after the browser has painted: one step per paint.
    if (left > 0) setLeft(left - 1);
  }, [left]);
  return left === 0 ? <>{children}</> : null;
}
