// Which screen is open. A signal, not the address: the page fragment is reserved for share
// links, and a reload should not fail because of a stale screen name. The screens themselves
// (id, tab label, icon, loader) are listed once, in src/app/screen-list.tsx.
import { signal } from '@preact/signals';

/** The screen a first visit opens, and the one other screens send a chosen rate or setting to. */
export const CHECK_SCREEN = 'check';

/** The id of the open screen; an id the list of screens does not hold opens the check screen. */
export const currentScreen = signal<string>(CHECK_SCREEN);

export function openScreen(id: string): void {
  currentScreen.value = id;
}

/** "Open in check", "Open the Check screen": what another screen set is seen there. */
export function openCheckScreen(): void {
  openScreen(CHECK_SCREEN);
}
