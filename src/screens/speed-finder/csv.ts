// The speed finder's table as CSV (RFC 4180 via the core): the candidates, then the readings.
import { csvTable, type StepCandidate } from '../../core';
import { preciseNumber, shownNumber } from '../../words/format';
import type { RecordedReading } from '../../state/speedFinder';
import { viewWords } from '../../words/look';
import { candidateNote, candidateStatus } from '../../words/speedFinder';

/**
 * The candidates and the readings behind them as CSV (RFC 4180 via the core's csvTable): one row
 * per candidate speed, then the readings, so the file stands alone.
 * @example finderCsv([], [], undefined) // 'speed (rpm),status,why,at next rate\r\n'
 */
export function finderCsv(
  candidates: readonly StepCandidate[],
  readings: readonly RecordedReading[],
  nextRateFpm: number | undefined,
): string {
  const at =
    nextRateFpm === undefined
      ? 'at next rate'
      : `at ${Math.round(nextRateFpm * 100) / 100} flashes/min`;
  const table = csvTable(
    [
      { label: 'speed (rpm)', value: (c: StepCandidate) => shownNumber(c.rpm) },
      { label: 'status', value: (c: StepCandidate) => candidateStatus(c) },
      { label: 'why', value: (c: StepCandidate) => candidateNote(c) },
      {
        label: at,
        value: (c: StepCandidate) => (c.atNextRate ? viewWords(c.atNextRate) : ''),
      },
    ],
    [...candidates],
  );
  if (readings.length === 0) return table;
  const recorded = csvTable(
    [
      { label: 'reading', value: (r: RecordedReading & { n: number }) => r.n },
      {
        label: 'rate (flashes/min)',
        value: (r: RecordedReading & { n: number }) => preciseNumber(r.rateFpm),
      },
      { label: 'images standing still', value: (r: RecordedReading & { n: number }) => r.images },
    ],
    readings.map((r, i) => ({ ...r, n: i + 1 })),
  );
  // A blank line between the two tables, as a spreadsheet shows it.
  return `${table}\r\n${recorded}`;
}
