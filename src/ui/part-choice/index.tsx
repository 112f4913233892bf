import { formatNumber } from '../../words/format';
import { partLabel, activeIndex } from '../../state/model';
import { selectPart } from '../../state/parts';
import { setup } from '../../state/setup';
import style from './style.module.css';

interface Props {
  id: string;
  label: string;
  /** Where the part itself is edited, for the line under the chooser. */
  editHint?: string;
}

/** Chooses which part of the set-up a tool works on (the same choice every screen shares). */
export function PartChoice({ id, label, editHint }: Props) {
  const s = setup.value;
  const index = activeIndex(s);
  const part = s.parts[index];
  return (
    <div class={style.field}>
      <label class={style.label} for={id}>
        {label}
      </label>
      <select
        id={id}
        class={style.select}
        value={String(index)}
        onChange={(e) => selectPart(Number((e.currentTarget as HTMLSelectElement).value))}
      >
        {s.parts.map((p, i) => (
          <option key={i} value={String(i)}>
            {partLabel(s, i)}
          </option>
        ))}
      </select>
      <p class={style.note} data-testid={`${id}-facts`}>
        {formatNumber(part.speedRpm)} rpm, {part.features}{' '}
        {part.features === 1 ? 'mark' : 'blades or marks'}, ±{formatNumber(part.tolerancePercent)}{' '}
        %.{editHint ? ` ${editHint}` : ''}
      </p>
    </div>
  );
}
