import type { ComponentChildren } from 'preact';
import { useEffect, useRef } from 'preact/hooks';
import { openScreen } from '../../state/navigation';
import { SCREENS, screenEntry, toolScreens } from '../screen-list';
import style from './style.module.css';

interface Props {
  /** Messages across the top: updates, storage, how the session opened. */
  notices?: ComponentChildren;
  /** The id of the open screen: its tab is marked. */
  current: string;
  children: ComponentChildren;
}

/** Starts fetching the tools' chunk (a failed fetch is tried again when a screen asks). */
function prefetchTools(): void {
  toolScreens.load().catch(() => undefined);
}

/**
 * The page: our mark and name, the tab bar (one tab per entry of the list of screens), notices,
 * and the open screen under its heading, the page's one h1 (read out, not shown: the marked tab
 * names the screen on sight).
 */
export function AppFrame({ notices, current, children }: Props) {
  const screen = current;
  const heading = screenEntry(screen).heading;
  const tabBar = useRef<HTMLElement>(null);
  // On a phone the tab row scrolls sideways: keep the open tab in view. The first tab is in
  // view when the page opens, and asking would lay the whole page out early, before its first
  // paint is even done with: only another tab is scrolled to.
  const opened = useRef(false);
  useEffect(() => {
    const first = !opened.current;
    opened.current = true;
    if (first && screen === SCREENS[0].id) return;
    const open = tabBar.current?.querySelector<HTMLElement>('[aria-current="page"]');
    open?.scrollIntoView?.({ block: 'nearest', inline: 'nearest' });
  }, [screen]);
  // The window's title names the screen too (WCAG 2.4.2 Page Titled).
  useEffect(() => {
    document.title = `${heading} · Trueturn`;
  }, [heading]);
  return (
    <div class={style.frame}>
      <header class={style.header}>
        <div class={style.brand}>
          <svg class={style.mark} viewBox="0 0 512 512" aria-hidden="true">
            <g transform="translate(256 256)">
              <circle r="168" fill="none" stroke="currentColor" stroke-width="40" />
              <path
                d="M0 0V-138"
                stroke="currentColor"
                stroke-width="34"
                stroke-linecap="round"
                opacity="0.25"
                transform="rotate(-64)"
              />
              <path
                d="M0 0V-138"
                stroke="currentColor"
                stroke-width="38"
                stroke-linecap="round"
                opacity="0.45"
                transform="rotate(-32)"
              />
              <path d="M0 0V-140" stroke="var(--accent)" stroke-width="50" stroke-linecap="round" />
              <circle r="44" fill="var(--accent)" />
            </g>
          </svg>
          <span class={style.name}>Trueturn</span>
        </div>
        <nav class={style.tabs} aria-label="Screens" ref={tabBar}>
          {SCREENS.map((t) => (
            <button
              key={t.id}
              type="button"
              class={style.tab}
              aria-current={t.id === screen ? 'page' : undefined}
              onClick={() => openScreen(t.id)}
              // The tools load when a finger or the keyboard reaches a tab, not with the first
              // screen: a tap rarely waits, and a page opened only to check costs nothing more.
              onPointerDown={prefetchTools}
              // Chromium leaves a tab that peeks in at the edge where it is, under the fade:
              // bring the whole tab into view when the keyboard reaches it.
              onFocus={(e) => {
                prefetchTools();
                e.currentTarget.scrollIntoView?.({ block: 'nearest', inline: 'nearest' });
              }}
            >
              <svg class={style.icon} viewBox="0 0 24 24" aria-hidden="true">
                <path d={t.icon} />
              </svg>
              {t.label}
            </button>
          ))}
        </nav>
      </header>
      {notices && (
        <div class={style.notices} data-print="hide">
          {notices}
        </div>
      )}
      <main class={style.main}>
        <h1 class={style.heading}>{heading}</h1>
        {children}
      </main>
    </div>
  );
}
