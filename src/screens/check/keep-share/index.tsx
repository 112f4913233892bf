import { useState } from 'preact/hooks';
import { machines, saveMachine, updateMachine } from '../../../state/machines';
import { encodeShareFragment } from '../../../state/shareLink';
import { setup } from '../../../state/setup';
import { openMachineId } from '../../../state/session';
import { Panel } from '../../../ui/panel';
import { NameLengthNote, nameIsFull, nameNoteId } from '../../../ui/name-length-note';
import style from './style.module.css';

interface Props {
  class?: string;
}

type Outcome = { kind: 'done' | 'problem'; text: string } | null;

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

/** Keep the set-up as a named machine, save changes to the machine it came from, or share it as a link. */
export function KeepShare({ class: extra }: Props) {
  const [name, setName] = useState('');
  const [outcome, setOutcome] = useState<Outcome>(null);
  const [link, setLink] = useState<string | null>(null);
  const opened = machines.value.find((m) => m.id === openMachineId.value);

  const saveNew = async (event: Event) => {
    event.preventDefault();
    try {
      const m = await saveMachine(name, setup.peek());
      openMachineId.value = m.id;
      setName('');
      setOutcome({ kind: 'done', text: `Saved as "${m.name}".` });
    } catch (error) {
      setOutcome({ kind: 'problem', text: messageOf(error) });
    }
  };

  const saveChanges = async () => {
    if (!opened) return;
    try {
      const m = await updateMachine(opened.id, setup.peek());
      setOutcome({ kind: 'done', text: `Changes saved to "${m.name}".` });
    } catch (error) {
      setOutcome({ kind: 'problem', text: messageOf(error) });
    }
  };

  const makeLink = () => {
    try {
      const url = `${location.origin}${location.pathname}${encodeShareFragment(setup.peek())}`;
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
    <Panel title="Keep and share" id="keep" class={extra}>
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
            onInput={(e) => setName((e.currentTarget as HTMLInputElement).value)}
          />
          <button type="submit" class={style.button}>
            Save as new machine
          </button>
        </div>
        <NameLengthNote id={nameNoteId('machine-name')} name={name} />
      </form>
      <div class={style.share}>
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
          The set-up travels inside the link itself; it never passes through a server.
        </p>
      </div>
      {outcome && (
        <p
          class={style.outcome}
          data-kind={outcome.kind}
          role={outcome.kind === 'problem' ? 'alert' : 'status'}
        >
          {outcome.text}
        </p>
      )}
    </Panel>
  );
}
