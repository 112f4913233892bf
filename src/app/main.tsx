import { render } from 'preact';
import { startSession } from '../state/session';
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

render(<App updateNotice={<LaterUpdateNotice />} />, document.getElementById('app')!);
// The page says when the starting machine is in place (a share link, or the last visit's
// working copy): what is typed from then on can no longer be replaced by it. Browser tests
// wait for this before they type.
void startSession().finally(() => {
  document.documentElement.dataset.session = 'open';
});
// Fetch the field tools once the first screen is up, so their tabs open at once (and a failed
// fetch is simply tried again when a tab asks).
setTimeout(() => void toolScreens.load().catch(() => undefined), 0);
