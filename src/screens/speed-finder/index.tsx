import { useState } from 'preact/hooks';
import { type CautionContext, type StepCandidate } from '../../core';
import { formatNumber } from '../../words/format';
import { openCheckScreen } from '../../state/navigation';
import { formatRate } from '../../words/rates';
import { attempt } from '../../state/outcome';
import { flashUnit } from '../../state/setup';
import {
  applyRateToStrobe,
  expectation,
  expectedRange,
  finderStep,
  readings,
  strobeRangeHz,
} from '../../state/speedFinder';
import { Cautions } from '../../ui/cautions';
import { Panel } from '../../ui/panel';
import { ReportBar } from '../../ui/report-bar';
import { ResultTable, type ResultColumn } from '../../ui/result-table';
import { ToolLayout } from '../../ui/tool-layout';
import {
  candidateCaption,
  candidateNote,
  candidateStatus,
  STAGE_TITLES,
  stepInstruction,
} from '../../words/speedFinder';
import { ReadingsPanel } from './readings-panel';
import { SavePanel } from './save-panel';
import { FinderSetupPanel } from './setup-panel';
import { finderCsv } from './csv';
import { viewWords } from '../../words/look';
import style from './style.module.css';

interface Props {}

/** Candidate rows shown on screen; the CSV holds them all. */
const SHOWN_CANDIDATES = 12;

/**
 * The speed finder: the technician records each flash rate at which the image stood still and
 * how many images stood there; the screen lists every speed that fits, marks the likeliest, and
 * leads through the usual procedure (start high, come down to the first single image, confirm
 * with the double image at twice that rate), then saves the speed found.
 */
export function SpeedFinderScreen(_props: Props) {
  const step = finderStep.result.value;
  const problem = finderStep.problem.value;
  const unit = flashUnit.value;
  const [applied, setApplied] = useState<number | null>(null);
  const rate = (hz: number) => formatRate(hz, 'strobe', unit);
  const expectedRpm = safeExpectedRpm();

  // The procedure sweeps the strobe's whole range: stillness that is not real, and flashing in
  // the seizure range, apply throughout (docs/physics.md §10). Both always show on this screen.
  const cautions: CautionContext = { apparentStillness: true, flashSweepHz: strobeRangeHz.value };

  const summary = (
    <Panel title="Next step" id="finder-step">
      {step ? (
        <div class={style.step} data-stage={step.stage} data-testid="finder-step">
          <p class={style.stage}>{STAGE_TITLES[step.stage]}</p>
          <p class={style.instruction} data-testid="finder-instruction">
            {stepInstruction(step)}
          </p>
          {step.rateHz !== undefined && (
            <div class={style.setRate}>
              <p class={style.rateLine}>
                Set <strong data-testid="finder-rate">{rate(step.rateHz)}</strong>
              </p>
              <button
                type="button"
                class={style.primary}
                onClick={() => {
                  applyRateToStrobe(step.rateHz!);
                  setApplied(step.rateHz!);
                }}
              >
                Use {rate(step.rateHz)} on the Check screen's strobe
              </button>
              {applied !== null && Math.abs(applied - step.rateHz) <= 1e-9 * applied && (
                <p class={style.applied} role="status">
                  The Check screen's strobe now flashes at {rate(applied)}.{' '}
                  <button type="button" class={style.link} onClick={() => openCheckScreen()}>
                    Open the Check screen
                  </button>
                </p>
              )}
            </div>
          )}
        </div>
      ) : (
        <p role="alert">{problem}</p>
      )}
    </Panel>
  );

  const warnings = (
    <>
      <Cautions show={{ safety: true, photosensitivity: true }} />
      {problem && step && (
        <p class={style.problem} role="alert" data-testid="finder-problem">
          {problem} The step shown is for the last entries that could be worked out.
        </p>
      )}
    </>
  );

  const entries = (
    <>
      <ReadingsPanel proposedFpm={step?.rateFpm} />
      <FinderSetupPanel expectedRpm={expectedRpm} />
    </>
  );

  const candidates = step?.candidates ?? [];
  const nextRate = step?.rateHz;
  const columns: ReadonlyArray<ResultColumn<StepCandidate>> = [
    { label: 'Speed', numeric: true, cell: (c) => <strong>{formatNumber(c.rpm)} rpm</strong> },
    {
      label: 'Standing',
      cell: (c) =>
        c.likeliest ? (
          <strong class={style.likeliest}>{candidateStatus(c)}</strong>
        ) : (
          candidateStatus(c)
        ),
    },
    { label: 'Why', cell: (c) => candidateNote(c) },
    ...(nextRate === undefined
      ? []
      : [
          {
            label: `At ${rate(nextRate)}`,
            cell: (c: StepCandidate) => (c.atNextRate ? viewWords(c.atNextRate) : ''),
          },
        ]),
  ];

  const results = (
    <>
      <Panel title="Speeds that fit" id="finder-candidates">
        {candidates.length === 0 ? (
          <p class={style.quiet}>
            {readings.value.length === 0
              ? 'Every speed still fits: record the first reading.'
              : 'No speed fits every reading: check the readings (see the step above).'}
          </p>
        ) : (
          <>
            <ResultTable
              caption={candidateCaption(candidates)}
              columns={columns}
              rows={candidates.slice(0, SHOWN_CANDIDATES)}
              rowKey={(c) => String(c.speedHz)}
              rowState={(c) => (c.likeliest ? 'pass' : undefined)}
              testId="candidate-table"
            />
            {candidates.length > SHOWN_CANDIDATES && (
              <p class={style.quiet}>
                {candidates.length - SHOWN_CANDIDATES} slower-ranked speeds are left out here; the
                CSV holds them all.
              </p>
            )}
          </>
        )}
        <p class={style.quiet}>
          A strobe cannot tell the direction of turning; speeds are given without it. Speeds found
          with several blades are the single-image rate divided by the blade count.
        </p>
      </Panel>
      <SavePanel speedHz={step?.stage === 'done' ? step.speedHz : undefined} />
      <ReportBar
        title="Speed finder"
        cautions={cautions}
        csv={() => finderCsv(candidates, readings.value, step?.rateFpm)}
      />
    </>
  );

  return (
    <ToolLayout
      testId="speed-finder-screen"
      summary={summary}
      announce={step ? `${STAGE_TITLES[step.stage]}. ${stepInstruction(step)}` : (problem ?? '')}
      warnings={warnings}
      entries={entries}
      results={results}
      withdraw={{ except: ['new-reading-rate'] }}
    />
  );
}

/** The expected range in rpm for the hint under it, or nothing when there is none or it is refused. */
function safeExpectedRpm(): { from: number; to: number } | undefined {
  const outcome = attempt(() => expectedRange(expectation.value));
  const r = outcome.ok ? outcome.result : undefined;
  return r && { from: r.minHz * 60, to: r.maxHz * 60 };
}
