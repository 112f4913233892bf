import {
  cautionFlags,
  csvTable,
  type CsvColumn,
  type LightingCheck,
  type PartUnderLight,
} from '../../core';
import { formatNumber, preciseNumber, shownNumber } from '../../words/format';
import { lighting, lightingCautions } from '../../state/lighting';
import { lightWaveOf, setup } from '../../state/setup';
import { Cautions } from '../../ui/cautions';
import { LightingReadout } from '../../ui/lighting-readout';
import { Panel } from '../../ui/panel';
import { PartForm } from '../../ui/part-form';
import { PartsList } from '../../ui/parts-list';
import { ReportBar } from '../../ui/report-bar';
import { ResultTable, type ResultColumn } from '../../ui/result-table';
import { LightingFields } from '../../ui/lighting-fields';
import { ToolLayout } from '../../ui/tool-layout';
import { lookWords } from '../../words/look';
import {
  LIGHTING_HEADLINES,
  LOCAL_RULES_NOTE,
  lightingSummary,
  PART_VERDICT_WORDS,
  partWords,
  remedyWords,
} from '../../words/lighting';
import style from './style.module.css';
import { type Setup } from '../../state/model';

/** The screen takes no props: it reads what it shows from the state's signals. */
interface Props {}

interface PartRow {
  part: PartUnderLight;
  /** The part under the light, in a sentence or two. */
  words: string;
  speedRpm: number;
  features: number;
  tolerancePercent: number;
}

/**
 * The lighting check: the lamps (mains, flicker, modulation) against every part of the set-up.
 * For each part what it looks like under that light, the worst look within its speed tolerance,
 * and a verdict; a part that can look still or backward under visible flicker is a hazard, said
 * loudly. The flicker's IEEE Std 1789-2015 class and CIE SVM, the remedies and the deferral to
 * local rules follow.
 */
export function LightingScreen(_props: Props) {
  const result = lighting.result.value;
  const problem = lighting.problem.value;
  const s = setup.value;
  const modulation = s.lighting.modulationPercent;
  // Until the core has accepted a set-up, show the stillness caution rather than none.
  const cautions = result ? lightingCautions(result, modulation) : { apparentStillness: true };
  const rows = result ? partRowsOf(result, s) : [];
  const hazards = result ? result.parts.filter((p) => p.hazard) : [];

  // The hazard is said once, here at the top with the verdict (and read out as an alert once
  // typing pauses); the stillness caution under it is the one wording every screen shares
  // (src/core/plans/safetyCautions.ts).
  const announce = result
    ? `${LIGHTING_HEADLINES[result.verdict]}. ${lightingSummary(result)}`
    : `Nothing to show yet: ${problem}`;
  const summary = (
    <Panel title="Under this light" id="lighting-verdict">
      {result ? (
        <div
          class={style.verdict}
          data-verdict={result.verdict}
          data-testid={hazards.length > 0 ? 'lighting-hazard' : undefined}
        >
          <p class={style.headline} data-testid="lighting-headline">
            {LIGHTING_HEADLINES[result.verdict]}
          </p>
          <p data-testid="lighting-summary">{lightingSummary(result)}</p>
        </div>
      ) : (
        <p class={style.plain}>Nothing to show yet: {problem}</p>
      )}
    </Panel>
  );

  const warnings = (
    <>
      <Cautions show={cautionFlags(cautions)} />
    </>
  );

  const entries = (
    <>
      <Panel title="The lamps" id="lamps">
        <LightingFields />
      </Panel>
      {/* On paper the table lists every part; the editors would print as empty boxes. */}
      <div class={style.screenOnly} data-print="hide">
        <PartsList title="Parts of the machine" />
        <PartForm />
      </div>
    </>
  );

  const results = (
    <>
      {result && (
        <LightingReadout
          lighting={{
            flickerHz: result.flickerHz,
            modulationPercent: modulation,
            risk: result.risk,
            lowRiskPercent: result.lowRiskPercent,
            noEffectPercent: result.noEffectPercent,
            wave: lightWaveOf(s.lighting),
            fundamental: result.harmonics[0]?.amplitude ?? 0,
            harmonicCount: result.harmonics.length,
            svm: result.svm,
          }}
        />
      )}
      <Panel title="Each part under this light" id="lighting-parts">
        <ResultTable
          caption={`${rows.length} ${rows.length === 1 ? 'part' : 'parts'}; the worst look is for any speed within the tolerance`}
          columns={COLUMNS}
          rows={rows}
          rowKey={(_, i) => String(i)}
          rowState={(r) => r.part.verdict}
          testId="lighting-table"
        />
      </Panel>
      <Panel title="What to do" id="lighting-remedies">
        {result && result.remedies.length > 0 ? (
          <ul class={style.remedies} data-testid="lighting-remedies">
            {result.remedies.map((r) => (
              <li key={r}>{remedyWords(r, result)}</li>
            ))}
          </ul>
        ) : (
          <p class={style.plain}>Nothing needs changing for these parts under this light.</p>
        )}
        {/* The core's remedies end with the same deferral; say it once. */}
        {!(result && result.remedies.length > 0) && (
          <p class={style.rules} data-testid="local-rules">
            {LOCAL_RULES_NOTE}
          </p>
        )}
      </Panel>
    </>
  );

  const report = (
    <ReportBar
      title="Lighting check"
      cautions={cautions}
      csv={result ? () => lightingCsv(result, rows, modulation) : undefined}
    />
  );

  return (
    <ToolLayout
      testId="lighting-screen"
      summary={summary}
      announce={announce}
      urgent={hazards.length > 0}
      warnings={warnings}
      entries={entries}
      results={results}
      report={report}
      withdraw={{ refusal: problem }}
    />
  );
}

