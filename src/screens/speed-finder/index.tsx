import { type CautionContext, type StepCandidate } from '../../core';
import { formatNumber } from '../../words/format';
import { formatRate } from '../../words/rates';
import { attempt } from '../../state/outcome';
import { flashUnit } from '../../state/setup';
import {
  heardCandidates,
  heardSound,
  soundJoin,
  soundPanelOpen,
  soundSpeeds,
  type HeardCandidate,
} from '../../state/soundSpeed';
import {
  expectation,
  expectedRange,
  finderPartKind,
  finderStep,
  readings,
  strobeRangeHz,
  type HeardOrigin,
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
import {
  heardNote,
  heardStatus,
  SOUND_STAGE_TITLES,
  soundStageOf,
  soundStepInstruction,
  strobeViewWords,
} from '../../words/soundStep';
import { ReadingsPanel } from './readings-panel';
import { SavePanel } from './save-panel';
import { FinderSetupPanel } from './setup-panel';
import { SoundPanel } from './sound';
import { StepBox } from './step-box';
import { finderCsv } from './csv';
import { viewWords } from '../../words/look';
import style from './style.module.css';

interface Props {}

/** Candidate rows shown on screen; the CSV holds them all. */
const SHOWN_CANDIDATES = 12;

/**
 * The speed finder: two methods, one part. By strobe, the technician records each flash rate
 * at which the image stood still and how many images stood there; the screen lists every speed
 * that fits, marks the likeliest, and leads through the usual procedure (start high, come down
 * to the first single image, confirm with the double image at twice that rate). By sound, the
 * phone listens and offers the speeds heard; once heard, the step becomes the one strobe
 * reading that confirms the sound (joinSoundWithStrobe), and the table says which strobe
 * candidates were heard. The speed found goes to the part.
 */
export function SpeedFinderScreen(_props: Props) {
  const step = finderStep.result.value;
  const problem = finderStep.problem.value;
  const unit = flashUnit.value;
  const rate = (hz: number) => formatRate(hz, 'strobe', unit);
  const expectedRpm = safeExpectedRpm();

  // Once something was heard, the step is the sound's joined with the readings.
  const join = soundJoin.result.value;
  const leader = soundSpeeds.result.value?.candidates[0];
  const soundStage = join && leader ? soundStageOf(join) : undefined;
  const heard = heardCandidates.value;
  const nextRateHz = soundStage
    ? soundStage === 'sound-agrees'
      ? undefined
      : join!.nextRateHz
    : step?.rateHz;

  // The procedure sweeps the strobe's whole range: stillness that is not real, and flashing in
  // the seizure range, apply throughout (docs/physics.md §10). Both always show on this screen.
  const cautions: CautionContext = { apparentStillness: true, flashSweepHz: strobeRangeHz.value };

  const summary = (
    // No card around the step: its own box is enough, and the stillness caution under it must
    // show on a phone's first screen (docs/physics.md §10). The heading is for screen readers.
    <section class={style.next} aria-labelledby="finder-step-title">
      <h2 id="finder-step-title" class={style.hiddenTitle}>
        Next step
      </h2>
      {soundStage && join && leader ? (
        <StepBox
          stage={soundStage}
          title={SOUND_STAGE_TITLES[soundStage]}
          instruction={soundStepInstruction(join, leader, readings.value.length)}
          rateHz={nextRateHz}
        />
      ) : step ? (
        <StepBox
          stage={step.stage}
          title={STAGE_TITLES[step.stage]}
          instruction={stepInstruction(step)}
          rateHz={step.rateHz}
          aside={
            step.stage === 'start' && !heardSound.value ? (
              <button type="button" class={style.link} onClick={openSoundPanel}>
                Quicker: find the speed by sound first
              </button>
            ) : undefined
          }
        />
      ) : (
        <p role="alert">{problem}</p>
      )}
    </section>
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
      <FinderSetupPanel expectedRpm={expectedRpm} />
      <SoundPanel />
      <ReadingsPanel proposedFpm={nextRateHz === undefined ? undefined : nextRateHz * 60} />
    </>
  );

  const candidates = step?.candidates ?? [];
  const found = soundStage
    ? soundStage === 'sound-agrees'
      ? { speedHz: join!.speedHz, origin: joinedOrigin(join!.precisionHz) }
      : undefined
    : step?.stage === 'done'
      ? { speedHz: step.speedHz }
      : undefined;

  const results = (
    <>
      <Panel title="Speeds that fit" id="finder-candidates">
        {heard ? (
          <HeardTable rows={heard} rateHz={nextRateHz} rate={rate} />
        ) : candidates.length === 0 ? (
          <p class={style.quiet}>
            {readings.value.length > 0
              ? 'No speed fits every reading: check the readings (see the step above).'
              : soundStage
                ? 'Heard by sound (see the step above): record the strobe reading that confirms it.'
                : 'Every speed still fits: record the first reading.'}
          </p>
        ) : (
          <StrobeTable candidates={candidates} rateHz={step?.rateHz} rate={rate} />
        )}
        <p class={style.quiet}>
          A strobe cannot tell the direction of turning; speeds are given without it. Speeds found
          with several blades are the single-image rate divided by the blade count.
        </p>
      </Panel>
      <SavePanel speedHz={found?.speedHz} origin={found?.origin} />
      <ReportBar
        title="Speed finder"
        cautions={cautions}
        csv={() =>
          finderCsv(candidates, readings.value, step?.rateFpm, {
            candidates: soundSpeeds.result.value?.candidates ?? [],
            kind: finderPartKind.peek(),
          })
        }
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

/** Opens the by-sound panel and brings it into view: the quick way to a first speed. */
function openSoundPanel(): void {
  soundPanelOpen.value = true;
  document.getElementById('finder-sound-title')?.scrollIntoView({ block: 'start' });
}

/** The origin of a speed the sound and the strobe agree on: the sound's precision, heard when it was heard. */
function joinedOrigin(precisionHz: number | undefined): HeardOrigin | undefined {
  const heard = heardSound.value;
  if (!heard || precisionHz === undefined) return undefined;
  return { method: 'sound-and-strobe', precisionHz, heardAtMs: heard.heardAtMs };
}

interface TableProps {
  rateHz: number | undefined;
  rate: (hz: number) => string;
}

/** The strobe's candidates as the procedure ranks them. */
function StrobeTable({ candidates, rateHz, rate }: TableProps & { candidates: StepCandidate[] }) {
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
    ...(rateHz === undefined
      ? []
      : [
          {
            label: `At ${rate(rateHz)}`,
            cell: (c: StepCandidate) => (c.atNextRate ? viewWords(c.atNextRate) : ''),
          },
        ]),
  ];
  return (
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
          {candidates.length - SHOWN_CANDIDATES} slower-ranked speeds are left out here; the CSV
          holds them all.
        </p>
      )}
    </>
  );
}

