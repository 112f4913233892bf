// A module loaded on first use, for code the first screen does not need (widgets, other
// screens). One shared request; a load that failed (an old page whose chunk is gone after an
// update) is tried again by the next caller.
import { useEffect, useState } from 'preact/hooks';

export interface LazyModule<T> {
  /** The module, loaded once. */
  load(): Promise<T>;
  /** Hook: the module once loaded (at once when loaded before), or whether loading failed. */
  use(): { module: T | null; failed: boolean };
}

/**
 * Wraps a dynamic import, e.g. `lazyModule(() => import('./widgets'))`. The bundler puts the
 * imported module in a chunk of its own, fetched when `load` or `use` first asks for it.
 */
export function lazyModule<T>(importer: () => Promise<T>): LazyModule<T> {
  let loaded: T | null = null;
  let pending: Promise<T> | null = null;
  const load = (): Promise<T> => {
    pending ??= importer().then(
      (module) => (loaded = module),
      (error: unknown) => {
        pending = null;
        throw error;
      },
    );
    return pending;
  };
  const use = () => {
    const [state, setState] = useState(() => ({ module: loaded, failed: false }));
    useEffect(() => {
      if (state.module) return;
      let live = true;
      // Asked for in a task of its own, not among the effects that run after a render: asking
      // adds the chunk's preload and style-sheet links to the page, and Chromium does work for
      // each as it goes in (0.5 to 12 ms a link, measured at start-up, up to 30 ms a load), so
      // the first render's effects would pay for every lazy part of the screen in one long task.
      const asking = setTimeout(() =>
        load().then(
          (module) => live && setState({ module, failed: false }),
          () => live && setState({ module: null, failed: true }),
        ),
      );
      return () => {
        live = false;
        clearTimeout(asking);
      };
    }, []);
    return state;
  };
  return { load, use };
}
