// Bundled into the app by `bench:ui --profile` only (profile-build.ts puts it first in
// src/app/main.tsx's build; the app's source is not changed): counts each component's renders
// through Preact's render hook, so the profile can say what re-renders per keystroke.
// Preact names that hook "__r" in its published build (the same name @preact/signals uses).
import { Fragment, options, type VNode } from 'preact';

type RenderHook = (vnode: VNode) => void;
const hooks = options as typeof options & { __r?: RenderHook };
const counts: Record<string, number> = {};
const previous = hooks.__r;

hooks.__r = (vnode) => {
  const type = vnode.type;
  if (typeof type === 'function') {
    const name =
      type === Fragment
        ? 'Fragment'
        : ((type as { displayName?: string }).displayName ?? (type.name || '(anonymous)'));
    counts[name] = (counts[name] ?? 0) + 1;
  }
  previous?.(vnode);
};

declare global {
  interface Window {
    __trueturnRenders?: Record<string, number>;
  }
}
window.__trueturnRenders = counts;
