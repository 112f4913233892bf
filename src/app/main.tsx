import { render } from 'preact';
import { afterNextPaint } from '../state/afterNextPaint';
import { storageOpened } from '../state/sessionNotices';
import { setup } from '../state/setup';
import { storageStatus } from '../state/store/status';
import { lazyModule } from '../ui/lazyModule';
import { App } from './app';

// The service worker's registration and its notice need nothing before the first paint: they
// load in a chunk of their own just after it (the worker itself only precaches for next time).
const updateNotice = lazyModule(() => import('./update-notice/connected'));

function LaterUpdateNotice() {
  const { module } = updateNotice.use();
  return module ? <module.ServiceWorkerNotice /> : null;
}

// The set-up the page opens with: one that differs when the session starts was typed on.
const openedWith = setup.peek();

// This script is async (index.html): it runs in a task of its own as soon as it has loaded.
// A deferred module runs in the task that ends the parsing, where Chromium also lays the page
// out, and Lighthouse's simulation puts every task with a layout before the largest paint on
// that paint's path: the script's evaluation and first render counted toward LCP, though the
// prerendered page needs neither to paint. A slow page may still be parsing when the script is
// ready: the render then waits for the body.
if (document.readyState === 'loading') {
  document.addEventListener('DOMContentLoaded', start, { once: true });
} else {
  start();
}

function start(): void {
  const mount = document.getElementById('app')!;
  // The built page holds this same first screen as HTML (scripts/prerender.ts), inert until
  // now: the render takes its elements over, and from here on they answer.
  render(<App updateNotice={<LaterUpdateNotice />} />, mount);
  mount.removeAttribute('inert');
  // The session's code (storage, saved machines, share links) is asked for once the first
  // screen is painted, so that paint waits for none of it.
  afterNextPaint(() => void openSession());
}

async function openSession(): Promise<void> {
  let session: typeof import('../state/session');
  try {
    session = await import('../state/session');
  } catch {
    // Its chunk could not be fetched (an old page after an update, offline): say so.
    storageStatus.value = {
      mode: 'memory',
      reason:
        'Saving could not be started: changes last only until this tab is closed. Reload the page to try again.',
    };
    storageOpened.value = true;
    markOpen();
    return;
  }
  try {
    // What typed on before this keeps what was typed (and saves it).
    await session.startSession(openedWith);
  } catch (error) {
    // Storage faults are told by the store itself; anything else is a bug worth a trace.
    console.error(error);
  } finally {
    markOpen();
  }
}

/**
 * The page says when the starting machine is in place (a share link, or the last visit's working
 * copy): what is typed from then on can no longer be replaced by it. Browser tests wait for this
 * before they type.
 */
function markOpen(): void {
  document.documentElement.dataset.session = 'open';
}
