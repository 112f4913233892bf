// Which screen is open. A signal, not the address: the page fragment is reserved for share
// links, and a reload should not fail because of a stale screen name.
import { signal } from '@preact/signals';

/** Screens reachable from the tab bar. Other tools add their id here and a tab in app.tsx. */
export type ScreenId =
  'check' | 'machines' | 'lighting' | 'camera-plan' | 'logger' | 'speed-finder' | 'machine-chain';

export const currentScreen = signal<ScreenId>('check');

export function openScreen(id: ScreenId): void {
  currentScreen.value = id;
}
