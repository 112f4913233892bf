// A tab left open for days should still learn of a new version. The browser looks for a new
// service worker only when the page is loaded or navigated; these checks also ask when the app
// comes back to the foreground, and once an hour while it stays open on screen. A check that
// finds a new version ends in the update notice, through the registration's usual events.

/** Time between two checks while the app stays open on screen. */
export const UPDATE_CHECK_EVERY_MS = 60 * 60 * 1000;

/** What the checks need of a service worker registration (a ServiceWorkerRegistration). */
export interface UpdatableRegistration {
  /** A worker being installed right now, if any: no check is needed while one is. */
  readonly installing: unknown;
  /** Fetches the worker's script and installs it when it changed (ServiceWorkerRegistration.update). */
  update(): Promise<unknown>;
}

/** What the checks need of the page: is it on screen, is it online, and news of it showing or hiding. */
export interface UpdateCheckPage {
  visible(): boolean;
  online(): boolean;
  /** Calls `listener` whenever the page is shown or hidden; returns a function that stops it. */
  onVisibilityChange(listener: () => void): () => void;
}

/** The real page: the Page Visibility API and navigator.onLine. */
export const browserPage: UpdateCheckPage = {
  visible: () => document.visibilityState === 'visible',
  online: () => navigator.onLine !== false,
  onVisibilityChange(listener) {
    document.addEventListener('visibilitychange', listener);
    return () => document.removeEventListener('visibilitychange', listener);
  },
};

/**
 * Asks `registration` for an update each time the page comes back on screen (once per return)
 * and every UPDATE_CHECK_EVERY_MS while it is on screen. A check is skipped while the page is
 * offline, while a worker installs, or while the last check is still under way; a failed check
 * (no network, server down) is simply tried at the next occasion. Returns a function that stops
 * the checks.
 */
export function keepCheckingForUpdates(
  registration: UpdatableRegistration,
  page: UpdateCheckPage = browserPage,
): () => void {
  let underWay = false;
  let wasVisible = page.visible();
  const check = () => {
    if (underWay || registration.installing || !page.online()) return;
    underWay = true;
    registration
      .update()
      .catch(() => undefined)
      .finally(() => (underWay = false));
  };
  const stopListening = page.onVisibilityChange(() => {
    const visible = page.visible();
    if (visible && !wasVisible) check();
    wasVisible = visible;
  });
  const timer = setInterval(() => {
    if (page.visible()) check();
  }, UPDATE_CHECK_EVERY_MS);
  return () => {
    stopListening();
    clearInterval(timer);
  };
}
