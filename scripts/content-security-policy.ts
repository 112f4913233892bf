// The Content-Security-Policy of the built page, as a <meta> tag put first in its <head> at
// build time. Every script, style sheet, worker, image, font, sound and connection comes from
// the app's own origin; nothing inline runs; no plug-ins, no <base> and no form submission.
//
// Styles: 'self' alone. Preact writes a `style` prop through the CSS object model
// (element.style.cssText or element.style.setProperty), and so does uPlot; CSP governs style
// attributes parsed from markup and setAttribute('style', …), not the CSS object model, so no
// 'unsafe-inline' is needed for style-src or style-src-attr (test/browser/csp.test.ts records
// zero violations on every screen).
//
// Workers: 'self' covers the service worker (sw.js, registered from this origin) and the
// AudioWorklet module of src/audio (bundled as its own file on this origin).
//
// Only the build gets it: Vite's dev server injects inline code and styles for hot reload,
// which this policy would block. A <meta> policy cannot set frame-ancestors or report-to;
// those need a response header from whatever serves the files.
import type { Plugin } from 'vite';

/** The policy's directives, one per line of the meta tag's content. */
export const CONTENT_SECURITY_POLICY: Readonly<Record<string, string>> = {
  'default-src': "'self'",
  'script-src': "'self'",
  'style-src': "'self'",
  'img-src': "'self'",
  'font-src': "'self'",
  'media-src': "'self'",
  'connect-src': "'self'",
  'worker-src': "'self'",
  'manifest-src': "'self'",
  'object-src': "'none'",
  'base-uri': "'none'",
  'form-action': "'none'",
};

/** The policy as one header value: "default-src 'self'; script-src 'self'; …". */
export function policyText(policy = CONTENT_SECURITY_POLICY): string {
  return Object.entries(policy)
    .map(([name, value]) => `${name} ${value}`)
    .join('; ');
}

/**
 * A Vite plugin that puts the policy in the built page's <head>, straight after the character
 * set (which must come first) and before any script or style sheet it governs.
 */
export function contentSecurityPolicy(policy = CONTENT_SECURITY_POLICY): Plugin {
  return {
    name: 'trueturn-content-security-policy',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler(html) {
        const charset = /<meta charset="[^"]*"\s*\/?>/i.exec(html);
        if (!charset) throw new Error('index.html needs <meta charset> before the policy.');
        const end = charset.index + charset[0].length;
        const tag = `<meta http-equiv="Content-Security-Policy" content="${policyText(policy)}" />`;
        return `${html.slice(0, end)}\n    ${tag}${html.slice(end)}`;
      },
    },
  };
}
