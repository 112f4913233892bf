import { render } from 'preact';
import { storageOpened } from '../state/sessionNotices';
import { storageStatus } from '../state/store/status';
import { lazyModule } from '../ui/lazyModule';
import { App } from './app';
import { toolScreens } from './screen-list';

// The service worker's registration and its notice need nothing before the first paint: they
// load in a chunk of their own just after it (the worker itself only precaches for next time).
const updateNotice = lazyModule(() => import('./update-notice/connected'));

function LaterUpdateNotice() {
  const { module } = updateNotice.use();
  return module ? <module.ServiceWorkerNotice /> : null;
}

// The session's code (storage, saved machines, share links) is asked for at once and arrives
// while the first screen renders: the first paint does not wait for it.
const session = import('../state/session');
render(<App updateNotice={<LaterUpdateNotice />} />, document.getElementById('app')!);
// The page says when the starting machine is in place (a share link, or the last visit's
// working copy): what is typed from then on can no longer be replaced by it. Browser tests
// wait for this before they type.
void session
  .then((s) => s.startSession())
  .catch(() => {
    // Its chunk could not be fetched (an old page after an update, offline): say so.
    storageStatus.value = {
      mode: 'memory',
      reason:
        'Saving could not be started: changes last only until this tab is closed. Reload the page to try again.',
    };
    storageOpened.value = true;
  })
  .finally(() => {
    document.documentElement.dataset.session = 'open';
  });
// Fetch the field tools once the first screen is up, so their tabs open at once (and a failed
// fetch is simply tried again when a tab asks).
setTimeout(() => void toolScreens.load().catch(() => undefined), 0);
