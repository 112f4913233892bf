// happy-dom's IntersectionObserver never reports. This one reports each observed element once,
// as a browser does first: on screen, unless a test says otherwise.
import { vi } from 'vitest';

let onScreen = true;

class ReportingObserver {
  constructor(private readonly report: (entries: Array<{ isIntersecting: boolean }>) => void) {}
  observe() {
    queueMicrotask(() => this.report([{ isIntersecting: onScreen }]));
  }
  disconnect() {}
}

/** Installs the reporting observer (undo with vi.unstubAllGlobals); `visible` sets what it says. */
export function reportIntersections(visible = true): void {
  onScreen = visible;
  vi.stubGlobal('IntersectionObserver', ReportingObserver);
}
