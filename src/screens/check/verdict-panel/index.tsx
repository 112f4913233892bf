import { formatRpmWithDirection, formatNumber } from '../../../words/format';
import { formatRate } from '../../../words/rates';
import { check, checkProblem } from '../../../state/check';
import { problemsAmong } from '../../../state/fieldProblems';
import { activePart, flashUnit } from '../../../state/setup';
import { VERDICT_FIELDS } from '../field-ids';
import { Withdrawn, withdrawnWords } from '../../../ui/not-current';
import { SettledStatus } from '../../../ui/settled-status';
import { TrustMark } from '../../../ui/trust-mark';
import { verdictHeadline } from '../../../words/check';
import { KIND_WORDS, featureWords } from '../../../words/partKinds';
import { kindOf } from '../../../state/model';
import style from './style.module.css';

interface Props {
  class?: string;
}

const SAMPLER_WORDS = {
  strobe: 'strobe at',
  camera: 'camera at',
  lighting: 'light flickering at',
} as const;

/**
 * What the viewer will see, in big words: the verdict, the apparent speed and the true speed.
 * While a field the verdict reads is refused, or the core refuses the set-up, the verdict is
 * withdrawn in its place and says what to fix (docs/physics.md §10): never the last good answer for
 * a value no longer on screen. The screen shows each keystroke's verdict at once; a screen reader
 * hears it once typing pauses (SettledStatus, first in the panel in both states so it stays put).
 */
export function VerdictPanel({ class: extra }: Props) {
  const problems = problemsAmong(VERDICT_FIELDS);
  const refusal = checkProblem.value;
  if (problems.length > 0 || refusal !== undefined) {
    const shownRefusal = problems.length > 0 ? undefined : refusal;
    return (
      <section
        class={`${style.verdict} ${extra ?? ''}`}
        data-trust="withdrawn"
        aria-labelledby="verdict-title"
      >
        <h2 id="verdict-title" class={style.title}>
          What you will see
        </h2>
        <SettledStatus
          text={withdrawnWords(problems, shownRefusal, 'verdict')}
          testId="verdict-status"
        />
        <Withdrawn problems={problems} refusal={shownRefusal} what="verdict" testId="verdict" />
      </section>
    );
  }
  const r = check.value;
  const v = r.verdict;
  const sign = v.trueRpm < 0 ? -1 : 1;
  // Half a pitch per sample can be read either way: give no direction with the speed.
  const seen =
    v.kind === 'unclear'
      ? `${formatNumber(Math.abs(v.apparentRpm))} rpm, either way`
      : formatRpmWithDirection(v.apparentRpm, sign);
  const trueSpeed = `${formatNumber(Math.abs(v.trueRpm))} rpm`;
  // In the part's own words: "8 blades", "5 spokes", "3 jaws".
  const kind = activePart.value.kind;
  const features = featureWords({ kind, features: r.part.symmetry });
  const partName = activePart.value.name.trim();
  const speeds = `Seen at ${seen}; true speed ${trueSpeed}.`;
  return (
    <section
      class={`${style.verdict} ${extra ?? ''}`}
      data-trust={v.trust}
      aria-labelledby="verdict-title"
    >
      <h2 id="verdict-title" class={style.title}>
        What you will see
      </h2>
      <SettledStatus text={`${verdictHeadline(v)}. ${speeds}`} testId="verdict-status" />
      <div class={style.head}>
        <TrustMark trust={v.trust} />
        <p class={style.headline} data-testid="verdict">
          {verdictHeadline(v)}
          <span class={style.quiet}>. {speeds}</span>
        </p>
      </div>
      <dl class={style.speeds}>
        <div>
          <dt>Seen</dt>
          <dd data-testid="apparent-speed">{seen}</dd>
        </div>
        <div>
          <dt>True speed</dt>
          <dd data-testid="true-speed">{trueSpeed}</dd>
        </div>
      </dl>
      {r.camera?.blurLook === 'smeared' && (
        <p class={style.aside} data-testid="smear-note">
          Each frame smears the {KIND_WORDS[kindOf({ kind })].many} into an even disc: single ones
          cannot be made out.
        </p>
      )}
      <p class={style.context}>
        {partName && <span data-testid="part-name">{partName}: </span>}
        {features} · {SAMPLER_WORDS[r.samplerKind]}{' '}
        {formatRate(r.rateHz, r.samplerKind, flashUnit.value)}
      </p>
    </section>
  );
}
