import { useEffect, useState } from 'preact/hooks';
import type { CautionContext } from '../../core';
import { header } from '../../state/work';
import { PLANNING_AID_CAUTION, safetyCautions } from '../../words/cautions';
import { headerLines, printedAt, reportCsv } from '../../words/report';
import { downloadText, fileStem } from '../download';
import { readLive, type Live } from '../live';
import { ReportHeaderFields } from './header-fields';
import style from './style.module.css';

interface Props {
  /** The tool's title, printed at the top of the report and used in file names. */
  title: string;
  /** The tool's main table as CSV (RFC 4180, built with the core's csv helpers); omit when there is none. */
  csv?: () => string;
  /**
   * Which cautions the printed page must carry (docs/physics.md §10); a signal where they change
   * as the entries do (only the printed cautions follow it).
   */
  cautions: Live<CautionContext>;
}

/**
 * "Print report" and "Save table (CSV)" for any screen, and the report header filled once per
 * machine (site, machine, assessed by, date, notes). Printing uses the print stylesheet: the tab
 * bar and inputs are hidden, and this bar's print-only header adds the title, the header lines
 * and the cautions that apply; the CSV starts with the same header and cautions.
 */
export function ReportBar({ title, csv, cautions }: Props) {
  const [problem, setProblem] = useState<string | null>(null);
  // The time on the printout: taken again as the page is about to print.
  const [printed, setPrinted] = useState(() => new Date());
  useEffect(() => {
    const now = () => setPrinted(new Date());
    addEventListener('beforeprint', now);
    return () => removeEventListener('beforeprint', now);
  }, []);
  const h = header.value;
  const save = () => {
    if (!csv) return;
    try {
      const text = reportCsv(title, h, safeCautions(readLive(cautions)), csv(), new Date());
      downloadText(`${fileStem(`${title} ${h.name}`)}.csv`, text, 'text/csv;charset=utf-8');
      setProblem(null);
    } catch (error) {
      setProblem(error instanceof Error ? error.message : String(error));
    }
  };
  return (
    <div class={style.bar}>
      <div class={style.actions} data-print="hide">
        <button type="button" class={style.button} onClick={() => window.print()}>
          Print report
        </button>
        {csv && (
          <button type="button" class={style.button} onClick={save}>
            Save table (CSV)
          </button>
        )}
      </div>
      <ReportHeaderFields />
      {problem && (
        <p class={style.problem} role="alert" data-print="hide">
          {problem}
        </p>
      )}
      <header class={style.printHeader} data-print="only">
        <p class={style.printTitle}>Trueturn · {title}</p>
        <dl class={style.printLines}>
          {headerLines(h, printed).map(([label, value]) => (
            <div key={label}>
              <dt>{label}</dt>
              <dd>{value || '—'}</dd>
            </div>
          ))}
        </dl>
        <p>Printed {printedAt(printed)}</p>
        <PrintedCautions cautions={cautions} />
      </header>
    </div>
  );
}

function PrintedCautions({ cautions }: { cautions: Live<CautionContext> }) {
  return (
    <ul class={style.printCautions}>
      {safeCautions(readLive(cautions)).map((line) => (
        <li key={line}>{line}</li>
      ))}
    </ul>
  );
}

/**
 * Cautions never fail to print: a bad rate in the context still leaves the stillness caution;
 * the planning-aid line is always there.
 */
function safeCautions(context: CautionContext): string[] {
  let lines: string[];
  try {
    lines = safetyCautions(context);
  } catch {
    lines = safetyCautions({ apparentStillness: true });
  }
  return lines.includes(PLANNING_AID_CAUTION) ? lines : [...lines, PLANNING_AID_CAUTION];
}
