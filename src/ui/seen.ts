// Whether an element has come near the screen yet: for work only worth doing once it can be
// seen (a chart below the fold need not be drawn while the page opens).
import type { RefObject } from 'preact';
import { useEffect, useState } from 'preact/hooks';

/**
 * True once `target` has come within `margin` of the viewport, or the page is about to be
 * printed, and from then on. Where the browser has no IntersectionObserver, true at once.
 */
export function useSeen(target: RefObject<Element>, margin = '300px'): boolean {
  const [seen, setSeen] = useState(() => typeof IntersectionObserver !== 'function');
  useEffect(() => {
    const element = target.current;
    if (seen || !element) return;
    const observer = new IntersectionObserver(
      (entries) => {
        if (!entries.some((e) => e.isIntersecting)) return;
        observer.disconnect();
        setSeen(true);
      },
      { rootMargin: margin },
    );
    observer.observe(element);
    // A printed page shows everything: what was never scrolled to is drawn for it too.
    const print = () => setSeen(true);
    addEventListener('beforeprint', print);
    return () => {
      observer.disconnect();
      removeEventListener('beforeprint', print);
    };
  }, [seen]);
  return seen;
}
