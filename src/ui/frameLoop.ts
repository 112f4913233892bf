// One requestAnimationFrame loop per widget, asleep whenever nothing would be seen. A general
// helper for anything that animates on a canvas (the preview uses it).
import type { RefObject } from 'preact';
import { useCallback, useEffect, useRef } from 'preact/hooks';

/**
 * Runs `tick(nowMs)` once per animation frame. `tick` draws and returns true while it wants the
 * next frame (playing); false lets the loop sleep until the returned `wake()` is called (after
 * a change while paused). The loop also sleeps while `target` is off screen
 * (IntersectionObserver) or the tab is hidden (visibilitychange), and picks up again when both
 * are back. Everything it sets up is removed on unmount.
 */
export function useFrameLoop(
  target: RefObject<Element>,
  tick: (nowMs: number) => boolean,
): () => void {
  const latestTick = useRef(tick);
  latestTick.current = tick;
  const wakeLoop = useRef<() => void>(() => undefined);

  useEffect(() => {
    const element = target.current;
    if (!element || typeof requestAnimationFrame !== 'function') return;
    let frame = 0;
    // Off screen until the observer's first report says otherwise (it always gives one): a
    // widget below the fold draws nothing while the page opens.
    let onScreen = typeof IntersectionObserver !== 'function';
    let wanted = true;
    const visible = () => onScreen && document.visibilityState !== 'hidden';
    const run = (now: number) => {
      frame = 0;
      if (!visible()) return; // stays `wanted`: resumes when seen again
      wanted = latestTick.current(now);
      if (wanted) frame = requestAnimationFrame(run);
    };
    const wake = () => {
      wanted = true;
      if (frame === 0 && visible()) frame = requestAnimationFrame(run);
    };
    wakeLoop.current = wake;

    const observer =
      typeof IntersectionObserver === 'function'
        ? new IntersectionObserver(
            (entries) => {
              onScreen = entries.some((e) => e.isIntersecting);
              if (onScreen && wanted) wake();
            },
            // Drawn a little before it scrolls in, so it never shows an undrawn canvas.
            { rootMargin: '200px' },
          )
        : null;
    observer?.observe(element);
    const onVisibility = () => {
      if (visible() && wanted) wake();
    };
    document.addEventListener('visibilitychange', onVisibility);
    // A printed page shows everything: one frame is drawn at once for it, seen or not.
    const onPrint = () => void latestTick.current(performance.now());
    addEventListener('beforeprint', onPrint);
    wake();
    return () => {
      if (frame !== 0) cancelAnimationFrame(frame);
      observer?.disconnect();
      document.removeEventListener('visibilitychange', onVisibility);
      removeEventListener('beforeprint', onPrint);
      wakeLoop.current = () => undefined;
    };
  }, [target]);

  return useCallback(() => wakeLoop.current(), []);
}
