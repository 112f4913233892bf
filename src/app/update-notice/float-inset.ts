import { useEffect, type MutableRef } from 'preact/hooks';

/** Room left between a control scrolled down to the notice and the notice's upper edge, px. */
const GAP_PX = 8;

/**
 * Keeps room at the foot of the page as tall as the floating notice `ref` holds (from its top
 * edge to the window's bottom, measured each time it resizes), so the page's end and any control
 * that focus brings into view stay above it (WCAG 2.2 SC 2.4.11 Focus Not Obscured). The room
 * goes when the notice does.
 *
 * The notice can come while someone types, so this costs a keystroke little: it measures only
 * in the resize observer (which runs once layout is done, and first as the notice appears, before
 * it is painted), never forcing a layout of its own, and it writes the page's own bottom padding
 * and scroll padding, which no other element inherits (a custom property on the root would
 * restyle every element of the page).
 */
export function useFloatInset(ref: MutableRef<HTMLElement | null>): void {
  useEffect(() => {
    const notice = ref.current;
    if (!notice || typeof ResizeObserver !== 'function') return;
    const root = document.documentElement;
    const body = document.body;
    const write = () => {
      const top = notice.getBoundingClientRect().top;
      const room = `${Math.ceil(Math.max(0, window.innerHeight - top) + GAP_PX)}px`;
      root.style.scrollPaddingBottom = room;
      body.style.paddingBottom = room;
      // The notice may come while focus is on a control it now covers: scroll that control up
      // above it (the new scroll padding keeps the room).
      const focused = document.activeElement;
      if (
        focused instanceof HTMLElement &&
        focused !== document.body &&
        !notice.contains(focused)
      ) {
        if (focused.getBoundingClientRect().bottom > top) {
          focused.scrollIntoView?.({ block: 'nearest' });
        }
      }
    };
    const observer = new ResizeObserver(write);
    observer.observe(notice);
    return () => {
      observer.disconnect();
      root.style.removeProperty('scroll-padding-bottom');
      body.style.removeProperty('padding-bottom');
    };
  }, []);
}
