import {
  converterRangeDb,
  rcCutoffHz as rcCutoffOf,
  csvTable,
  type CsvColumn,
  type LoggerComponent,
  type LoggerPlan,
} from '../../core';
import { readSpeedRpm } from '../../ui/fields';
import { formatNumber, formatPrecise, numberForField } from '../../words/format';
import {
  readBits,
  readBladeCount,
  readCapacitanceF,
  readCutoffHz,
  readFilterOrder,
  readHarmonics,
  readList,
  readResistanceOhm,
  readSampleRateHz,
  readTeeth,
  readToneHz,
} from '../../ui/toolFields';
import {
  applyProposal,
  bladeCounts,
  bladesFor,
  capacitanceF,
  converterBits,
  extraTonesHz,
  filterCutoffHz,
  filterKind,
  filterOrder,
  gearTeeth,
  harmonics,
  loggerPlanning,
  rcCutoffHz,
  rcGiven,
  resistanceOhm,
  sampleHz,
  type FilterKind,
} from '../../state/loggerPlanning';
import { openMachineName } from '../../state/openMachine';
import { activePart, setSpeedRpm } from '../../state/setup';
import { ChoiceGroup } from '../../ui/choice-group';
import { NumberField } from '../../ui/number-field';
import { NumberListField } from '../../ui/number-list-field';
import { Panel } from '../../ui/panel';
import { PartChoice } from '../../ui/part-choice';
import { ReportBar } from '../../ui/report-bar';
import { ResultTable, type ResultColumn } from '../../ui/result-table';
import { ToolLayout } from '../../ui/tool-layout';
import { PLANNING_AID_CAUTION } from '../../words/cautions';
import {
  ALIAS_AFTER_CONVERTER_NOTE,
  componentLabel,
  componentWords,
  loggerNoteWords,
  proposalWords,
} from '../../words/logger';
import style from './style.module.css';

const FILTERS: ReadonlyArray<{ value: FilterKind; label: string }> = [
  { value: 'none', label: 'None' },
  { value: 'rc', label: 'RC' },
  { value: 'butterworth', label: 'Butterworth' },
];

const MAX_LIST = 12;
const readBlades = (text: string) => readList(text, readBladeCount, 'blade counts', 0, MAX_LIST);
const readGears = (text: string) => readList(text, readTeeth, 'tooth counts', 0, MAX_LIST);
const readTones = (text: string) => readList(text, readToneHz, 'added tones', 0, MAX_LIST);

/** A resistance in ohms for its field: "10000". */
const ohmText = (ohm: number) => numberForField(ohm);
/** A capacitance in farads for its field, in nF: "100". */
const nanofaradText = (f: number) => numberForField(f * 1e9);

/**
 * The data-logger planner: the machine's frequencies, the sample rate, the analog anti-alias
 * filter and the converter's bits; where each component lands after sampling, how much the
 * filter takes off and whether that buries an alias below the converter's noise floor; the plain
 * statement that filtering after the converter cannot remove an alias; and a sample rate and
 * filter that would work, with a button to take them.
 */
