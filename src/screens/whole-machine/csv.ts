// The whole-machine tables as one CSV file: the parts with their speed bands, the freeze bands
// of the chosen part, and the bands where no part looks still (RFC 4180 via the core).
import { csvTable } from '../../core';
import { preciseNumber, shownNumber } from '../../words/format';
import { rateNumber, rateUnit, type FlashUnit } from '../../words/rates';
import type { DerivedPart } from '../../state/driveChain';
import { SOURCE_WORDS } from '../../words/wholeMachine';
import type { WholeMachineRates } from '../../state/wholeMachine';
import type { SamplerKind } from '../../state/model';

/**
 * Three tables, one after another with a blank line between: parts, freeze bands, no-still bands.
 * Rates are in the sampler's unit (frames/s, flashes/min or Hz), speeds in rpm.
 */
export function wholeMachineCsv(
  parts: readonly DerivedPart[],
  rates: WholeMachineRates | undefined,
  kind: SamplerKind,
  flashUnit: FlashUnit,
): string {
  const unit = rateUnit(kind, flashUnit);
  const r = (hz: number) => preciseNumber(rateNumber(hz, kind, flashUnit));
  const partTable = csvTable(
    [
      { label: 'part', value: (p: DerivedPart) => p.name },
      { label: 'blades or marks', value: (p: DerivedPart) => p.symmetry },
      { label: 'speed from', value: (p: DerivedPart) => SOURCE_WORDS[p.source] },
      { label: 'speed (rpm)', value: (p: DerivedPart) => tidy(p.speedHz * 60) },
      { label: 'tolerance (± %)', value: (p: DerivedPart) => tidy(p.tolerance * 100) },
      { label: 'lowest (rpm)', value: (p: DerivedPart) => tidy(p.lowHz * 60) },
      { label: 'highest (rpm)', value: (p: DerivedPart) => tidy(p.highHz * 60) },
    ],
    [...parts],
  );
  if (!rates) return partTable;
  const target = parts[rates.target]?.name ?? `part ${rates.target + 1}`;
  const freezeTable = csvTable(
    [
      {
        label: `freezes ${target}: from (${unit})`,
        value: (b: WholeMachineRates['freeze'][number]) => r(b.fromHz),
      },
      { label: `to (${unit})`, value: (b: WholeMachineRates['freeze'][number]) => r(b.toHz) },
      {
        label: `single image at nominal speed (${unit})`,
        value: (b: WholeMachineRates['freeze'][number]) => (b.p === 0 ? '' : r(b.lockRateHz)),
      },
      {
        label: 'turns between flashes (pitches)',
        value: (b: WholeMachineRates['freeze'][number]) => b.p,
      },
      {
        label: 'exact rate depends on actual speed',
        value: (b: WholeMachineRates['freeze'][number]) => (b.dense ? 'yes' : 'no'),
      },
    ],
    rates.freeze,
  );
  const noStillTable = csvTable(
    [
      { label: `no part still: from (${unit})`, value: (b: { fromHz: number }) => r(b.fromHz) },
      { label: `to (${unit})`, value: (b: { toHz: number }) => r(b.toHz) },
    ],
    rates.noStill,
  );
  return `${partTable}\r\n${freezeTable}\r\n${noStillTable}`;
}

/** A speed or tolerance as rounded on screen (formatNumber), never 2000.0000000000002. */
function tidy(value: number): number | null {
  return shownNumber(value);
}
