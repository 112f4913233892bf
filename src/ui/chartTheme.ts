// What the lazily drawn charts (the rate map, the spectrum) share: the system's colour scheme,
// followed as it changes, and their colours read from the custom properties of their box.
import { useEffect, useState } from 'preact/hooks';

/** 'dark' or 'light' as the system sets it; a chart reads its colours again when it changes. */
export function useColourScheme(): 'dark' | 'light' {
  const query =
    typeof matchMedia === 'function' ? matchMedia('(prefers-color-scheme: dark)') : null;
  const [dark, setDark] = useState(() => query?.matches ?? false);
  useEffect(() => {
    if (!query) return;
    const onChange = () => setDark(query.matches);
    query.addEventListener('change', onChange);
    return () => query.removeEventListener('change', onChange);
  }, []);
  return dark ? 'dark' : 'light';
}

/** A reader of the custom properties set on `root`, each with a fallback for a browser that has none. */
export function cssColours(root: Element): (name: string, fallback: string) => string {
  const css = getComputedStyle(root);
  return (name, fallback) => css.getPropertyValue(name).trim() || fallback;
}
