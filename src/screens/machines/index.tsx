import { useState } from 'preact/hooks';
import { openCheckScreen } from '../../state/navigation';
import type { Machine } from '../../state/model';
import {
  deleteMachine,
  duplicateMachine,
  exportAll,
  forgetDeleted,
  importMachines,
  lastDeleted,
  machines,
  renameMachine,
  undoDelete,
} from '../../state/machines';
import { replaceSetup } from '../../state/setup';
import { openMachineId } from '../../state/session';
import { Panel } from '../../ui/panel';
import { readImportFile } from '../../state/importFile';
import { NameLengthNote, nameIsFull, nameNoteId } from '../../ui/name-length-note';
import { setupSummary } from './summary';
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

/** The saved machines: open, rename, duplicate, delete with undo; export and import them as a file. */
export function MachinesScreen(_props: Props) {
  const [outcome, setOutcome] = useState<Outcome>(null);
  const list = machines.value;
  const deleted = lastDeleted.value;

  const exportFile = () => {
    try {
      const blob = new Blob([exportAll()], { type: 'application/json' });
      const url = URL.createObjectURL(blob);
      const a = document.createElement('a');
      a.href = url;
      a.download = `trueturn-machines-${dateStamp()}.json`;
      document.body.append(a);
      a.click();
      a.remove();
      setTimeout(() => URL.revokeObjectURL(url), 1000);
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
    setOutcome({
      kind: 'done',
      text: `Imported ${result.added.length} machine${result.added.length === 1 ? '' : 's'}.${renamed}`,
    });
  };

  return (
    <div class={style.screen}>
      <Panel title="Saved machines" id="machines">
        {deleted && (
          <div class={style.undo} role="status" data-testid="undo-bar">
            <p>
              Deleted <strong>{deleted.machine.name}</strong>.
            </p>
            <button type="button" class={style.primary} onClick={() => void undoDelete()}>
              Undo
            </button>
            <button type="button" class={style.quiet} onClick={forgetDeleted}>
              Close
            </button>
          </div>
        )}
        {list.length === 0 ? (
          <p class={style.empty}>
            No machines saved yet. Set one up on the Check screen and save it there.
          </p>
        ) : (
          <ul class={style.list} data-testid="machine-list">
            {list.map((m) => (
              <li key={m.id}>
                <MachineRow machine={m} onOutcome={setOutcome} />
              </li>
            ))}
          </ul>
        )}
      </Panel>
      <Panel title="Move to another device" id="transfer">
        <p class={style.help}>
          Export writes every saved machine to one file. Import adds the machines of such a file to
          this list.
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
    </div>
  );
}

interface RowProps {
  machine: Machine;
  onOutcome: (o: Outcome) => void;
}

function MachineRow({ machine, onOutcome }: RowProps) {
  const [renaming, setRenaming] = useState(false);
  const [name, setName] = useState(machine.name);
  const [problem, setProblem] = useState<string | null>(null);
  const inputId = `rename-${machine.id}`;

  const open = () => {
    replaceSetup(machine.setup);
    openMachineId.value = machine.id;
    openCheckScreen();
  };

  const rename = async (event: Event) => {
    event.preventDefault();
    try {
      await renameMachine(machine.id, name);
      setRenaming(false);
      setProblem(null);
    } catch (error) {
      setProblem(messageOf(error));
    }
  };

  const act = async (action: () => Promise<unknown>) => {
    try {
      await action();
    } catch (error) {
      onOutcome({ kind: 'problem', text: messageOf(error) });
    }
  };

  return (
    <article class={style.machine} aria-labelledby={`${machine.id}-name`}>
      <h3 id={`${machine.id}-name`} class={style.name}>
        {machine.name}
      </h3>
      <p class={style.summary}>{setupSummary(machine.setup)}</p>
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
                setRenaming(false);
                setName(machine.name);
                setProblem(null);
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
          <button type="button" class={style.primary} onClick={open}>
            Open
          </button>
          <button type="button" class={style.quiet} onClick={() => setRenaming(true)}>
            Rename
          </button>
          <button
            type="button"
            class={style.quiet}
            onClick={() => void act(() => duplicateMachine(machine.id))}
          >
            Duplicate
          </button>
          <button
            type="button"
            class={style.quiet}
            onClick={() => void act(() => deleteMachine(machine.id))}
          >
            Delete
          </button>
        </div>
      )}
    </article>
  );
}
