// The session: where the machine on screen comes from when the page opens (a share link, the
// last visit's working copy, a fresh machine), share links opened while the app is open, and
// what the page says about them. A refused link never replaces what was on screen.
import { computed } from '@preact/signals';
import { loadMachines, machines } from './machines';
import type { MachineContent, Setup } from './model';
import { decodeShareFragment, type DecodeShareResult } from './shareLink';
import { loadAll, openStore, type WorkRecord } from './store';
import { offeredShare, sessionMessage, storageOpened } from './sessionNotices';
import { setup } from './setup';
import { header, keepWork, loadWork, openMachineId, workRecord } from './work';

export { openMachineId } from './work';
export { offeredShare, sessionMessage, storageOpened } from './sessionNotices';

/** Name of the machine on screen, or undefined while it has none (report headers). */
export const openMachineName = computed<string | undefined>(
  () => header.value.name.trim() || undefined,
);

/** Where the starting machine comes from: the page address, and the working copy kept on the device. */
export interface SessionSources {
  /** The page address fragment (location.hash). */
  hash: string;
  /** Reads the share fragment (src/state/shareLink.ts). */
  decodeShare: (hash: string) => DecodeShareResult;
  /** The working copy kept from the last visit, if any (src/state/store). */
  loadLast: () => Promise<WorkRecord | null>;
  /** Removes the share data from the address once read, so a reload does not reopen it over later changes. */
  clearHash: () => void;
}

function sharedName(content: MachineContent): string {
  return content.name.trim() ? `"${content.name.trim()}"` : 'a shared machine';
}

/**
 * Picks the starting machine: a share link wins; a refused link says why and leaves what was
 * there (the last visit's working copy, or what is on screen); otherwise the last visit's
 * working copy. A machine the user already changed (the working copy is no longer `untouched`,
 * the one the page opened with) is left alone.
 */
export async function openSession(
  sources: SessionSources,
  untouched: WorkRecord | null = workRecord.peek(),
): Promise<void> {
  const shared = sources.decodeShare(sources.hash);
  if (shared.ok) {
    loadWork(shared.content, null, null);
    sessionMessage.value = {
      kind: 'info',
      text: `Opened ${sharedName(shared.content)} from a share link. Save it as a machine to keep it.`,
    };
    sources.clearHash();
    return;
  }
  if (shared.error !== null) {
    sessionMessage.value = {
      kind: 'problem',
      text: `${shared.error} Nothing was replaced: what you had on screen is kept.`,
    };
    sources.clearHash();
  }
  const last = await sources.loadLast();
  if (last && workRecord.peek() === untouched)
    loadWork(last.content, last.openId, last.baseVersion);
}

/**
 * A share link opened while the app is open (the address changed): a good one is offered, not
 * opened over what is on screen; a refused one says why and changes nothing.
 */
export function offerShare(hash: string, clearHash: () => void): void {
  const shared = decodeShareFragment(hash);
  if (!shared.ok && shared.error === null) return;
  clearHash();
  if (!shared.ok) {
    sessionMessage.value = {
      kind: 'problem',
      text: `${shared.error} Nothing was replaced: what you had on screen is kept.`,
    };
    return;
  }
  offeredShare.value = shared.content;
}

/** Opens the offered shared machine in place of what is on screen. */
export function acceptOfferedShare(): void {
  const content = offeredShare.peek();
  if (!content) return;
  loadWork(content, null, null);
  offeredShare.value = null;
  sessionMessage.value = {
    kind: 'info',
    text: `Opened ${sharedName(content)} from a share link. Save it as a machine to keep it.`,
  };
}

/**
 * Opens the session for real: keeps the working copy from the first keystroke, opens storage,
 * reads the share link in the address or the last visit's working copy, loads the saved
 * machines, and listens for share links opened later.
 */
export async function startSession(openedWith?: Setup): Promise<void> {
  // What the page opened with: anything typed while storage opens must win over the last visit,
  // and is kept from the first keystroke (a reload a moment later must not lose it). This code
  // loads after the first paint: a set-up that is no longer the one the page opened with
  // (`openedWith`, from main.tsx) was typed on meanwhile, and is kept as it is.
  const typedAlready = openedWith !== undefined && setup.peek() !== openedWith;
  const untouched = typedAlready ? null : workRecord.peek();
  const hash = location.hash;
  keepWork(typedAlready);
  const clearHash = () =>
    history.replaceState(history.state, '', location.pathname + location.search);
  await openStore();
  storageOpened.value = true;
  await openSession(
    {
      hash,
      decodeShare: decodeShareFragment,
      loadLast: async () => (await loadAll()).work,
      clearHash,
    },
    untouched,
  );
  // Links opened from now on are offered, never opened over what is on screen.
  addEventListener('hashchange', () => offerShare(location.hash, clearHash));
  await loadMachines();
  // A working copy opened from a machine deleted meanwhile is no longer one of the saved ones.
  const id = openMachineId.peek();
  if (id !== null && !machines.peek().some((m) => m.id === id)) openMachineId.value = null;
}
