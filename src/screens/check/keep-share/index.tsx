import { useState } from 'preact/hooks';
import {
  heldIds,
  lastConflict,
  machines,
  saveMachine,
  updateMachine,
  type SaveResult,
} from '../../../state/machines';
import { encodeShareFragment } from '../../../state/shareLink';
import {
  header,
  markSaved,
  openBaseVersion,
  openMachineId,
  setHeader,
  startNewMachine,
  workContent,
} from '../../../state/work';
import { Panel } from '../../../ui/panel';
import { NameLengthNote, nameIsFull, nameNoteId } from '../../../ui/name-length-note';
import { saveWords, type SaveWords } from '../../../words/saving';
import style from './style.module.css';

interface Props {
  class?: string;
}

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

function versionAfter(result: SaveResult): number | null {
  return 'version' in result.outcome ? result.outcome.version : null;
}

/**
 * The machine on screen: its name, saving it (changes to the machine it was opened from, or as
 * a new one), starting a new machine, and sharing it as a link.
 */
export function KeepShare({ class: extra }: Props) {
  const [said, setSaid] = useState<SaveWords | null>(null);
  // A save held in this tab (the device refused it) is written by itself later: then the
  // message says what finally happened instead of that it waits.
  const [waiting, setWaiting] = useState<{ id: string; done: string } | null>(null);
  const conflict = lastConflict.value;
  const outcome: SaveWords | null =
    waiting && said?.kind === 'problem' && !heldIds.value.has(waiting.id)
      ? conflict?.id === waiting.id
        ? {
            kind: 'problem',
            text: `Another tab saved this machine meanwhile: both are kept, this one as "${conflict.copy.name}".`,
          }
        : { kind: 'done', text: waiting.done }
      : said;
  const setOutcome = (words: SaveWords | null) => {
    setWaiting(null);
    setSaid(words);
  };
  const show = (result: SaveResult, done: string) => {
    setSaid(saveWords(result.machine.name, result.outcome, done));
    setWaiting(result.outcome.kind === 'held' ? { id: result.machine.id, done } : null);
  };
  const [link, setLink] = useState<string | null>(null);
  const [confirmNew, setConfirmNew] = useState(false);
  const name = header.value.name;
  const opened = machines.value.find((m) => m.id === openMachineId.value);

  const saveNew = async (event: Event) => {
    event.preventDefault();
    try {
      const result = await saveMachine(name, workContent.peek());
      markSaved(result.machine.id, versionAfter(result));
      setHeader({ name: result.machine.name });
      show(result, `Saved as "${result.machine.name}".`);
    } catch (error) {
      setOutcome({ kind: 'problem', text: messageOf(error) });
    }
  };

  const saveChanges = async () => {
    if (!opened) return;
    if (name.trim() === '') {
      // Said in the words of this panel, not the saved list's field path ("name must not be blank").
      setOutcome({
        kind: 'problem',
        text: `The machine name is empty: type a name above (it was "${opened.name}"), then save.`,
      });
      return;
    }
    try {
      const result = await updateMachine(opened.id, workContent.peek(), openBaseVersion.peek());
      show(result, `Changes saved to "${result.machine.name}".`);
    } catch (error) {
      setOutcome({ kind: 'problem', text: messageOf(error) });
    }
  };

  const makeLink = () => {
    try {
      const url = `${location.origin}${location.pathname}${encodeShareFragment(workContent.peek())}`;
      setLink(url);
      setOutcome(null);
    } catch (error) {
      setLink(null);
      setOutcome({ kind: 'problem', text: messageOf(error) });
    }
  };

  const copyLink = async () => {
    if (!link) return;
    try {
      await navigator.clipboard.writeText(link);
      setOutcome({ kind: 'done', text: 'Link copied.' });
    } catch {
      setOutcome({
        kind: 'problem',
        text: 'This browser did not allow copying: select the link and copy it by hand.',
      });
    }
  };

  return (
    <Panel title="This machine" id="keep" class={extra}>
      {opened && (
        <div class={style.opened}>
          <p class={style.from}>
            Opened from <strong>{opened.name}</strong>
          </p>
          <button type="button" class={style.button} onClick={saveChanges}>
            Save changes to this machine
          </button>
        </div>
      )}
      <form class={style.save} onSubmit={saveNew}>
        <label class={style.label} for="machine-name">
          Machine name
        </label>
        <div class={style.row}>
          <input
            id="machine-name"
            class={style.input}
            type="text"
            maxLength={80}
            autoComplete="off"
            placeholder="e.g. Line 2 cooler fan"
            value={name}
            aria-describedby={nameIsFull(name) ? nameNoteId('machine-name') : undefined}
            onInput={(e) => setHeader({ name: (e.currentTarget as HTMLInputElement).value })}
          />
          <button type="submit" class={style.button}>
            Save as new machine
          </button>
        </div>
        <NameLengthNote id={nameNoteId('machine-name')} name={name} />
        <p class={style.hint}>
          Its parts, every tool's entries and the report header are saved with it.
        </p>
      </form>
      <div class={style.share}>
        {confirmNew ? (
          <div class={style.confirm} role="group" aria-label="Start a new machine">
            <p class={style.from}>
              {opened
                ? `Changes not saved to "${opened.name}" will be lost.`
                : 'What is on screen is not saved as a machine and will be lost.'}
            </p>
            <button
              type="button"
              class={style.button}
              onClick={() => {
                startNewMachine();
                setConfirmNew(false);
                setOutcome(null);
              }}
            >
              Start the new machine
            </button>
            <button type="button" class={style.quiet} onClick={() => setConfirmNew(false)}>
              Keep working on this one
            </button>
          </div>
        ) : (
          <button type="button" class={style.quiet} onClick={() => setConfirmNew(true)}>
            Start a new machine
          </button>
        )}
        <button type="button" class={style.button} onClick={makeLink}>
          Make a share link
        </button>
        {link && (
          <div class={style.row}>
            <input
              class={style.input}
              type="text"
              readOnly
              value={link}
              aria-label="Share link"
              data-testid="share-link"
              onFocus={(e) => (e.currentTarget as HTMLInputElement).select()}
            />
            <button type="button" class={style.button} onClick={copyLink}>
              Copy
            </button>
          </div>
        )}
        <p class={style.hint}>
          The whole machine travels inside the link itself; it never passes through a server.
        </p>
      </div>
      {outcome && (
        <p
          class={style.outcome}
          data-kind={outcome.kind}
          role={outcome.kind === 'problem' ? 'alert' : 'status'}
          data-testid="keep-outcome"
        >
          {outcome.text}
        </p>
      )}
    </Panel>
  );
}
