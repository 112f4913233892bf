// Words and tables of the speed finder that need no screen: the stage headings, the image
// choices, and the candidate table as CSV.
import { csvTable, type SpeedFinderStage, type StepCandidate } from '../core';
import type { RecordedReading } from '../state/speedFinder';

/** The heading over the instruction, per stage of the procedure. */
export const STAGE_TITLES: Record<SpeedFinderStage, string> = {
  start: 'Start high',
  'come-down': 'Keep coming down',
  confirm: 'Confirm at the double image',
  separate: 'Tell the speeds apart',
  done: 'Speed found',
  conflict: 'The readings disagree',
};

/** "1 image", "2 images", … in words, for the table and the report. */
export function imagesLabel(images: number): string {
  return images === 1 ? '1 image' : `${images} images`;
}

/** What the table says about a candidate's place: likeliest, in the expected range, ruled out. */
export function candidateStatus(c: StepCandidate): string {
  if (c.likeliest) return c.expected ? 'Likeliest (in the expected range)' : 'Likeliest';
  if (c.ruledOut) return 'Ruled out';
  return c.expected ? 'Fits, in the expected range' : 'Fits';
}

/**
 * The table's caption, in step with its rows: how many speeds are still in the running, and how
 * many fit the readings but the sweep rules out.
 * @example candidateCaption([]) // '0 speeds fit every reading; likeliest first'
 */
export function candidateCaption(candidates: readonly StepCandidate[]): string {
  const ruledOut = candidates.filter((c) => c.ruledOut).length;
  const left = candidates.length - ruledOut;
  const speeds = (n: number) => `${n} ${n === 1 ? 'speed' : 'speeds'}`;
  if (ruledOut === 0) {
    return `${speeds(left)} ${left === 1 ? 'fits' : 'fit'} every reading; likeliest first`;
  }
  return (
    `${speeds(left)} ${left === 1 ? 'fits' : 'fit'} the readings and the sweep; ` +
    `${ruledOut} more ${ruledOut === 1 ? 'fits' : 'fit'} the readings but ${ruledOut === 1 ? 'is' : 'are'} ruled out; likeliest first`
  );
}

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
      { label: 'speed (rpm)', value: (c: StepCandidate) => c.rpm },
      { label: 'status', value: (c: StepCandidate) => candidateStatus(c) },
      { label: 'why', value: (c: StepCandidate) => c.note },
      { label: at, value: (c: StepCandidate) => c.atNextRate?.text ?? '' },
    ],
    [...candidates],
  );
  if (readings.length === 0) return table;
  const recorded = csvTable(
    [
      { label: 'reading', value: (r: RecordedReading & { n: number }) => r.n },
      { label: 'rate (flashes/min)', value: (r: RecordedReading & { n: number }) => r.rateFpm },
      { label: 'images standing still', value: (r: RecordedReading & { n: number }) => r.images },
    ],
    readings.map((r, i) => ({ ...r, n: i + 1 })),
  );
  // A blank line between the two tables, as a spreadsheet shows it.
  return `${table}\r\n${recorded}`;
}
