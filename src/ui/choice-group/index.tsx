import style from './style.module.css';

interface Props<T extends string> {
  /** Names the radio group (also its legend). */
  legend: string;
  /** Unique name for the radio inputs. */
  name: string;
  options: ReadonlyArray<{ value: T; label: string }>;
  value: T;
  onChange: (value: T) => void;
  /** Hide the legend visually (it is still read out). */
  quietLegend?: boolean;
}

/** A row of large radio buttons: one choice among a few, all visible at once. */
export function ChoiceGroup<T extends string>({
  legend,
  name,
  options,
  value,
  onChange,
  quietLegend,
}: Props<T>) {
  return (
    <fieldset class={style.group}>
      <legend class={quietLegend ? style.quiet : style.legend}>{legend}</legend>
      <div class={style.options}>
        {options.map((o) => (
          <label key={o.value} class={style.option}>
            <input
              type="radio"
              name={name}
              value={o.value}
              checked={o.value === value}
              onChange={() => onChange(o.value)}
              class={style.radio}
            />
            <span class={style.face}>{o.label}</span>
          </label>
        ))}
      </div>
    </fieldset>
  );
}