export function LoggerScreen() {
  const plan = loggerPlanning.result.value;
  const problem = loggerPlanning.problem.value;
  const part = activePart.value;
  const kind = filterKind.value;
  // The alias statement has a box of its own and the guard a line of its own (see below).
  const otherNotes = plan
    ? plan.notes.filter((n) => n !== 'alias-after-converter' && n !== 'guard-short')
    : [];
  const failing = plan ? plan.components.filter((c) => !c.pass) : [];

  const summary = (
    <Panel title="Data logger" id="logger-answer">
      {plan ? (
        <div class={style.answer} data-pass={plan.allPass ? 'yes' : 'no'}>
          <p class={style.headline} data-testid="logger-headline">
            {plan.allPass
              ? 'The record is clean'
              : failing.length > 0
                ? 'False tones will reach the record'
                : 'Aliases can reach the record'}
          </p>
          <p data-testid="logger-facts">
            Sampling at {formatPrecise(sampleHzOf(plan))} Hz records up to{' '}
            {formatPrecise(plan.nyquistHz)} Hz (half the sample rate). The converter resolves{' '}
            {formatNumber(plan.rangeDb)} dB (6.02 × bits + 1.76): an alias must be cut at least that
            much.
          </p>
        </div>
      ) : (
        <p class={style.plain}>Nothing to show yet: {problem}</p>
      )}
    </Panel>
  );

  const warnings = (
    <>
      <p class={style.statement} data-testid="alias-note">
        {ALIAS_AFTER_CONVERTER_NOTE}
      </p>
    </>
  );

  const entries = (
    <>
      <Panel title="The machine" id="logger-machine">
        <PartChoice id="logger-part" label="Shaft of" />
        <NumberField
          id="logger-shaft"
          label="Shaft speed"
          value={part.speedRpm}
          toText={numberForField}
          read={(text) => readSpeedRpm(text, 'rpm')}
          onValue={setSpeedRpm}
          unit="rpm"
          hint={`${formatNumber(Math.abs(part.speedRpm) / 60)} Hz: the 1× frequency. The same speed as the chosen part.`}
        />
        <NumberField
          id="logger-harmonics"
          label="Shaft harmonics"
          value={harmonics.value}
          toText={numberForField}
          read={readHarmonics}
          onValue={(n) => (harmonics.value = n)}
          unit="×"
          hint="1× up to this multiple of the shaft speed."
        />
        <NumberListField
          id="logger-blades"
          label="Blade counts"
          values={bladesFor(part, bladeCounts.value)}
          toText={numberForField}
          read={readBlades}
          onValues={(v) => (bladeCounts.value = v)}
          hint="Blade pass = blades × shaft speed. Starts with the part's own count."
        />
        <NumberListField
          id="logger-teeth"
          label="Gear teeth"
          values={gearTeeth.value}
          toText={numberForField}
          read={readGears}
          onValues={(v) => (gearTeeth.value = v)}
          hint="Gear mesh = teeth × shaft speed, for gears on this shaft."
        />
        <NumberListField
          id="logger-tones"
          label="Other tones"
          values={extraTonesHz.value}
          toText={numberForField}
          read={readTones}
          onValues={(v) => (extraTonesHz.value = v)}
          unit="Hz"
          hint="Bearing tones, mains hum, anything else in the signal. Separate with spaces."
        />
      </Panel>
      <Panel title="Sampling" id="logger-sampling">
        <NumberField
          id="logger-rate"
          label="Sample rate"
          value={sampleHz.value}
          toText={numberForField}
          read={readSampleRateHz}
          onValue={(v) => (sampleHz.value = v)}
          unit="Hz"
          hint="Samples per second; 2 kHz works too."
        />
        <NumberField
          id="logger-bits"
          label="Converter bits"
          value={converterBits.value}
          toText={numberForField}
          read={readBits}
          onValue={(v) => (converterBits.value = v)}
          unit="bits"
          hint={`${formatNumber(converterRangeDb(converterBits.value))} dB of range.`}
        />
      </Panel>
      <Panel title="Anti-alias filter" id="logger-filter">
        <p class={style.note}>The analog low-pass between the sensor and the converter.</p>
        <ChoiceGroup
          legend="Filter"
          quietLegend
          name="logger-filter-kind"
          options={FILTERS}
          value={kind}
          onChange={(k) => (filterKind.value = k)}
        />
        {kind === 'rc' && <RcFields />}
        {kind === 'butterworth' && (
          <div class={style.pair}>
            <NumberField
              id="logger-order"
              label="Order"
              value={filterOrder.value}
              toText={numberForField}
              read={readFilterOrder}
              onValue={(v) => (filterOrder.value = v)}
              hint="Poles: 20 dB per decade each."
            />
            <NumberField
              id="logger-cutoff"
              label="Cutoff"
              value={filterCutoffHz.value}
              toText={numberForField}
              read={readCutoffHz}
              onValue={(v) => (filterCutoffHz.value = v)}
              unit="Hz"
              hint="−3 dB point."
            />
          </div>
        )}
      </Panel>
    </>
  );

  const results = (
    <>
      <Panel title="Where each component lands" id="logger-components">
        {plan && (
          <>
            <ResultTable
              caption={`Sampled at ${formatPrecise(sampleHzOf(plan))} Hz; anything at or above ${formatPrecise(plan.nyquistHz)} Hz folds`}
              columns={COLUMNS}
              rows={plan.components}
              rowKey={(c, i) => `${i}-${c.source}-${c.count}`}
              rowState={(c) => (c.pass ? undefined : 'fail')}
              testId="logger-table"
            />
            <p
              class={style.guard}
              data-pass={plan.guard.enough ? 'yes' : 'no'}
              data-testid="logger-guard"
            >
              Anything in the signal at {formatPrecise(plan.guard.hz)} Hz or above folds onto the
              band of these components; the filter takes off{' '}
              {formatNumber(plan.guard.attenuationDb)} dB there of the {formatNumber(plan.rangeDb)}{' '}
              dB needed: <strong>{plan.guard.enough ? 'enough' : 'not enough'}</strong>.
            </p>
            {otherNotes.length > 0 && (
              <ul class={style.notes} data-testid="logger-notes">
                {otherNotes.map((n) => (
                  <li key={n}>{loggerNoteWords(n, plan)}</li>
                ))}
              </ul>
            )}
          </>
        )}
      </Panel>
      <Panel title="A set-up that works" id="logger-proposal">
        {plan?.proposal ? (
          <>
            <p class={style.plain} data-testid="logger-proposal-text">
              {proposalWords(plan)}
            </p>
            <div>
              <button
                type="button"
                class={style.apply}
                onClick={() => plan.proposal && applyProposal(plan.proposal)}
              >
                Use this sample rate and filter
              </button>
            </div>
          </>
        ) : (
          <p class={style.plain}>
            {plan
              ? 'No proposal within the limits: see the notes above.'
              : 'Nothing to propose yet.'}
          </p>
        )}
      </Panel>
      <p class={style.note}>{PLANNING_AID_CAUTION}</p>
    </>
  );

  const report = (
    <ReportBar
      title="Data logger plan"
      machineName={openMachineName.value}
      cautions={{}}
      csv={plan ? () => loggerCsv(plan, sampleHzOf(plan)) : undefined}
    />
  );

  return (
    <ToolLayout
      testId="logger-screen"
      summary={summary}
      warnings={warnings}
      entries={entries}
      results={results}
      report={report}
      withdraw={{ refusal: problem }}
    />
  );
}

