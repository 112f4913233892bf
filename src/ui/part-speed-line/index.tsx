import type { PartSpec } from '../../state/model';
import { formatNumber } from '../../words/format';
import { originLine } from '../../words/origin';
import style from './style.module.css';

interface Props {
  id: string;
  part: PartSpec;
  /** A sentence to add, e.g. the 1× frequency. */
  extra?: string;
}

/**
 * A part's speed as a tool reads it, with where it came from. Tools other than the part's own
 * form show it here and never change it: a speed is edited where the part is (Check, Whole
 * machine), or applied from a tool with its own button.
 */
export function PartSpeedLine({ id, part, extra }: Props) {
  return (
    <div class={style.line} data-testid={id}>
      <p class={style.speed}>
        Shaft speed <strong>{formatNumber(part.speedRpm)} rpm</strong>
        {extra ? ` · ${extra}` : ''}
      </p>
      <p class={style.note}>
        {part.origin ? `${originLine(part.origin)} ` : ''}
        Read from the part; change it in the part's own form on the Check or Whole machine screen.
      </p>
    </div>
  );
}
