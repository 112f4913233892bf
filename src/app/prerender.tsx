// The first screen as HTML, for the built page to show before its script has run (the
// prerender build step, scripts/prerender.ts). It is what the script's own first render shows:
// the check screen with the starting machine, before the last visit's working copy is loaded.
import { renderToString } from 'preact-render-to-string';
import { App } from './app';

export function firstScreenHtml(): string {
  return renderToString(<App />);
}