/** The strobe's candidates once the sound is joined in: the heard ones first. */
function HeardTable({ rows, rateHz, rate }: TableProps & { rows: HeardCandidate[] }) {
  const heardCount = rows.filter((r) => r.heard).length;
  const columns: ReadonlyArray<ResultColumn<HeardCandidate>> = [
    { label: 'Speed', numeric: true, cell: (c) => <strong>{formatNumber(c.rpm)} rpm</strong> },
    {
      label: 'Standing',
      cell: (c) =>
        c.lead ? <strong class={style.likeliest}>{heardStatus(c)}</strong> : heardStatus(c),
    },
    { label: 'Why', cell: (c) => heardNote(c) },
    ...(rateHz === undefined
      ? []
      : [
          {
            label: `At ${rate(rateHz)}`,
            cell: (c: HeardCandidate) => (c.atSoundRate ? strobeViewWords(c.atSoundRate) : ''),
          },
        ]),
  ];
  const fit = `${rows.length} ${rows.length === 1 ? 'speed fits' : 'speeds fit'} the readings`;
  return (
    <>
      <ResultTable
        caption={`${fit}; ${heardCount === 0 ? 'none' : heardCount} of them heard; heard first`}
        columns={columns}
        rows={rows.slice(0, SHOWN_CANDIDATES)}
        rowKey={(c) => String(c.speedHz)}
        rowState={(c) => (c.lead ? 'pass' : undefined)}
        testId="candidate-table"
      />
      {rows.length > SHOWN_CANDIDATES && (
        <p class={style.quiet}>
          {rows.length - SHOWN_CANDIDATES} more speeds that fit the readings but were not heard are
          left out here; the CSV holds every speed.
        </p>
      )}
    </>
  );
}

/** The expected range in rpm for the hint under it, or nothing when there is none or it is refused. */
function safeExpectedRpm(): { from: number; to: number } | undefined {
  const outcome = attempt(() => expectedRange(expectation.value));
  const r = outcome.ok ? outcome.result : undefined;
  return r && { from: r.minHz * 60, to: r.maxHz * 60 };
}
