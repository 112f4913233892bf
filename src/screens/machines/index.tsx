import { useLayoutEffect, useRef, useState } from 'preact/hooks';
import { openCheckScreen } from '../../state/navigation';
import type { Machine } from '../../state/model';
import {
  deleteMachine,
  duplicateMachine,
  exportAll,
  forgetDeleted,
  heldIds,
  importMachines,
  lastDeleted,
  machines,
  renameMachine,
  undoDelete,
} from '../../state/machines';
import { readImportFile } from '../../state/importFile';
import { openMachine, openMachineId, setHeader } from '../../state/work';
import { downloadText } from '../../ui/download';
import { Panel } from '../../ui/panel';
import { NameLengthNote, nameIsFull, nameNoteId } from '../../ui/name-length-note';
import { saveWords } from '../../words/saving';
import { KeptAside, StorageState } from './kept-aside';
import { machineSummary } from './summary';
import style from './style.module.css';

interface Props {}

type Outcome = { kind: 'done' | 'problem'; text: string } | null;

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

/** Today's date for a file name: 2025-03-12. */
function dateStamp(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}

/**
 * Where focus goes once the page shows a change: the element a request finds, or null while the
 * page does not show the change yet (the request waits for the next render).
 */
type FocusRequest = () => HTMLElement | null;

/** Focus requests of the rows and the screen, carried out after the render that shows the change. */
function useFocusAfterRender(): (request: FocusRequest) => void {
  const pending = useRef<FocusRequest | null>(null);
  const [, rerender] = useState(0);
  useLayoutEffect(() => {
    const target = pending.current?.();
    if (!target) return;
    pending.current = null;
    target.focus();
  });
  return (request) => {
    pending.current = request;
    // Render once more even when nothing else changes (the change may already be on screen).
    rerender((n) => n + 1);
  };
}

const byId = (id: string): HTMLElement | null => document.getElementById(id);

/** The id of a machine's card, which takes focus (tabIndex -1) when it is where focus lands. */
const cardId = (id: string): string => `machine-${id}`;

/**
 * The saved machines: open, rename, duplicate, delete with undo; what storage is doing; data
 * set aside; export and import as a file. Focus never falls to the page: after Delete it goes
 * to the next machine in the list (when the last of the list was deleted, to Undo; with no
 * Undo shown, to the list's heading); after Undo, to the machine brought back; after Close on
 * the undo bar, to the heading; during a rename it is in the name field, and afterwards on that
 * machine's Rename button.
 */
export function MachinesScreen(_props: Props) {
  const [outcome, setOutcome] = useState<Outcome>(null);
  const list = machines.value;
  const deleted = lastDeleted.value;
  const held = heldIds.value;
  const focusAfterRender = useFocusAfterRender();

  const exportFile = () => {
    try {
      downloadText(`trueturn-machines-${dateStamp()}.json`, exportAll(), 'application/json');
      setOutcome({
        kind: 'done',
        text: `Exported ${list.length} machine${list.length === 1 ? '' : 's'}.`,
      });
    } catch (error) {
      setOutcome({ kind: 'problem', text: messageOf(error) });
    }
  };

  const importFile = async (event: Event) => {
    const input = event.currentTarget as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    // The size is checked before the file is read (src/state/importFile.ts).
    const read = await readImportFile(file);
    if (!read.ok) {
      setOutcome({ kind: 'problem', text: `Nothing was imported. ${read.error}` });
      return;
    }
    const result = await importMachines(read.text);
    if (!result.ok) {
      setOutcome({ kind: 'problem', text: `Nothing was imported. ${result.error}` });
      return;
    }
    const renamed =
      result.renamed.length > 0
        ? ` Renamed to avoid clashes: ${result.renamed.map((r) => `"${r.to}"`).join(', ')}.`
        : '';
    const count = `${result.added.length} machine${result.added.length === 1 ? '' : 's'}`;
    setOutcome(
      result.held
        ? {
            kind: 'problem',
            text: `Imported ${count} into this tab, not yet saved on this device: they are saved by themselves once it takes writes again.${renamed}`,
          }
        : { kind: 'done', text: `Imported ${count}.${renamed}` },
    );
  };

  const undo = async () => {
    const restored = await undoDelete().catch((error: unknown) => {
      setOutcome({ kind: 'problem', text: messageOf(error) });
      return null;
    });
    if (restored) focusAfterRender(() => byId(`open-${restored.id}`));
  };

  const remove = async (id: string) => {
    const at = machines.peek().findIndex((m) => m.id === id);
    const nextId = machines.peek()[at + 1]?.id ?? null;
    // Once the card is gone: the machine after it, else Undo, else the heading of the list.
    focusAfterRender(() => {
      if (machines.peek().some((m) => m.id === id)) return null;
      return (nextId && byId(cardId(nextId))) || byId('undo-delete') || byId('machines-title');
    });
    try {
      await deleteMachine(id);
    } catch (error) {
      // Not deleted: focus stays with the machine, and the message says why.
      focusAfterRender(() => byId(cardId(id)));
      setOutcome({ kind: 'problem', text: messageOf(error) });
    }
  };

  const closeUndo = () => {
    forgetDeleted();
    focusAfterRender(() => (byId('undo-delete') ? null : byId('machines-title')));
  };

  return (
    <div class={style.screen}>
      <Panel title="Saved machines" id="machines" focusableTitle>
        {deleted && (
          <div class={style.undo} role="status" data-testid="undo-bar">
            <p>
              Deleted <strong>{deleted.machine.name}</strong>.
            </p>
            <button
              type="button"
              id="undo-delete"
              class={style.primary}
              onClick={() => void undo()}
            >
              Undo
            </button>
            <button type="button" class={style.quiet} onClick={closeUndo}>
              Close
            </button>
          </div>
        )}
        {list.length === 0 ? (
          <p class={style.empty} tabIndex={-1} id="machines-empty">
            No machines saved yet. Set one up on the Check screen and save it there.
          </p>
        ) : (
          <ul class={style.list} data-testid="machine-list">
            {list.map((m) => (
              <li key={m.id}>
                <MachineRow
                  machine={m}
                  held={held.has(m.id)}
                  onOutcome={setOutcome}
                  onDelete={remove}
                  focusAfterRender={focusAfterRender}
                />
              </li>
            ))}
          </ul>
        )}
      </Panel>
      <div class={style.side}>
        <StorageState />
        <Panel title="Move to another device" id="transfer">
          <p class={style.help}>
            Export writes every machine this tab holds to one file, whatever the device's storage is
            doing. Import adds the machines of such a file to this list.
          </p>
          <div class={style.actions}>
            <button
              type="button"
              class={style.primary}
              onClick={exportFile}
              disabled={list.length === 0}
            >
              Export all machines
            </button>
            <label class={style.fileButton}>
              <input
                type="file"
                accept=".json,application/json"
                class={style.file}
                onChange={importFile}
                data-testid="import-file"
              />
              <span>Import from a file</span>
            </label>
          </div>
          {outcome && (
            <p
              class={style.outcome}
              data-kind={outcome.kind}
              role={outcome.kind === 'problem' ? 'alert' : 'status'}
              data-testid="machines-outcome"
            >
              {outcome.text}
            </p>
          )}
        </Panel>
        <KeptAside />
      </div>
    </div>
  );
}

