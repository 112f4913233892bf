// The working copy: the machine on screen, whichever tool shows it — its header (name, site,
// notes, who assessed it and when), its parts and sampler (setup.ts) and every tool's inputs
// (toolInputs.ts) — and the saved machine it was opened from, with the version it was opened
// at. It is kept on the device as the user types (debounced, and written at once when the page
// is hidden or left), so a reload brings every tool back as it was.
import { batch, computed, effect, signal } from '@preact/signals';
import { lastConflict, lastSettled, versionOf } from './machines';
import {
  blankHeader,
  contentOf,
  defaultSetup,
  defaultToolInputs,
  type MachineContent,
  type MachineHeader,
} from './model';
import { replaceSetup, setup } from './setup';
import { flush, queueWork, type WorkRecord } from './store';
import { setToolInputs, toolInputs } from './toolInputs';

/** The saved machine the working copy was opened from (null = none, or it was deleted). */
export const openMachineId = signal<string | null>(null);
/** The version of that machine the working copy started from (another tab's save since keeps both). */
export const openBaseVersion = signal<number | null>(null);
/** The report header and name of the machine on screen. */
export const header = signal<MachineHeader>(blankHeader());

/** Everything on screen, as one machine's content. */
export const workContent = computed<MachineContent>(() => ({
  ...header.value,
  setup: setup.value,
  tools: toolInputs.value,
}));

/** The working copy as kept on the device. */
export const workRecord = computed<WorkRecord>(() => ({
  openId: openMachineId.value,
  baseVersion: openMachineId.value === null ? null : openBaseVersion.value,
  content: workContent.value,
}));

/** Changes one field of the header (the name, site, notes, assessed by, assessed on). */
export function setHeader(change: Partial<MachineHeader>): void {
  header.value = { ...header.value, ...change };
}

/**
 * Puts a machine's content on screen: its header, parts, sampler and every tool's inputs.
 * `openId` is the saved machine it comes from (null: not a saved machine) and `baseVersion`
 * the version it was read at.
 */
export function loadWork(
  content: MachineContent,
  openId: string | null,
  baseVersion: number | null,
): void {
  const c = contentOf(content);
  batch(() => {
    header.value = {
      name: c.name,
      site: c.site,
      notes: c.notes,
      assessedBy: c.assessedBy,
      assessedOn: c.assessedOn,
    };
    replaceSetup(c.setup);
    setToolInputs(c.tools);
    openMachineId.value = openId;
    openBaseVersion.value = openId === null ? null : baseVersion;
  });
}

/** Opens a saved machine on every screen, at the version this tab holds of it. */
export function openMachine(m: { id: string } & MachineContent): void {
  loadWork(m, m.id, versionOf(m.id));
}

/** Starts a new, unsaved machine: one part, every tool at its start. */
export function startNewMachine(): void {
  loadWork({ ...blankHeader(), setup: defaultSetup, tools: defaultToolInputs() }, null, null);
}

/** After the working copy was saved to machine `id` (now at `version`). */
export function markSaved(id: string, version: number | null): void {
  batch(() => {
    openMachineId.value = id;
    openBaseVersion.value = version;
  });
}

/** How long typing may pause before the working copy is written, ms. */
export const WORK_SAVE_DELAY_MS = 400;

/**
 * Keeps the working copy on the device from now on: every change is written once typing pauses,
 * and at once when the page is hidden or left, so the last keystroke is never lost. Nothing is
 * written until something changes (the last visit's copy stays there to be read). When another
 * tab's save of the open machine made this tab's change a copy, the working copy follows the copy.
 * `changedAlready`: something was typed before (it is written too). Returns a function that
 * stops it.
 */
export function keepWork(changedAlready = false): () => void {
  // A page typed on before it kept anything writes what is on screen at once.
  const untouched = changedAlready ? null : workRecord.peek();
  let timer: ReturnType<typeof setTimeout> | undefined;
  let dirty = false;
  const writeNow = () => {
    clearTimeout(timer);
    timer = undefined;
    if (!dirty) return;
    dirty = false;
    queueWork(workRecord.peek());
    void flush();
  };
  const stopWatching = effect(() => {
    const current = workRecord.value;
    if (current === untouched) return;
    dirty = true;
    clearTimeout(timer);
    timer = setTimeout(writeNow, WORK_SAVE_DELAY_MS);
  });
  const stopFollowing = effect(() => {
    const conflict = lastConflict.value;
    if (conflict && conflict.id === openMachineId.peek()) {
      // The copy has a name of its own: saving again must go to it under that name.
      batch(() => {
        markSaved(conflict.copy.id, 1);
        setHeader({ name: conflict.copy.name });
      });
    }
  });
  // This tab's own writes of the open machine (perhaps held a while) advance the version it
  // works from; another tab's never do, so saving over them keeps both.
  const stopSettling = effect(() => {
    const done = lastSettled.value;
    if (done && done.id === openMachineId.peek()) openBaseVersion.value = done.version;
  });
  const onHide = () => {
    if (document.visibilityState === 'hidden') writeNow();
  };
  const hasDocument = typeof document !== 'undefined';
  if (hasDocument) {
    document.addEventListener('visibilitychange', onHide);
    addEventListener('pagehide', writeNow);
  }
  return () => {
    writeNow();
    stopWatching();
    stopFollowing();
    stopSettling();
    if (hasDocument) {
      document.removeEventListener('visibilitychange', onHide);
      removeEventListener('pagehide', writeNow);
    }
  };
}
