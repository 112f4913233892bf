import { useLayoutEffect, useRef, useState } from 'preact/hooks';
import {
  apparentMotion,
  cautionFlags,
  type CautionContext,
  type Part,
  type Range,
} from '../../core';
import { openCheckScreen } from '../../state/navigation';
import { formatRate, formatRateSpan, type FlashUnit } from '../../words/rates';
import {
  chain,
  editChain,
  syncChainSpeeds,
  withDrivenPart,
  type DerivedPart,
} from '../../state/driveChain';
import { wholeMachineRates } from '../../state/wholeMachine';
import { check, verdictOf } from '../../state/check';
import { partLabel, type SamplerKind, activeIndex } from '../../state/model';
import { flashUnit, setSamplerKind, setSamplerRateHz, setup } from '../../state/setup';
import { MAX_PARTS } from '../../state/validate';
import { Cautions } from '../../ui/cautions';
import { ChoiceGroup } from '../../ui/choice-group';
import { Panel } from '../../ui/panel';
import { useAfterPaint } from '../../ui/afterPaint';
import { RateMap } from '../../ui/rate-map';
import { partsKey } from '../../ui/rate-map/chart-data';
import { ReportBar } from '../../ui/report-bar';
import { ResultTable, type ResultColumn } from '../../ui/result-table';
import { ToolLayout } from '../../ui/tool-layout';

import { wholeMachineCsv } from './csv';
import { PartCard } from './part-card';
import { speedWords } from '../../words/wholeMachine';
import { featureWords } from '../../words/partKinds';
import { verdictHeadline } from '../../words/check';
import { BandTables } from './band-tables';
import style from './style.module.css';

interface Props {}

const SAMPLERS: ReadonlyArray<{ value: SamplerKind; label: string }> = [
  { value: 'strobe', label: 'Strobe' },
  { value: 'camera', label: 'Camera' },
  { value: 'lighting', label: 'Lighting' },
];

/**
 * The whole machine: parts linked by drives (motor → belt → fan, gear stages, a wheel from its
 * ground speed), each part's speed carried along the chain with its tolerance; rates that
 * freeze a chosen part while no other looks still, and rates at which no part looks still.
 */
