// Loads the preview and the rate map after the first paint. One shared request; a load that
// failed (an old page whose chunk is gone after an update) is tried again by the next mount.
import { useEffect, useState } from 'preact/hooks';

export type Widgets = typeof import('./widgets');

let loaded: Widgets | null = null;
let pending: Promise<Widgets> | null = null;

/** The widgets' module, loaded once. */
export function loadWidgets(): Promise<Widgets> {
  pending ??= import('./widgets').then(
    (module) => (loaded = module),
    (error: unknown) => {
      pending = null;
      throw error;
    },
  );
  return pending;
}

/** The widgets once loaded (at once when an earlier mount loaded them), or whether loading failed. */
export function useWidgets(): { widgets: Widgets | null; failed: boolean } {
  const [state, setState] = useState(() => ({ widgets: loaded, failed: false }));
  useEffect(() => {
    if (state.widgets) return;
    let live = true;
    loadWidgets().then(
      (widgets) => live && setState({ widgets, failed: false }),
      () => live && setState({ widgets: null, failed: true }),
    );
    return () => {
      live = false;
    };
  }, []);
  return state;
}
