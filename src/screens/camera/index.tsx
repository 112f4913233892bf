import { cautionFlags, standardFrameRates, type CameraSetting } from '../../core';
import {
  readCreepRpm,
  readExposureSeconds,
  readFrameRate,
  readReadoutMs,
  readShutterAngle,
} from '../../ui/fields';
import { formatExposure, formatPrecise, numberForField } from '../../words/format';
import { openCheckScreen } from '../../state/navigation';
import { readList } from '../../ui/toolFields';
import {
  applyCameraSetting,
  cameraCautions,
  cameraPlanning,
  exposuresS,
  goalKind,
  otherRatesHz,
  planReadoutMs,
  shutterAnglesDeg,
  standardLabelsOn,
  toggleStandardRate,
  type GoalKind,
} from '../../state/cameraPlanning';
import { setCreepRpm, setup } from '../../state/setup';
import { Cautions } from '../../ui/cautions';
import { ChoiceGroup } from '../../ui/choice-group';
import { NumberField } from '../../ui/number-field';
import { NumberListField } from '../../ui/number-list-field';
import { Panel } from '../../ui/panel';
import { PartChoice } from '../../ui/part-choice';
import { ReportBar } from '../../ui/report-bar';
import { ResultTable } from '../../ui/result-table';
import { ToolLayout } from '../../ui/tool-layout';
import { blockedLines, conditionLines, GOAL_WORDS, settingWords } from '../../words/cameraPlan';
import { columnsFor } from './columns';
import { cameraCsv } from './csv';
import style from './style.module.css';

/** The screen takes no props: it reads what it shows from the state's signals. */
interface Props {}

const GOALS: ReadonlyArray<{ value: GoalKind; label: string }> = [
  { value: 'freeze', label: 'Freeze it' },
  { value: 'creep', label: 'Slow forward turn' },
  { value: 'natural', label: 'Natural blur' },
  { value: 'honest', label: 'Nothing misleading' },
];

/** Most values in one list field: enough for any camera's menu. */
const MAX_LIST = 12;

const readOtherRates = (text: string) =>
  readList(text, readFrameRate, 'other frame rates', 0, MAX_LIST);
const readAngles = (text: string) =>
  readList(text, readShutterAngle, 'shutter angles', 0, MAX_LIST);
const readSpeeds = (text: string) =>
  readList(text, readExposureSeconds, 'shutter speeds', 0, MAX_LIST);
/** A shutter speed as cameras show it: 500 for 1/500 s. */
const speedText = (s: number) => (s < 1 ? numberForField(1 / s) : numberForField(s));

/**
 * The camera planner: what the camera can do and what the video should show, for the set-up's
 * chosen part; a ranked table of settings that reach the goal, each with what it looks like and
 * an action that opens it on the check screen. With none, why not, and the near misses.
 */
