// The session: where the set-up on screen comes from when the page opens (a share link, the
// last visit, the default), keeping it across reloads, and what the page says about that.
import { computed, effect, signal } from '@preact/signals';
import { loadMachines, machines } from './machines';
import { defaultSetup, type Setup } from './model';
import { replaceSetup, setup } from './setup';
import { decodeShareFragment } from './shareLink';
import { loadCurrentSetup, openStore, saveCurrentSetup } from './storage';

/** The saved machine the set-up was opened from (null = none, or it was deleted). */
export const openMachineId = signal<string | null>(null);

/** Name of the open machine, or undefined when the set-up is not one of the saved machines (report headers). */
export const openMachineName = computed<string | undefined>(
  () => machines.value.find((m) => m.id === openMachineId.value)?.name,
);

/** A message about how the session opened (a refused share link), for the top of the screen. */
export const sessionMessage = signal<{ kind: 'info' | 'problem'; text: string } | null>(null);

/** True once storage has been opened (or found unusable), so its status is worth showing. */
export const storageOpened = signal(false);

/** Where the starting set-up comes from: the page address, and the last set-up kept on the device. */
export interface SessionSources {
  /** The page address fragment (location.hash). */
  hash: string;
  /** Reads the share fragment (src/state/shareLink.ts). */
  decodeShare: (hash: string) => { ok: true; setup: Setup } | { ok: false; error: string | null };
  /** The set-up kept from the last visit, if any (src/state/storage.ts). */
  loadLast: () => Promise<Setup | null>;
  /** Removes the share data from the address once read, so a reload does not reopen it over later changes. */
  clearHash: () => void;
}

/**
 * Picks the starting set-up: a share link wins; a refused link shows its message and the
 * default set-up; otherwise the set-up from the last visit, else the default. A set-up the
 * user already changed (it is no longer `untouched`, the one the page opened with) is left alone.
 */
export async function openSession(
  sources: SessionSources,
  untouched: Setup = setup.peek(),
): Promise<void> {
  const shared = sources.decodeShare(sources.hash);
  if (shared.ok) {
    replaceSetup(shared.setup);
    openMachineId.value = null;
    sessionMessage.value = {
      kind: 'info',
      text: 'Opened a shared set-up. Save it as a machine to keep it.',
    };
    sources.clearHash();
    return;
  }
  if (shared.error !== null) {
    replaceSetup(defaultSetup);
    sessionMessage.value = {
      kind: 'problem',
      text: `${shared.error} The default set-up is shown instead.`,
    };
    sources.clearHash();
    return;
  }
  const last = await sources.loadLast();
  if (last && setup.peek() === untouched) replaceSetup(last);
}

/**
 * Opens the session for real: storage, the share link in the address, the last set-up;
 * then keeps every change of the set-up on the device, and loads the saved machines.
 */
export async function startSession(): Promise<void> {
  // What the page opened with: anything typed while storage opens must win over the last visit,
  // and must be kept from the first keystroke (a reload a moment later must not lose it). Until
  // something changes, nothing is written, so the last visit's set-up is there to be read.
  const untouched = setup.peek();
  effect(() => {
    const current = setup.value;
    if (current !== untouched) void saveCurrentSetup(current);
  });
  await openStore();
  storageOpened.value = true;
  await openSession(
    {
      hash: location.hash,
      decodeShare: decodeShareFragment,
      loadLast: loadCurrentSetup,
      clearHash: () => history.replaceState(history.state, '', location.pathname + location.search),
    },
    untouched,
  );
  await loadMachines();
}
