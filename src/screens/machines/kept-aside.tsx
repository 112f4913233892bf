// What storage is doing (saving, held in this tab, off), whether the browser promised to keep
// the data, and the data set aside because it could not be read: see it, download it as it was
// found, restore the machines it still holds.
import { useEffect, useState } from 'preact/hooks';
import { heldIds, storageStatus } from '../../state/machines';
import { machinesIn, recovered, refreshRecovered, restoreRecovered } from '../../state/recovered';
import { persistence, type RecoveredRecord } from '../../state/store';
import { downloadText } from '../../ui/download';
import { Panel } from '../../ui/panel';
import style from './style.module.css';

/** Saving on this device: on, held in this tab (and why), or off. */
export function StorageState() {
  const status = storageStatus.value;
  const held = heldIds.value.size;
  return (
    <Panel title="On this device" id="storage">
      <p class={style.help} data-testid="storage-state" data-mode={status.mode}>
        {status.mode === 'saved'
          ? 'Every machine in the list is saved on this device.'
          : (status.reason ?? 'Saving is off.')}
        {status.mode !== 'saved' && held > 0
          ? ` ${held === 1 ? '1 machine waits' : `${held} machines wait`} to be saved.`
          : ''}
      </p>
      {persistence.value === 'refused' && (
        <p class={style.help} data-testid="persist-note">
          This browser did not promise to keep Trueturn's data: it may clear it when the device runs
          short of space. Export your machines now and then to be safe.
        </p>
      )}
    </Panel>
  );
}

type Outcome = { kind: 'done' | 'problem'; text: string } | null;

/** Data set aside because it could not be read. Shown only when there is some. */
export function KeptAside() {
  const [outcome, setOutcome] = useState<Outcome>(null);
  useEffect(() => {
    void refreshRecovered();
  }, []);
  const list = recovered.value;
  if (list.length === 0 && !outcome) return null;

  const download = (r: RecoveredRecord) =>
    downloadText(
      `trueturn-set-aside-${r.savedAt.slice(0, 10)}.json`,
      JSON.stringify(r, null, 2) + '\n',
      'application/json',
    );

  const restore = async (r: RecoveredRecord) => {
    const result = await restoreRecovered(r);
    if (!result.ok) {
      setOutcome({ kind: 'problem', text: result.error });
      return;
    }
    const left =
      result.unreadable > 0
        ? ` ${result.unreadable} item(s) still cannot be read and stay set aside.`
        : '';
    setOutcome({
      kind: result.held ? 'problem' : 'done',
      text: `Restored ${result.added.length} machine${result.added.length === 1 ? '' : 's'}${result.held ? ' into this tab (not yet saved on this device)' : ''}.${left}`,
    });
  };

  return (
    <Panel title="Set aside" id="kept-aside">
      <p class={style.help}>
        Saved data that could not be read is kept here as it was found, never deleted.
      </p>
      <ul class={style.list} data-testid="kept-aside">
        {list.map((r) => {
          const readable = machinesIn(r).machines.length;
          return (
            <li key={r.key} class={style.aside}>
              <p class={style.summary}>
                Set aside {r.savedAt.slice(0, 16).replace('T', ' ')} UTC: {r.reason}
              </p>
              <div class={style.actions}>
                <button type="button" class={style.quiet} onClick={() => download(r)}>
                  Download as found
                </button>
                <button
                  type="button"
                  class={style.primary}
                  disabled={readable === 0}
                  onClick={() => void restore(r)}
                >
                  {readable === 0
                    ? 'Nothing to restore'
                    : `Restore ${readable} machine${readable === 1 ? '' : 's'}`}
                </button>
              </div>
            </li>
          );
        })}
      </ul>
      {outcome && (
        <p
          class={style.outcome}
          data-kind={outcome.kind}
          role={outcome.kind === 'problem' ? 'alert' : 'status'}
          data-testid="aside-outcome"
        >
          {outcome.text}
        </p>
      )}
    </Panel>
  );
}
