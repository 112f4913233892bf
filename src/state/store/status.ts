// What the store tells the user: whether changes reach the device, the latest problem with
// saved data, and whether the browser promised to keep it. Messages name the real cause.
import { signal } from '@preact/signals';

/**
 * 'saved': every change is on the device; 'failing': the device refuses writes just now (reads
 * still work), changes are held in this tab and written as soon as a write succeeds again;
 * 'memory': the browser offers no storage, changes last only while the tab is open.
 */
export interface StorageStatus {
  mode: 'saved' | 'failing' | 'memory';
  /** Why changes are not reaching the device, in words for the user. */
  reason?: string;
}

/** Current storage mode; 'memory' with a reason until the store has opened. */
export const storageStatus = signal<StorageStatus>({
  mode: 'memory',
  reason: 'Saved data is still being opened.',
});

/** The latest problem with saved data, for the user (null = nothing to report). */
export const storageMessage = signal<string | null>(null);

/** Adds a message for the user, keeping any earlier one they have not dismissed yet. */
export function reportStorageProblem(text: string): void {
  const earlier = storageMessage.peek();
  storageMessage.value = earlier && !earlier.includes(text) ? `${earlier} ${text}` : text;
}

/**
 * Whether the browser agreed to keep saved data when space runs low: 'granted', 'refused'
 * (it may clear it: export now and then), or null while unknown.
 */
export const persistence = signal<'granted' | 'refused' | null>(null);

/** Why the device refused, in words for the user, from whatever the browser threw (no full stop). */
export function reasonFor(e: unknown): string {
  const name =
    typeof e === 'object' && e !== null && 'name' in e && typeof e.name === 'string' ? e.name : '';
  if (e instanceof StorageUnavailable) return e.message;
  if (name === 'QuotaExceededError') return 'the storage on this device is full';
  if (name === 'SecurityError') {
    return 'this browser does not let this page save (a private window, or storage blocked in settings)';
  }
  if (name === 'InvalidStateError') return 'the browser closed saved data while the page was open';
  if (name === 'UnknownError') return 'the browser could not reach saved data on the disk';
  return `the browser refused to use saved data${name ? ` (${name})` : ''}`;
}

/** Storage that cannot be used at all, with the reason in words. */
export class StorageUnavailable extends Error {}
