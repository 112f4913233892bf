// The text readers on 100,000 hostile characters: each must answer within 5 ms (issue 11). The
// readers behind a field see at most 64 characters (1,000 for a list); these run them on the raw
// text to show that no reader backtracks, whatever reaches it.
import { parseNumber, parseQuantity, tyreDiameterM } from '../../src/core';
import { readExposureSeconds, readFeatures } from '../../src/ui/fields';
import { readList, readResistanceOhm } from '../../src/ui/toolFields';
import { decodeShareFragment } from '../../src/state/shareLink';
import { medianMs, type BenchResult } from './measure';

const N = 100_000;
const spacesThenLetter = ' '.repeat(N - 1) + 'x';
const digitSpacesLetter = '1' + ' '.repeat(N - 2) + 'x';
const digitsThenLetter = '1'.repeat(N - 1) + 'x';
const oneE = '1e'.repeat(N / 2);
const digitsAndSpaces = '1 '.repeat(N / 2);
const numberThenWords = '1' + ' k'.repeat(N / 2 - 1) + ' ';

/** Runs `read` and returns 1 when it refused the text, 0 when it read it. */
function refuses(read: () => unknown): number {
  try {
    read();
    return 0;
  } catch {
    return 1;
  }
}

export function runParseBench(): BenchResult[] {
  const cases: Array<[string, () => unknown]> = [
    [
      'parseQuantity (time), 100,000 spaces then a letter',
      () => parseQuantity(spacesThenLetter, 'time', 's'),
    ],
    ['parseNumber, 100,000 digits then a letter', () => parseNumber(digitsThenLetter)],
    ['parseNumber, "1e" repeated to 100,000 characters', () => parseNumber(oneE)],
    [
      'readExposureSeconds, 100,000 spaces then a letter',
      () => readExposureSeconds(spacesThenLetter),
    ],
    ['readFeatures, a digit, 100,000 spaces, a letter', () => readFeatures(digitSpacesLetter)],
    [
      'readResistanceOhm, a digit, 100,000 spaces, a letter',
      () => readResistanceOhm(digitSpacesLetter),
    ],
    [
      'readList (frame rates), "1 " repeated to 100,000 characters',
      () => readList(digitsAndSpaces, parseNumber, 'frame rates', 0, 12),
    ],
    [
      'readList (frame rates), a number then 50,000 one-letter words',
      () => readList(numberThenWords, parseNumber, 'frame rates', 0, 12),
    ],
    ['tyreDiameterM, a digit, 100,000 spaces, a letter', () => tyreDiameterM(digitSpacesLetter)],
    ['decodeShareFragment, a 1 MB link', () => decodeShareFragment('#s=1.' + 'A'.repeat(1 << 20))],
  ];
  return cases.map(([name, read]) => ({
    name,
    medianMs: medianMs(() => refuses(read), { samples: 11, warmup: 3 }),
    budgetMs: 5,
  }));
}
