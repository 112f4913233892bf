import { useEffect, type MutableRef } from 'preact/hooks';

/** The custom property the page's scroll-padding-top reads (src/app/theme/global.css). */
const PROPERTY = '--sticky-top';
/** Room left between the sticky part's lower edge and a control scrolled up to it, px. */
const GAP_PX = 8;

/**
 * Keeps the page's scroll padding as tall as the sticky part `ref` holds (its offset from the
 * top plus its height, measured each time it resizes), so a control that focus or a scroll brings
 * into view stops below it instead of under it (WCAG 2.2 SC 2.4.11 Focus Not Obscured). The
 * padding goes when the part does.
 */
export function useStickyInset(ref: MutableRef<HTMLElement | null>): void {
  useEffect(() => {
    const part = ref.current;
    if (!part || typeof ResizeObserver !== 'function') return;
    const root = document.documentElement;
    let written = '';
    const write = () => {
      const topPx = parseFloat(getComputedStyle(part).top) || 0;
      const value = `${Math.ceil(topPx + part.offsetHeight + GAP_PX)}px`;
      // Only a new height is written: each write restyles the page's root.
      if (value === written) return;
      written = value;
      root.style.setProperty(PROPERTY, value);
    };
    // Measured only in the observer, which runs once layout is done (and first as it starts
    // observing, before the next paint): never a forced layout of its own.
    const observer = new ResizeObserver(write);
    observer.observe(part);
    return () => {
      observer.disconnect();
      root.style.removeProperty(PROPERTY);
    };
  }, []);
}
