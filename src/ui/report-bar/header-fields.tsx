// The report header of the machine on screen, filled once and kept with the machine: every
// report and CSV file of every tool carries it.
import { useState } from 'preact/hooks';
import { header, setHeader } from '../../state/work';
import { MAX_NAME_CHARS, MAX_NOTES_CHARS } from '../../state/validate';
import type { MachineHeader } from '../../state/model';
import { NameLengthNote, nameIsFull, nameNoteId } from '../name-length-note';
import style from './style.module.css';

type TextKey = Exclude<keyof MachineHeader, 'notes'>;

const FIELDS: ReadonlyArray<{ key: TextKey; label: string; type: string; placeholder?: string }> = [
  { key: 'site', label: 'Site', type: 'text', placeholder: 'Plant, line, building' },
  { key: 'name', label: 'Machine', type: 'text', placeholder: 'e.g. Line 2 cooler fan' },
  { key: 'assessedBy', label: 'Assessed by', type: 'text' },
  { key: 'assessedOn', label: 'Date', type: 'date' },
];

const NOTES_ID = 'report-notes';
const notesNoteId = `${NOTES_ID}-length`;

/**
 * Site, machine, assessed by, date and notes, for every report of this machine. The fields are
 * made when the header is opened: a date field alone costs milliseconds to build on a phone, and
 * every screen carries this header closed.
 */
export function ReportHeaderFields() {
  const [open, setOpen] = useState(false);
  const h = header.value;
  return (
    <details
      class={style.header}
      data-print="hide"
      onToggle={(e) => setOpen((e.currentTarget as HTMLDetailsElement).open)}
    >
      <summary class={style.summary}>
        Report header{h.site || h.assessedBy ? '' : ': fill in once for this machine'}
      </summary>
      {open && <HeaderFields />}
    </details>
  );
}

/** The header's fields, made once it is opened. */
function HeaderFields() {
  const h = header.value;
  // The browser drops whatever goes past maxLength without a word: a note says why it stops.
  const notesFull = h.notes.length >= MAX_NOTES_CHARS;
  return (
    <div class={style.fields}>
      {FIELDS.map((f) => {
        const id = `report-${f.key}`;
        const full = f.type === 'text' && nameIsFull(h[f.key]);
        return (
          <div key={f.key} class={style.field}>
            <label class={style.label} for={id}>
              {f.label}
            </label>
            <input
              id={id}
              class={style.input}
              type={f.type}
              maxLength={f.type === 'text' ? MAX_NAME_CHARS : undefined}
              placeholder={f.placeholder}
              value={h[f.key]}
              aria-describedby={full ? nameNoteId(id) : undefined}
              onInput={(e) => setHeader({ [f.key]: (e.currentTarget as HTMLInputElement).value })}
            />
            {f.type === 'text' && <NameLengthNote id={nameNoteId(id)} name={h[f.key]} />}
          </div>
        );
      })}
      <div class={style.field}>
        <label class={style.label} for={NOTES_ID}>
          Notes
        </label>
        <textarea
          id={NOTES_ID}
          class={style.notes}
          rows={3}
          maxLength={MAX_NOTES_CHARS}
          value={h.notes}
          aria-describedby={notesFull ? notesNoteId : undefined}
          onInput={(e) => setHeader({ notes: (e.currentTarget as HTMLTextAreaElement).value })}
        />
        {notesFull && (
          <p id={notesNoteId} class={style.note} role="status">
            Notes hold at most {MAX_NOTES_CHARS} characters; anything longer is cut there.
          </p>
        )}
      </div>
    </div>
  );
}
