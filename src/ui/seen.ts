// Whether an element has come near the screen yet: for work only worth doing once it can be
// seen (a chart below the fold need not be drawn while the page opens).
import type { RefObject } from 'preact';
import { useEffect, useState } from 'preact/hooks';

export interface Seen {
  /** The element has come within the margin of the viewport, or the page is about to be printed. */
  near: boolean;
  /**
   * True a task after `near` (at once for printing): work split in two, one part on `near` and
   * the rest on `later`, holds up a tap or a key for at most one of the two.
   */
  later: boolean;
}

/**
 * Whether `target` has come within `margin` of the viewport or the page is about to be printed,
 * and from then on. Where the browser has no IntersectionObserver, both at once.
 */
export function useSeen(target: RefObject<Element>, margin = '300px'): Seen {
  const [seen, setSeen] = useState<Seen>(() => {
    const at = typeof IntersectionObserver !== 'function';
    return { near: at, later: at };
  });
  useEffect(() => {
    const element = target.current;
    if (seen.later || !element) return;
    let timer: ReturnType<typeof setTimeout> | undefined;
    const observer = new IntersectionObserver(
      (entries) => {
        if (!entries.some((e) => e.isIntersecting)) return;
        observer.disconnect();
        setSeen({ near: true, later: false });
        timer = setTimeout(() => setSeen({ near: true, later: true }));
      },
      { rootMargin: margin },
    );
    observer.observe(element);
    // A printed page shows everything: what was never scrolled to is drawn for it too, before
    // the printout is laid out (the render runs as a microtask of this listener).
    const print = () => setSeen({ near: true, later: true });
    addEventListener('beforeprint', print);
    return () => {
      observer.disconnect();
      clearTimeout(timer);
      removeEventListener('beforeprint', print);
    };
  }, [seen.later]);
  return seen;
}
