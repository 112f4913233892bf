// The report header of the machine on screen, filled once and kept with the machine: every
// report and CSV file of every tool carries it.
import { header, setHeader } from '../../state/work';
import { MAX_NAME_CHARS, MAX_NOTES_CHARS } from '../../state/validate';
import type { MachineHeader } from '../../state/model';
import style from './style.module.css';

type TextKey = Exclude<keyof MachineHeader, 'notes'>;

const FIELDS: ReadonlyArray<{ key: TextKey; label: string; type: string; placeholder?: string }> = [
  { key: 'site', label: 'Site', type: 'text', placeholder: 'Plant, line, building' },
  { key: 'name', label: 'Machine', type: 'text', placeholder: 'e.g. Line 2 cooler fan' },
  { key: 'assessedBy', label: 'Assessed by', type: 'text' },
  { key: 'assessedOn', label: 'Date', type: 'date' },
];

/** Site, machine, assessed by, date and notes, for every report of this machine. */
export function ReportHeaderFields() {
  const h = header.value;
  return (
    <details class={style.header} data-print="hide">
      <summary class={style.summary}>
        Report header{h.site || h.assessedBy ? '' : ': fill in once for this machine'}
      </summary>
      <div class={style.fields}>
        {FIELDS.map((f) => (
          <label key={f.key} class={style.field}>
            <span class={style.label}>{f.label}</span>
            <input
              class={style.input}
              type={f.type}
              maxLength={MAX_NAME_CHARS}
              placeholder={f.placeholder}
              value={h[f.key]}
              onInput={(e) => setHeader({ [f.key]: (e.currentTarget as HTMLInputElement).value })}
            />
          </label>
        ))}
        <label class={style.field}>
          <span class={style.label}>Notes</span>
          <textarea
            class={style.notes}
            rows={3}
            maxLength={MAX_NOTES_CHARS}
            value={h.notes}
            onInput={(e) => setHeader({ notes: (e.currentTarget as HTMLTextAreaElement).value })}
          />
        </label>
      </div>
    </details>
  );
}
