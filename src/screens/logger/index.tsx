import { converterRangeDb, type LoggerPlan } from '../../core';
import { formatNumber, formatPrecise, numberForField } from '../../words/format';
import {
  readBits,
  readBladeCount,
  readCutoffHz,
  readFilterOrder,
  readHarmonics,
  readList,
  readSampleRateHz,
  readTeeth,
  readToneHz,
} from '../../ui/toolFields';
import {
  applyProposal,
  bladeCounts,
  bladesFor,
  converterBits,
  extraTonesHz,
  filterCutoffHz,
  filterKind,
  filterOrder,
  gearTeeth,
  harmonics,
  loggerPlanning,
  sampleHz,
  type FilterKind,
} from '../../state/loggerPlanning';
import { activePart } from '../../state/setup';
import { PartSpeedLine } from '../../ui/part-speed-line';
import { ChoiceGroup } from '../../ui/choice-group';
import { NumberField } from '../../ui/number-field';
import { NumberListField } from '../../ui/number-list-field';
import { Panel } from '../../ui/panel';
import { PartChoice } from '../../ui/part-choice';
import { ReportBar } from '../../ui/report-bar';
import { ResultTable } from '../../ui/result-table';
import { ToolLayout } from '../../ui/tool-layout';
import { PLANNING_AID_CAUTION } from '../../words/cautions';
import { ALIAS_AFTER_CONVERTER_NOTE, loggerNoteWords, proposalWords } from '../../words/logger';
import { COLUMNS } from './columns';
import { loggerCsv } from './csv';
import { RcFields } from './rc-fields';
import style from './style.module.css';

/** The screen takes no props: it reads what it shows from the state's signals. */
interface Props {}

const FILTERS: ReadonlyArray<{ value: FilterKind; label: string }> = [
  { value: 'none', label: 'None' },
  { value: 'rc', label: 'RC' },
  { value: 'butterworth', label: 'Butterworth' },
];

const MAX_LIST = 12;
const readBlades = (text: string) => readList(text, readBladeCount, 'blade counts', 0, MAX_LIST);
const readGears = (text: string) => readList(text, readTeeth, 'tooth counts', 0, MAX_LIST);
const readTones = (text: string) => readList(text, readToneHz, 'added tones', 0, MAX_LIST);

/**
 * The data-logger planner: the machine's frequencies, the sample rate, the analog anti-alias
 * filter and the converter's bits; where each component lands after sampling, how much the
 * filter takes off and whether that buries an alias below the converter's noise floor; the plain
 * statement that filtering after the converter cannot remove an alias; and a sample rate and
 * filter that would work, with a button to take them.
 */
export function LoggerScreen(_props: Props) {
  const plan = loggerPlanning.result.value;
  const problem = loggerPlanning.problem.value;
  const part = activePart.value;
  const kind = filterKind.value;
  // The alias statement has a box of its own and the guard a line of its own (see below).
  const otherNotes = plan
    ? plan.notes.filter((n) => n !== 'alias-after-converter' && n !== 'guard-short')
    : [];
  const failing = plan ? plan.components.filter((c) => !c.pass) : [];

  const headline = !plan
    ? `Nothing to show yet: ${problem}`
    : plan.allPass
      ? 'The record is clean'
      : failing.length > 0
        ? 'False tones will reach the record'
        : 'Aliases can reach the record';
  const summary = (
    <Panel title="Data logger" id="logger-answer">
      {plan ? (
        <div class={style.answer} data-pass={plan.allPass ? 'yes' : 'no'}>
          <p class={style.headline} data-testid="logger-headline">
            {headline}
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
        {/* The planner reads the part's speed and never writes it: the part is edited in its own form. */}
        <PartSpeedLine
          id="logger-shaft"
          part={part}
          extra={`${formatNumber(Math.abs(part.speedRpm) / 60)} Hz: the 1× frequency.`}
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
      cautions={{}}
      csv={plan ? () => loggerCsv(plan, sampleHzOf(plan)) : undefined}
    />
  );

  return (
    <ToolLayout
      testId="logger-screen"
      summary={summary}
      announce={plan ? `${headline}.` : headline}
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