export function WholeMachineScreen(_props: Props) {
  const s = setup.value;
  const parts = chain.result.value ?? [];
  const chainProblem = chain.problem.value;
  const rates = wholeMachineRates.result.value;
  const ratesProblem = wholeMachineRates.problem.value;
  const r = check.value;
  const unit = flashUnit.value;
  const kind = s.samplerKind;
  const target = activeIndex(s);
  const [editProblem, setEditProblem] = useState<string | null>(null);
  const [addFrom, setAddFrom] = useState<number | null>(null);
  const [applied, setApplied] = useState<number | null>(null);
  // A removed part takes its focused remove button with it, and focus would drop to the page
  // body: it moves to the remove button of the part now in its place (or the one before), or
  // to "Add part" when only one part is left (WCAG 2.4.3 Focus Order).
  const cardList = useRef<HTMLOListElement>(null);
  const addButton = useRef<HTMLButtonElement>(null);
  const removedAt = useRef<number | null>(null);
  // Before the paint, so no frame passes with focus on the page body.
  useLayoutEffect(() => {
    const at = removedAt.current;
    if (at === null) return;
    removedAt.current = null;
    const removes = cardList.current?.querySelectorAll<HTMLButtonElement>(
      'button[data-remove-part]',
    );
    const next = removes && removes.length > 0 ? removes[Math.min(at, removes.length - 1)] : null;
    (next ?? addButton.current)?.focus();
  });
  const rate = (hz: number) => formatRate(hz, kind, unit);

  // Tapping a rate sets it on the check screen, whose part then shows the chain's speed too.
  const useRate = (hz: number) => {
    setSamplerRateHz(hz);
    syncChainSpeeds();
    setApplied(hz);
  };
  const pickTarget = (index: number) => editChain((x) => ({ ...x, activePart: index }));
  const driver = addFrom !== null && addFrom < s.parts.length ? addFrom : s.parts.length - 1;
  const addPart = () => {
    try {
      editChain((x) => withDrivenPart(x, driver));
      setEditProblem(null);
    } catch (error) {
      setEditProblem(error instanceof Error ? error.message : String(error));
    }
  };

  // Freeze bands make parts look still; a strobe or flickering light flashes through the range.
  const cautions: CautionContext = {
    apparentStillness: true,
    ...(r.sampler === 'flash' ? { flashSweepHz: r.range } : {}),
  };

  const partColumns: ReadonlyArray<ResultColumn<DerivedPart>> = [
    {
      label: 'Part',
      // One element: on a phone each child of a cell takes a grid cell of its own.
      cell: (p) => (
        <span>
          <strong>{p.name}</strong> (
          {featureWords({ kind: setup.value.parts[p.index]?.kind, features: p.symmetry })})
          {p.index === target && <span class={style.tag}> · to freeze</span>}
        </span>
      ),
    },
    { label: 'Speed', cell: (p) => speedWords(p) },
    { label: `At ${rate(r.rateHz)}`, cell: (p) => lookAt(p, r.rateHz, r.sampler) },
  ];

  const summary = (
    <Panel title="Speeds of the machine" id="chain-speeds">
      <ResultTable
        caption={`${parts.length} ${parts.length === 1 ? 'part' : 'parts'}, each speed carried along its drives with its tolerance`}
        columns={partColumns}
        rows={parts}
        rowKey={(p) => String(p.index)}
        testId="chain-speed-table"
      />
    </Panel>
  );

  const warnings = (
    <>
      <Cautions show={cautionFlags(cautions)} />
      {editProblem && (
        <p class={style.problem} role="alert" data-testid="chain-problem">
          {editProblem} Nothing was changed.
        </p>
      )}
    </>
  );

  const entries = (
    <Panel title="Parts and drives" id="chain-parts">
      <ol class={style.cards} ref={cardList}>
        {s.parts.map((_, i) => (
          <PartCard
            key={i}
            setup={s}
            index={i}
            derived={parts[i]?.index === i ? parts[i] : undefined}
            onProblem={setEditProblem}
            onRemoved={(at) => (removedAt.current = at)}
          />
        ))}
      </ol>
      <div class={style.addRow} data-print="hide">
        <label class={style.label} for="chain-add-from">
          Add a part driven by
        </label>
        <div class={style.inputRow}>
          <select
            id="chain-add-from"
            class={style.select}
            value={String(driver)}
            onChange={(e) => setAddFrom(Number((e.currentTarget as HTMLSelectElement).value))}
          >
            {s.parts.map((_, i) => (
              <option key={i} value={String(i)}>
                {i + 1}. {partLabel(s, i)}
              </option>
            ))}
          </select>
          <button
            type="button"
            class={style.primary}
            ref={addButton}
            onClick={addPart}
            disabled={s.parts.length >= MAX_PARTS}
          >
            Add part
          </button>
        </div>
      </div>
    </Panel>
  );

  const results = (
    <>
      <Panel title="Rates for the whole machine" id="chain-rates">
        <div class={style.nameField}>
          <label class={style.label} for="chain-target">
            Part to freeze
          </label>
          <select
            id="chain-target"
            class={style.select}
            value={String(target)}
            onChange={(e) => pickTarget(Number((e.currentTarget as HTMLSelectElement).value))}
          >
            {s.parts.map((_, i) => (
              <option key={i} value={String(i)}>
                {i + 1}. {partLabel(s, i)}
              </option>
            ))}
          </select>
        </div>
        <ChoiceGroup
          legend="Seen by"
          name="chain-sampler"
          options={SAMPLERS}
          value={kind}
          onChange={setSamplerKind}
        />
        <p class={style.quiet}>
          Over {formatRateSpan(r.range.minHz, r.range.maxHz, kind, unit)}; the Check screen's rate
          is {rate(r.rateHz)}. Tap a rate to use it there.
        </p>
        {rates && rates.listed?.minHz !== rates.range.minHz && (
          <p class={style.problem} data-testid="listed-note">
            {rates.listed
              ? `Bands are listed from ${rate(rates.listed.minHz)} up: below it these parts stand still at too many rates to list.`
              : 'These parts stand still at too many rates in this range to list them: choose a faster sampler range.'}
          </p>
        )}
        {applied !== null && (
          <p class={style.applied} role="status" data-testid="chain-applied">
            The Check screen now uses {rate(applied)}.{' '}
            <button type="button" class={style.link} onClick={() => openCheckScreen()}>
              Open the Check screen
            </button>
          </p>
        )}
        <BandTables onUse={useRate} />
        <p class={style.quiet}>
          Parts may still look slow or backward in these bands: the Check screen and the rate map
          show how each looks.
        </p>
      </Panel>
      <Panel title="Rate map" id="chain-map">
        <LaterRateMap
          parts={parts}
          range={r.range}
          rateHz={r.rateHz}
          onRateChange={useRate}
          samplerKind={kind}
          flashUnit={unit}
        />
      </Panel>
      <ReportBar
        title="Whole machine"
        cautions={cautions}
        csv={() => wholeMachineCsv(parts, rates, kind, unit)}
      />
    </>
  );

  return (
    <ToolLayout
      testId="whole-machine-screen"
      summary={summary}
      announce={`Speeds of the machine: ${parts.map((p) => `${p.name}, ${speedWords(p)}`).join('; ')}.`}
      warnings={warnings}
      entries={entries}
      results={results}
      withdraw={{ refusal: chainProblem ?? ratesProblem }}
    />
  );
}

/** How the part looks at the rate, in the check screen's words. */
function lookAt(p: DerivedPart, rateHz: number, sampler: 'flash' | 'frames'): string {
  const part = { speedHz: p.speedHz, symmetry: p.symmetry, tolerance: p.tolerance };
  return verdictHeadline(verdictOf(apparentMotion(part, rateHz, { sampler }), part));
}

/**
 * The rate map of the chain's parts, drawn a paint after a keystroke changes them: the key
 * paints first, and the map's series and drawing follow in a task of their own.
 */
function LaterRateMap(props: {
  parts: ReadonlyArray<Part & { name: string }>;
  range: Range;
  rateHz: number;
  onRateChange: (rateHz: number) => void;
  samplerKind: SamplerKind;
  flashUnit: FlashUnit;
}) {
  const now = {
    parts: props.parts.map((p) => ({
      name: p.name,
      speedHz: p.speedHz,
      symmetry: p.symmetry,
      tolerance: p.tolerance,
    })),
    range: props.range,
    samplerKind: props.samplerKind,
  };
  const later = useAfterPaint(
    now,
    `${partsKey(now.parts)}|${now.range.minHz}|${now.range.maxHz}|${now.samplerKind}`,
  );
  return (
    <RateMap
      {...later}
      rateHz={props.rateHz}
      onRateChange={props.onRateChange}
      flashUnit={props.flashUnit}
      showCautions={false}
    />
  );
}
