// The whole machine's rate tables: freeze the chosen part with no other still, and no part still.

import { type FreezeBand } from '../../core';

import { formatRate, formatRateSpan, settingStepWords } from '../../words/rates';
import { wholeMachineRates } from '../../state/wholeMachine';
import { check } from '../../state/check';
import { partLabel, activeIndex } from '../../state/model';

import { flashUnit, setup } from '../../state/setup';

import { ResultTable, type ResultColumn } from '../../ui/result-table';

import {
  freezeBandsShown,
  freezeRateToSet,
  middleHz,
  noStillBandsShown,
  type RateSpan,
} from './band-lists';

import { bandCaption, freezeWords } from '../../words/wholeMachine';

import style from './style.module.css';

/** Bands listed per table; the CSV holds them all. */
const SHOWN_BANDS = 6;

interface TablesProps {
  /** Sets a rate on the check screen (a tap on a band's button). */
  onUse: (rateHz: number) => void;
}

/**
 * The two tables of the whole machine: bands that freeze the chosen part while no other part
 * looks still, and bands where no part looks still, each with a button that uses a rate.
 */
export function BandTables({ onUse }: TablesProps) {
  const s = setup.value;
  const rates = wholeMachineRates.result.value;
  const r = check.value;
  const unit = flashUnit.value;
  const kind = s.samplerKind;
  const target = activeIndex(s);
  const rate = (hz: number) => formatRate(hz, kind, unit);
  const span = (b: RateSpan) => formatRateSpan(b.fromHz, b.toHz, kind, unit);
  const useRate = onUse;
  const freezeShown = rates ? freezeBandsShown(rates.freeze, SHOWN_BANDS) : [];
  const noStillShown = rates ? noStillBandsShown(rates.noStill, SHOWN_BANDS) : [];
  const freezeColumns: ReadonlyArray<ResultColumn<FreezeBand>> = [
    { label: 'Rates', cell: (b) => span(b) },
    {
      label: 'Single image',
      cell: (b) => freezeWords(b, r.sampler === 'flash' ? 'flashes' : 'frames'),
    },
    {
      label: 'Use',
      cell: (b) => (
        <RateButton hz={freezeRateToSet(b)} label={rate(freezeRateToSet(b))} onUse={useRate} />
      ),
    },
  ];
  const noStillColumns: ReadonlyArray<ResultColumn<RateSpan>> = [
    { label: 'Rates', cell: (b) => span(b) },
    {
      label: 'Use',
      cell: (b) => <RateButton hz={middleHz(b)} label={rate(middleHz(b))} onUse={useRate} />,
    },
  ];

  return (
    <>
      <h3 class={style.subtitle}>Freeze {partLabel(s, target)}, no other part still</h3>
      {freezeShown.length === 0 ? (
        <p class={style.quiet} data-testid="no-freeze">
          {rates
            ? `No band in the range listed freezes ${partLabel(s, target)} round the lock of its nominal speed, ${settingStepWords(r.sampler)} wide or more, without another part looking still too.`
            : 'Not worked out yet.'}
        </p>
      ) : (
        <ResultTable
          caption={bandCaption(rates?.freeze.length ?? 0, freezeShown.length, 'highest first')}
          columns={freezeColumns}
          rows={freezeShown}
          rowKey={(b) => `${b.fromHz}-${b.toHz}`}
          testId="freeze-table"
        />
      )}
      <h3 class={style.subtitle}>No part looks still</h3>
      {noStillShown.length === 0 ? (
        <p class={style.quiet} data-testid="no-no-still">
          {rates
            ? 'Some part can look still at every rate in the range listed.'
            : 'Not worked out yet.'}
        </p>
      ) : (
        <ResultTable
          caption={bandCaption(
            rates?.noStill.length ?? 0,
            noStillShown.length,
            'widest shown, highest first',
          )}
          columns={noStillColumns}
          rows={noStillShown}
          rowKey={(b) => `${b.fromHz}-${b.toHz}`}
          testId="no-still-table"
        />
      )}
    </>
  );
}

function RateButton({
  hz,
  label,
  onUse,
}: {
  hz: number;
  label: string;
  onUse: (hz: number) => void;
}) {
  return (
    <button type="button" class={style.rateButton} data-print="show" onClick={() => onUse(hz)}>
      {label}
    </button>
  );
}