export function CameraScreen(_props: Props) {
  const plan = cameraPlanning.result.value;
  const problem = cameraPlanning.problem.value;
  const kind = goalKind.value;
  const s = setup.value;
  const cautions = plan ? cameraCautions(plan) : { apparentStillness: true };
  const reached = plan ? plan.settings : [];
  const shown = reached.length > 0 ? reached : (plan?.nearMisses ?? []);
  const best = reached[0];

  const open = (setting: CameraSetting) => {
    applyCameraSetting(setting, shutterAnglesDeg.value, planReadoutMs.value);
    openCheckScreen();
  };

  const headline = !plan
    ? 'Nothing to show yet'
    : reached.length > 0
      ? `${reached.length} ${reached.length === 1 ? 'setting reaches' : 'settings reach'} the goal`
      : 'No setting of this camera reaches the goal';
  const bestWords =
    plan && best
      ? `Best: ${formatPrecise(best.frameRate)} fps at ${formatExposure(best.exposureS)}.`
      : '';
  const summary = (
    <Panel title="Camera plan" id="camera-plan-answer">
      <div class={style.answer} data-found={reached.length > 0 ? 'yes' : 'no'}>
        <p class={style.headline} data-testid="plan-headline">
          {headline}
        </p>
        <p>Goal: {GOAL_WORDS[plan?.goal ?? kind]}.</p>
        {plan && best && (
          <p data-testid="plan-best">
            {bestWords} {settingWords(best, plan)}
          </p>
        )}
        {plan && reached.length === 0 && (
          <ul class={style.blocked} data-testid="plan-blocked">
            {blockedLines(plan).map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
        )}
      </div>
    </Panel>
  );

  const warnings = (
    <>
      <Cautions show={cautionFlags(cautions)} />
    </>
  );

  const entries = (
    <>
      <Panel title="The camera" id="plan-camera">
        <fieldset class={style.rates}>
          <legend class={style.legend}>Frame rates it offers</legend>
          <div class={style.chips}>
            {standardFrameRates.map((r) => (
              <label key={r.label} class={style.chip}>
                <input
                  type="checkbox"
                  checked={standardLabelsOn.value.includes(r.label)}
                  onChange={(e) =>
                    toggleStandardRate(r.label, (e.currentTarget as HTMLInputElement).checked)
                  }
                />
                <span>{r.label}</span>
              </label>
            ))}
          </div>
        </fieldset>
        <NumberListField
          id="plan-other-rates"
          label="Other frame rates"
          values={otherRatesHz.value}
          toText={numberForField}
          read={readOtherRates}
          onValues={(v) => (otherRatesHz.value = v)}
          unit="fps"
          hint="Separate with spaces: 48 100 180."
        />
        <NumberListField
          id="plan-angles"
          label="Shutter angles"
          values={shutterAnglesDeg.value}
          toText={numberForField}
          read={readAngles}
          onValues={(v) => (shutterAnglesDeg.value = v)}
          unit="°"
          hint="180° = half the frame time. Leave empty if the camera sets speeds only."
        />
        <NumberListField
          id="plan-speeds"
          label="Shutter speeds"
          values={exposuresS.value}
          toText={speedText}
          read={readSpeeds}
          onValues={(v) => (exposuresS.value = v)}
          unit="1/x s"
          hint="Type 500 for 1/500 s, separated by spaces."
        />
        <NumberField
          id="plan-readout"
          label="Rolling readout time"
          value={planReadoutMs.value}
          toText={numberForField}
          read={readReadoutMs}
          onValue={(v) => (planReadoutMs.value = v)}
          unit="ms"
          hint="Top to bottom; phones take about 22–33 ms (Ringaby & Forssén 2011). 0 = global shutter."
        />
      </Panel>
      <Panel title="The goal" id="plan-goal">
        <ChoiceGroup
          legend="What the video should show"
          name="plan-goal"
          options={GOALS}
          value={kind}
          onChange={(g) => (goalKind.value = g)}
        />
        {kind === 'creep' && (
          <NumberField
            id="plan-creep"
            label="Slow turn wanted"
            value={s.creepRpm}
            toText={numberForField}
            read={readCreepRpm}
            onValue={setCreepRpm}
            unit="rpm"
            hint="How fast the part should seem to turn forward."
          />
        )}
      </Panel>
      <Panel title="The part" id="plan-part">
        <PartChoice
          id="plan-part-choice"
          label="Part to film"
          editHint="Change it on the Check or Lighting screen."
        />
      </Panel>
    </>
  );

  const results = (
    <>
      {plan && reached.length === 0 && (
        <Panel title="What the goal needs" id="plan-needs">
          <p class={style.plain}>A setting reaches the goal only when every condition holds.</p>
          <ul class={style.conditions} data-testid="plan-none">
            {conditionLines(plan, planReadoutMs.value).map((line) => (
              <li key={line.condition} data-met={line.met > 0 ? 'some' : 'none'}>
                {line.text}
              </li>
            ))}
          </ul>
        </Panel>
      )}
      <Panel
        title={reached.length > 0 ? 'Settings that reach the goal' : 'Closest settings'}
        id="plan-settings"
      >
        {shown.length > 0 ? (
          <ResultTable
            caption={
              reached.length > 0
                ? 'Best first. "Open in check" sets the camera and shows it on the check screen.'
                : 'None reaches the goal; these come closest.'
            }
            columns={columnsFor(open, plan!)}
            rows={shown}
            rowKey={(r) => `${r.frameRate}|${r.exposureS}`}
            rowState={(r) =>
              !r.reaches ? 'fail' : r.misleading || r.readoutLongerThanFrame ? 'caution' : undefined
            }
            testId="plan-table"
          />
        ) : (
          <p class={style.plain}>No settings to list.</p>
        )}
      </Panel>
    </>
  );

  const report = (
    <ReportBar
      title="Camera plan"
      cautions={cautions}
      csv={plan ? () => cameraCsv(plan) : undefined}
    />
  );

  return (
    <ToolLayout
      testId="camera-screen"
      summary={summary}
      announce={[`${headline}.`, bestWords].filter(Boolean).join(' ')}
      warnings={warnings}
      entries={entries}
      results={results}
      report={report}
      withdraw={{ refusal: problem }}
    />
  );
}