interface RowProps {
  machine: Machine;
  /** Its latest change is held in this tab, not yet on the device. */
  held: boolean;
  onOutcome: (o: Outcome) => void;
  onDelete: (id: string) => Promise<void>;
  focusAfterRender: (request: FocusRequest) => void;
}

function MachineRow({ machine, held, onOutcome, onDelete, focusAfterRender }: RowProps) {
  const [renaming, setRenaming] = useState(false);
  const [name, setName] = useState(machine.name);
  const [problem, setProblem] = useState<string | null>(null);
  const inputId = `rename-${machine.id}`;
  const renameButtonId = `rename-button-${machine.id}`;

  const open = () => {
    openMachine(machine);
    openCheckScreen();
  };

  const startRenaming = () => {
    setName(machine.name);
    setRenaming(true);
    focusAfterRender(() => byId(inputId));
  };

  const stopRenaming = () => {
    setRenaming(false);
    setProblem(null);
    focusAfterRender(() => byId(renameButtonId));
  };

  const rename = async (event: Event) => {
    event.preventDefault();
    try {
      const result = await renameMachine(machine.id, name);
      if (openMachineId.peek() === machine.id) setHeader({ name: result.machine.name });
      const words = saveWords(result.machine.name, result.outcome, '');
      if (words.kind === 'problem') onOutcome(words);
      stopRenaming();
    } catch (error) {
      setProblem(messageOf(error));
    }
  };

  const duplicate = async () => {
    try {
      const result = await duplicateMachine(machine.id);
      const words = saveWords(result.machine.name, result.outcome, '');
      if (words.kind === 'problem') onOutcome(words);
      focusAfterRender(() => byId(`open-${result.machine.id}`));
    } catch (error) {
      onOutcome({ kind: 'problem', text: messageOf(error) });
    }
  };

  return (
    <article
      class={style.machine}
      id={cardId(machine.id)}
      tabIndex={-1}
      aria-labelledby={`${machine.id}-name`}
    >
      <h3 id={`${machine.id}-name`} class={style.name}>
        {machine.name}
      </h3>
      {machine.site && <p class={style.site}>{machine.site}</p>}
      <p class={style.summary}>{machineSummary(machine)}</p>
      {held && (
        <p class={style.held} data-testid="held-mark">
          Not saved on this device yet: kept in this tab until it can be.
        </p>
      )}
      {machine.notes && <p class={style.notes}>{machine.notes}</p>}
      {renaming ? (
        <form class={style.rename} onSubmit={rename}>
          <label for={inputId} class={style.label}>
            New name
          </label>
          <div class={style.row}>
            <input
              id={inputId}
              class={style.input}
              type="text"
              maxLength={80}
              value={name}
              aria-invalid={problem ? 'true' : undefined}
              aria-describedby={
                [problem ? `${inputId}-problem` : '', nameIsFull(name) ? nameNoteId(inputId) : '']
                  .filter(Boolean)
                  .join(' ') || undefined
              }
              onInput={(e) => setName((e.currentTarget as HTMLInputElement).value)}
            />
            <button type="submit" class={style.primary}>
              Save name
            </button>
            <button
              type="button"
              class={style.quiet}
              onClick={() => {
                setName(machine.name);
                stopRenaming();
              }}
            >
              Cancel
            </button>
          </div>
          {problem && (
            <p id={`${inputId}-problem`} class={style.problem} role="alert">
              {problem}
            </p>
          )}
          <NameLengthNote id={nameNoteId(inputId)} name={name} />
        </form>
      ) : (
        <div class={style.actions}>
          <button type="button" id={`open-${machine.id}`} class={style.primary} onClick={open}>
            Open
          </button>
          <button type="button" id={renameButtonId} class={style.quiet} onClick={startRenaming}>
            Rename
          </button>
          <button type="button" class={style.quiet} onClick={() => void duplicate()}>
            Duplicate
          </button>
          <button type="button" class={style.quiet} onClick={() => void onDelete(machine.id)}>
            Delete
          </button>
        </div>
      )}
    </article>
  );
}