/** The plan's own sample rate (twice its Nyquist frequency), so a refused entry never mixes with a kept plan. */
function sampleHzOf(plan: LoggerPlan): number {
  return plan.nyquistHz * 2;
}

function RcFields() {
  return (
    <>
      <ChoiceGroup
        legend="RC given as"
        name="logger-rc-given"
        options={[
          { value: 'cutoff', label: 'Its cutoff' },
          { value: 'parts', label: 'R and C' },
        ]}
        value={rcGiven.value}
        onChange={(v) => (rcGiven.value = v)}
      />
      {rcGiven.value === 'cutoff' ? (
        <NumberField
          id="logger-rc-cutoff"
          label="Cutoff"
          value={rcCutoffHz.value}
          toText={numberForField}
          read={readCutoffHz}
          onValue={(v) => (rcCutoffHz.value = v)}
          unit="Hz"
          hint="−3 dB point of the single RC stage."
        />
      ) : (
        <div class={style.pair}>
          <NumberField
            id="logger-r"
            label="Resistance"
            value={resistanceOhm.value}
            toText={ohmText}
            read={readResistanceOhm}
            onValue={(v) => (resistanceOhm.value = v)}
            unit="Ω"
            hint="10k works."
          />
          <NumberField
            id="logger-c"
            label="Capacitance"
            value={capacitanceF.value}
            toText={nanofaradText}
            read={readCapacitanceF}
            onValue={(v) => (capacitanceF.value = v)}
            unit="nF"
            hint="4.7 µF works."
          />
        </div>
      )}
      {rcGiven.value === 'parts' && (
        <p class={style.note} data-testid="logger-rc-result">
          Cutoff 1/(2πRC) = {formatNumber(rcCutoffOf(resistanceOhm.value, capacitanceF.value))} Hz.
        </p>
      )}
    </>
  );
}

const COLUMNS: ReadonlyArray<ResultColumn<LoggerComponent>> = [
  { label: 'Component', cell: (c) => componentLabel(c) },
  { label: 'Frequency', numeric: true, cell: (c) => `${formatPrecise(c.hz)} Hz` },
  { label: 'Lands at', numeric: true, cell: (c) => `${formatPrecise(c.foldedHz)} Hz` },
  { label: 'Aliased', cell: (c) => (c.aliases ? 'Yes: a false tone' : 'No') },
  { label: 'Filter takes off', numeric: true, cell: (c) => `${formatNumber(-c.gainDb)} dB` },
  {
    label: 'Needed',
    numeric: true,
    cell: (c) => (c.aliases ? `${formatNumber(c.neededDb)} dB` : 'at most 3 dB loss'),
  },
  {
    label: 'Result',
    cell: (c) => (
      <strong class={c.pass ? style.pass : style.fail} data-testid="component-result">
        {c.pass ? 'Pass' : 'Fail'}
      </strong>
    ),
  },
];

/** The components as CSV, with the sample rate and converter range on every row. */
export function loggerCsv(plan: LoggerPlan, sampleRateHz: number): string {
  const columns: CsvColumn<LoggerComponent>[] = [
    { label: 'component', value: (c) => componentLabel(c) },
    { label: 'frequency (Hz)', value: (c) => c.hz },
    { label: 'sample rate (Hz)', value: () => sampleRateHz },
    { label: 'lands at (Hz)', value: (c) => c.foldedHz },
    { label: 'aliased', value: (c) => c.aliases },
    { label: 'filter gain (dB)', value: (c) => c.gainDb },
    { label: 'attenuation needed (dB)', value: (c) => c.neededDb },
    { label: 'converter range (dB)', value: () => plan.rangeDb },
    { label: 'pass', value: (c) => c.pass },
    { label: 'in words', value: (c) => componentWords(c, plan) },
  ];
  return csvTable(columns, plan.components);
}
