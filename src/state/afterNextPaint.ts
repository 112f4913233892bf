// Work that should wait until the browser has painted what is on screen now.

/**
 * Runs `work` in a task after the next paint: a frame callback hands it to a task, which the
 * browser runs once that frame is drawn. A page that draws no frames (hidden, or no
 * requestAnimationFrame) runs it after a short wait instead.
 */
export function afterNextPaint(work: () => void): void {
  let done = false;
  const once = () => {
    if (done) return;
    done = true;
    work();
  };
  const fallback = setTimeout(once, 100);
  if (typeof requestAnimationFrame !== 'function') return;
  requestAnimationFrame(() => {
    clearTimeout(fallback);
    setTimeout(once, 0);
  });
}
