import type { CautionContext } from '../../core';
import { safetyCautions } from '../../words/cautions';
import { downloadText, fileStem } from '../download';
import style from './style.module.css';

interface Props {
  /** The tool's title, printed at the top of the report and used in file names. */
  title: string;
  /** The machine the result belongs to, when one is open. */
  machineName?: string;
  /** The tool's main table as CSV (RFC 4180, built with the core's csv helpers); omit when there is none. */
  csv?: () => string;
  /** Which cautions the printed page must carry (docs/physics.md §10). */
  cautions: CautionContext;
}

/**
 * "Print report" and "Save table (CSV)" for any tool. Printing uses the print stylesheet:
 * the tab bar and inputs are hidden, and this bar's print-only header adds the title, machine,
 * date and the cautions that apply, so a printed page never loses them.
 */
export function ReportBar({ title, machineName, csv, cautions }: Props) {
  const printed = new Date();
  const lines = safeCautions(cautions);
  return (
    <div class={style.bar}>
      <div class={style.actions} data-print="hide">
        <button type="button" class={style.button} onClick={() => window.print()}>
          Print report
        </button>
        {csv && (
          <button
            type="button"
            class={style.button}
            onClick={() =>
              downloadText(
                `${fileStem(`${title} ${machineName ?? ''}`)}.csv`,
                csv(),
                'text/csv;charset=utf-8',
              )
            }
          >
            Save table (CSV)
          </button>
        )}
      </div>
      <header class={style.printHeader} data-print="only">
        <p class={style.printTitle}>Trueturn · {title}</p>
        <p>
          {machineName ? `Machine: ${machineName} · ` : ''}
          Printed {printed.toLocaleString()}
        </p>
        <ul class={style.printCautions}>
          {lines.map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
      </header>
    </div>
  );
}

/** Cautions never fail to print: a bad rate in the context still leaves the stillness caution. */
function safeCautions(context: CautionContext): string[] {
  try {
    return safetyCautions(context);
  } catch {
    return safetyCautions({ apparentStillness: true });
  }
}
