// Bundled into the app by `bench:ui --profile` only (profile-build.ts puts it first in
// src/app/main.tsx's build; the app's source is not changed): counts each component's renders
// through Preact's option hooks, and times each render from the start of its diff to its end
// (so a component's time includes the components it renders), so the profile can say what
// re-renders per keystroke and what that costs. Preact names its diff-start and render hooks
// "__b" and "__r" in its published build (the names @preact/signals uses too).
import { Fragment, options, type VNode } from 'preact';

type Hook = (vnode: VNode) => void;
const hooks = options as typeof options & { __b?: Hook; __r?: Hook };
const counts: Record<string, number> = {};
const times: Record<string, number> = {};
const started = new WeakMap<VNode, number>();
const rendered = new WeakSet<VNode>();
const previous = { diff: hooks.__b, render: hooks.__r, diffed: hooks.diffed };

function nameOf(vnode: VNode): string | null {
  const type = vnode.type;
  if (typeof type !== 'function') return null;
  if (type === Fragment) return 'Fragment';
  return (type as { displayName?: string }).displayName ?? (type.name || '(anonymous)');
}

hooks.__b = (vnode) => {
  if (typeof vnode.type === 'function') started.set(vnode, performance.now());
  previous.diff?.(vnode);
};
hooks.__r = (vnode) => {
  const name = nameOf(vnode);
  if (name !== null) {
    counts[name] = (counts[name] ?? 0) + 1;
    rendered.add(vnode);
  }
  previous.render?.(vnode);
};
hooks.diffed = (vnode) => {
  previous.diffed?.(vnode);
  const start = started.get(vnode);
  if (start === undefined) return;
  started.delete(vnode);
  // A component that bailed out (memo, unchanged) did not render: its diff is not counted.
  if (!rendered.has(vnode)) return;
  rendered.delete(vnode);
  const name = nameOf(vnode)!;
  times[name] = (times[name] ?? 0) + performance.now() - start;
};

declare global {
  interface Window {
    __trueturnRenders?: Record<string, number>;
    __trueturnRenderMs?: Record<string, number>;
  }
}
window.__trueturnRenders = counts;
window.__trueturnRenderMs = times;
