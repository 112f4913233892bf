// The check screen as CSV (RFC 4180 via the core): what the viewer sees, then the rates nearby
// that lock the part. Numbers as rounded on screen, units in the headings, words for yes and no.
import { csvTable, type CsvValue } from '../../core';
import type { CheckResult } from '../../state/check/lists';
import type { SamplerKind } from '../../state/model';
import { verdictHeadline } from '../../words/check';
import { preciseNumber, shownNumber } from '../../words/format';
import { imagesWords } from '../../words/look';
import { rateNumber, rateUnit, type FlashUnit } from '../../words/rates';
import { yesNo } from '../../words/report';

const SAMPLER_NAMES: Record<SamplerKind, string> = {
  strobe: 'strobe',
  camera: 'camera',
  lighting: 'lighting flicker',
};

/** What the check shows, one quantity a row, then the suggested rates. */
export function checkCsv(
  r: CheckResult,
  partName: string,
  kind: SamplerKind,
  flashUnit: FlashUnit,
): string {
  const unit = rateUnit(kind, flashUnit);
  const rate = (hz: number) => preciseNumber(rateNumber(hz, kind, flashUnit));
  const facts: Array<[string, CsvValue, string]> = [
    ['part', partName, ''],
    ['true speed', shownNumber(r.part.speedHz * 60), 'rpm'],
    ['identical features', r.part.symmetry, ''],
    ['speed tolerance', shownNumber(r.part.tolerance * 100), '± %'],
    ['looked at with', SAMPLER_NAMES[kind], ''],
    ['rate', rate(r.rateHz), unit],
    ['rate within the sampler range', yesNo(r.rateInRange), ''],
    ['what you will see', verdictHeadline(r.verdict), ''],
    ['apparent speed', shownNumber(r.verdict.apparentRpm), 'rpm'],
  ];
  const summary = csvTable(
    [
      { label: 'quantity', value: (f: (typeof facts)[number]) => f[0] },
      { label: 'value', value: (f: (typeof facts)[number]) => f[1] },
      { label: 'unit', value: (f: (typeof facts)[number]) => f[2] },
    ],
    facts,
  );
  const locks = csvTable(
    [
      {
        label: `rate that locks (${unit})`,
        value: (l: CheckResult['locks'][number]) => rate(l.rateHz),
      },
      { label: 'images', value: (l: CheckResult['locks'][number]) => imagesWords(l.images) },
      {
        label: `lowest within tolerance (${unit})`,
        value: (l: CheckResult['locks'][number]) => rate(l.lowHz),
      },
      {
        label: `highest within tolerance (${unit})`,
        value: (l: CheckResult['locks'][number]) => rate(l.highHz),
      },
      { label: 'side of the current rate', value: (l: CheckResult['locks'][number]) => l.side },
    ],
    r.locks,
  );
  return `${summary}\r\n${locks}`;
}
