import { useState } from 'preact/hooks';
import { formatNumber } from '../../words/format';
import { machines } from '../../state/machines';
import { openMachineId } from '../../state/work';
import { partLabel, activeIndex } from '../../state/model';
import { setup } from '../../state/setup';
import { applyHeardSpeed } from '../../state/soundSpeed';
import {
  featuresInUse,
  saveFoundSpeed,
  type SaveTarget,
  type HeardOrigin,
} from '../../state/speedFinder';
import { Panel } from '../../ui/panel';
import { savedSpeedLines } from '../../words/speedFinder';
import { soundSpeedWords } from '../../words/sound';
import { NameLengthNote, nameIsFull, nameNoteId } from '../../ui/name-length-note';
import style from './style.module.css';

interface Props {
  /** The speed the procedure found, rev/s; absent until it has found one. */
  speedHz?: number;
  /** Where it came from, when the sound had a part in it (its precision becomes the tolerance). */
  origin?: HeardOrigin;
}

type Outcome = { kind: 'done' | 'problem'; lines: string[] } | null;

/**
 * "Save speed to a machine": the speed found goes into the Check screen's part, and into the
 * machine open now or a new one; what changed is said in words.
 */
export function SavePanel({ speedHz, origin }: Props) {
  const [name, setName] = useState('');
  const [outcome, setOutcome] = useState<Outcome>(null);
  const [busy, setBusy] = useState(false);
  // The saved machine the working copy was opened from (the speed goes to it), if any.
  const machineName = machines.value.find((m) => m.id === openMachineId.value)?.name;
  const s = setup.value;
  const part = partLabel(s, activeIndex(s));

  const save = async (target: SaveTarget) => {
    if (speedHz === undefined) return;
    setBusy(true);
    try {
      setOutcome({
        kind: 'done',
        lines: savedSpeedLines(
          origin
            ? await applyHeardSpeed(speedHz, origin, target)
            : await saveFoundSpeed(speedHz, featuresInUse.peek(), target),
        ),
      });
      if (target.kind === 'new') setName('');
    } catch (error) {
      setOutcome({
        kind: 'problem',
        lines: [error instanceof Error ? error.message : String(error)],
      });
    } finally {
      setBusy(false);
    }
  };

  return (
    <Panel title="Save speed to a machine" id="finder-save">
      {speedHz === undefined ? (
        <p class={style.quiet}>
          When the steps end with one speed, it can be saved here as the speed of {part}.
        </p>
      ) : (
        <>
          <p>
            Found:{' '}
            <strong data-testid="found-speed">
              {origin
                ? soundSpeedWords({ speedHz, precisionHz: origin.precisionHz })
                : `${formatNumber(speedHz * 60)} rpm`}
            </strong>
            , for {part} on the Check screen.
          </p>
          {machineName ? (
            <button
              type="button"
              class={style.primary}
              disabled={busy}
              onClick={() => void save({ kind: 'open' })}
            >
              Save speed to “{machineName}”
            </button>
          ) : (
            <form
              class={style.saveNew}
              data-print="hide"
              onSubmit={(e) => {
                e.preventDefault();
                void save({ kind: 'new', name });
              }}
            >
              <label class={style.label} for="finder-machine-name">
                New machine's name
              </label>
              <div class={style.inputRow}>
                <input
                  id="finder-machine-name"
                  class={style.input}
                  type="text"
                  maxLength={80}
                  value={name}
                  aria-describedby={
                    nameIsFull(name) ? nameNoteId('finder-machine-name') : undefined
                  }
                  onInput={(e) => setName((e.currentTarget as HTMLInputElement).value)}
                />
                <button type="submit" class={style.primary} disabled={busy}>
                  Save speed to a new machine
                </button>
              </div>
              <NameLengthNote id={nameNoteId('finder-machine-name')} name={name} />
            </form>
          )}
          <button
            type="button"
            class={style.quietButton}
            disabled={busy}
            onClick={() => void save({ kind: 'setup' })}
          >
            Use it on the Check screen only
          </button>
        </>
      )}
      {outcome && (
        <ul
          class={style.outcome}
          data-kind={outcome.kind}
          role={outcome.kind === 'problem' ? 'alert' : 'status'}
          data-testid="save-outcome"
        >
          {outcome.lines.map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
      )}
    </Panel>
  );
}