const COLUMNS: ReadonlyArray<ResultColumn<PartRow>> = [
  { label: 'Part', cell: (r) => <strong>{r.part.name}</strong> },
  { label: 'True speed', numeric: true, cell: (r) => `${formatNumber(r.speedRpm)} rpm` },
  {
    label: 'At its nominal speed',
    cell: (r) =>
      lookWords(r.part.look, r.part.look === 'still' ? r.part.images : 1, r.part.apparentRpm),
  },
  { label: `Worst within ± tolerance`, cell: (r) => lookWords(r.part.worstLook, r.part.images) },
  {
    label: 'Verdict',
    cell: (r) =>
      r.part.verdict === 'hazard' ? (
        <strong class={style.tag} data-testid="hazard-flag">
          {PART_VERDICT_WORDS.hazard}
        </strong>
      ) : (
        PART_VERDICT_WORDS[r.part.verdict]
      ),
  },
  { label: 'In words', cell: (r) => r.words },
];

/** The table's rows: each part as the core found it, in words, with what the set-up holds of it. */
export function partRowsOf(result: LightingCheck, s: Setup): PartRow[] {
  return result.parts.map((part, i) => ({
    part,
    words: partWords(part, result),
    speedRpm: s.parts[i]?.speedRpm ?? 0,
    features: s.parts[i]?.features ?? 1,
    tolerancePercent: s.parts[i]?.tolerancePercent ?? 0,
  }));
}

/** The table as CSV: one row per part, with the light's figures on every row so each row stands alone. */
export function lightingCsv(
  result: LightingCheck,
  rows: readonly PartRow[],
  modulationPercent: number,
): string {
  const columns: CsvColumn<PartRow>[] = [
    { label: 'part', value: (r) => r.part.name },
    { label: 'speed (rpm)', value: (r) => shownNumber(r.speedRpm) },
    { label: 'blades or marks', value: (r) => r.features },
    { label: 'tolerance (± %)', value: (r) => shownNumber(r.tolerancePercent) },
    { label: 'flicker (Hz)', value: () => preciseNumber(result.flickerHz) },
    { label: 'modulation (%)', value: () => shownNumber(modulationPercent) },
    { label: 'IEEE 1789 class', value: () => result.risk },
    { label: 'IEEE 1789 no-effect line (%)', value: () => shownNumber(result.noEffectPercent) },
    { label: 'IEEE 1789 low-risk line (%)', value: () => shownNumber(result.lowRiskPercent) },
    { label: 'SVM', value: () => shownNumber(result.svm) },
    { label: 'look at nominal speed', value: (r) => r.part.look },
    { label: 'apparent speed (rpm)', value: (r) => shownNumber(r.part.apparentRpm) },
    { label: 'worst look within tolerance', value: (r) => r.part.worstLook },
    { label: 'images', value: (r) => r.part.images },
    { label: 'verdict', value: (r) => r.part.verdict },
    { label: 'in words', value: (r) => r.words },
  ];
  return csvTable(columns, [...rows]);
}
