// The speed finder's table as CSV (RFC 4180 via the core): the candidates, then the readings.
import { csvTable, type SoundSpeedCandidate, type StepCandidate } from '../../core';
import { preciseNumber, shownNumber } from '../../words/format';
import {
  toleranceFromPrecision,
  type FinderPartKind,
  type RecordedReading,
} from '../../state/speedFinder';
import { viewWords } from '../../words/look';
import { CONFIDENCE_WORDS, heardAsWords, speedFigures } from '../../words/sound';
import { candidateNote, candidateStatus } from '../../words/speedFinder';

/**
 * The candidates and the readings behind them as CSV (RFC 4180 via the core's csvTable): one row
 * per candidate speed, then the readings, then the speeds heard by sound, so the file stands
 * alone (the sound itself is never kept).
 * @example finderCsv([], [], undefined) // 'speed (rpm),status,why,at next rate\r\n'
 */
export function finderCsv(
  candidates: readonly StepCandidate[],
  readings: readonly RecordedReading[],
  nextRateFpm: number | undefined,
  sound?: { candidates: readonly SoundSpeedCandidate[]; kind: FinderPartKind },
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
  const heard = sound && sound.candidates.length > 0 ? soundCsv(sound.candidates, sound.kind) : '';
  if (readings.length === 0) return heard ? `${table}\r\n${heard}` : table;
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
  // A blank line between the tables, as a spreadsheet shows it.
  return [table, recorded, ...(heard ? [heard] : [])].join('\r\n');
}

/** The speeds heard, best first. */
function soundCsv(candidates: readonly SoundSpeedCandidate[], kind: FinderPartKind): string {
  return csvTable(
    [
      { label: 'heard speed (rpm)', value: (c: SoundSpeedCandidate) => round2(c.speedHz * 60) },
      // As on screen: rounded up to two significant figures, never tighter than measured.
      {
        label: 'precision (± rpm)',
        value: (c: SoundSpeedCandidate) => Number(speedFigures(c).plusMinus.replace(/,/g, '')),
      },
      {
        label: 'precision (± %)',
        value: (c: SoundSpeedCandidate) => toleranceFromPrecision(c.speedHz, c.precisionHz),
      },
      {
        label: 'how sure',
        value: (c: SoundSpeedCandidate) => CONFIDENCE_WORDS[c.confidence].label,
      },
      { label: 'heard as', value: (c: SoundSpeedCandidate) => heardAsWords(c, kind) },
    ],
    [...candidates],
  );
}

const round2 = (x: number) => Math.round(x * 100) / 100;
