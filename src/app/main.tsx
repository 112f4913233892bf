// The page's entry. The built page already holds the first screen as HTML (scripts/prerender.ts),
// so the app's script (start.tsx: the render that brings that screen to life, then the session)
// is asked for only once the screen has been painted. From the service worker's cache the script
// would otherwise arrive at once and run before the first paint, holding the screen back for
// the length of its first render. This module imports only the paint helper, so it stays a few
// hundred bytes in front of the paint (scripts/first-paint-chunk.ts keeps the app out of it).
import { afterNextPaint } from '../state/afterNextPaint';

afterNextPaint(() => {
  import('./start').catch(() => {
    // Its chunk could not be fetched (an old page after an update, offline before the first
    // visit finished): the screen would stay inert, so say so on it.
    const notice = document.createElement('p');
    notice.setAttribute('role', 'alert');
    notice.textContent = 'Trueturn could not load its script. Reload the page to try again.';
    document.body.prepend(notice);
  });
});
