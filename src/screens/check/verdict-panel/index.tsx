import { computed } from '@preact/signals';
import type { ComponentChildren } from 'preact';
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

/** The verdict's refused entries, or null while it stands (re-computed only as refusals change). */
const withdrawal = computed(() => {
  const problems = problemsAmong(VERDICT_FIELDS);
  const refusal = checkProblem.value;
  if (problems.length === 0 && refusal === undefined) return null;
  // A refused field is the thing to fix: the core's refusal of the rest waits for it.
  return { problems, refusal: problems.length > 0 ? undefined : refusal };
});

// What the panel says, each a signal of its own. The texts are bound to their text nodes, so a
// keystroke rewrites the words in place: the panel itself re-renders only when its shape changes
// (withdrawn or not, the trust level, a smear note, a part name).
const trust = computed(() => check.value.verdict.trust);
/** "Seen at 20 rpm forward; true speed 1,780 rpm." */
const speeds = computed(() => {
  const v = check.value.verdict;
  const sign = v.trueRpm < 0 ? -1 : 1;
  // Half a pitch per sample can be read either way: give no direction with the speed.
  const seen =
    v.kind === 'unclear'
      ? `${formatNumber(Math.abs(v.apparentRpm))} rpm, either way`
      : formatRpmWithDirection(v.apparentRpm, sign);
  return { seen, trueSpeed: `${formatNumber(Math.abs(v.trueRpm))} rpm` };
});
const headline = computed(() => verdictHeadline(check.value.verdict));
const speedsLine = computed(
  () => `Seen at ${speeds.value.seen}; true speed ${speeds.value.trueSpeed}.`,
);
const headlineTail = computed(() => `. ${speedsLine.value}`);
const seenText = computed(() => speeds.value.seen);
const trueText = computed(() => speeds.value.trueSpeed);
/** What a screen reader hears once typing pauses. */
const statusText = computed(() => {
  const w = withdrawal.value;
  return w
    ? withdrawnWords(w.problems, w.refusal, 'verdict')
    : `${headline.value}. ${speedsLine.value}`;
});
const smearNote = computed(() =>
  check.value.camera?.blurLook === 'smeared'
    ? `Each frame smears the ${KIND_WORDS[kindOf({ kind: activePart.value.kind })].many} into an even disc: single ones cannot be made out.`
    : null,
);
const partName = computed(() => activePart.value.name.trim());
/** In the part's own words: "8 blades · strobe at 1,780 fpm", "3 jaws · camera at 50 fps". */
const context = computed(() => {
  const r = check.value;
  const features = featureWords({ kind: activePart.value.kind, features: r.part.symmetry });
  return `${features} · ${SAMPLER_WORDS[r.samplerKind]} ${formatRate(r.rateHz, r.samplerKind, flashUnit.value)}`;
});

/**
 * What the viewer will see, in big words: the verdict, the apparent speed and the true speed.
 * While a field the verdict reads is refused, or the core refuses the set-up, the verdict is
 * withdrawn in its place and says what to fix (docs/physics.md §10): never the last good answer for
 * a value no longer on screen. The screen shows each keystroke's verdict at once; a screen reader
 * hears it once typing pauses (SettledStatus, first in the panel in both states so it stays put).
 */
export function VerdictPanel({ class: extra }: Props) {
  const w = withdrawal.value;
  return (
    <VerdictBox class={extra} withdrawn={w !== null}>
      <h2 id="verdict-title" class={style.title}>
        What you will see
      </h2>
      <VerdictStatus />
      {w ? (
        <Withdrawn problems={w.problems} refusal={w.refusal} what="verdict" testId="verdict" />
      ) : (
        <>
          <div class={style.head}>
            <VerdictMark />
            <p class={style.headline} data-testid="verdict">
              {headline}
              <span class={style.quiet}>{headlineTail}</span>
            </p>
          </div>
          <dl class={style.speeds}>
            <div>
              <dt>Seen</dt>
              <dd data-testid="apparent-speed">{seenText}</dd>
            </div>
            <div>
              <dt>True speed</dt>
              <dd data-testid="true-speed">{trueText}</dd>
            </div>
          </dl>
          <SmearNote />
          <p class={style.context}>
            <PartName />
            {context}
          </p>
        </>
      )}
    </VerdictBox>
  );
}

/**
 * The panel's box, toned by the trust level. Its own component: a keystroke that changes the
 * trust level re-renders the box, and the content handed to it is left as it is.
 */
function VerdictBox({
  class: extra,
  withdrawn,
  children,
}: {
  class?: string;
  withdrawn: boolean;
  children: ComponentChildren;
}) {
  return (
    <section
      class={`${style.verdict} ${extra ?? ''}`}
      data-trust={withdrawn ? 'withdrawn' : trust.value}
      aria-labelledby="verdict-title"
    >
      {children}
    </section>
  );
}

function VerdictMark() {
  return <TrustMark trust={trust.value} />;
}

/** The live region: its own component, so a keystroke re-renders it and not the panel. */
function VerdictStatus() {
  return <SettledStatus text={statusText.value} testId="verdict-status" />;
}

function SmearNote() {
  const note = smearNote.value;
  return note === null ? null : (
    <p class={style.aside} data-testid="smear-note">
      {note}
    </p>
  );
}

function PartName() {
  const name = partName.value;
  return name ? <span data-testid="part-name">{name}: </span> : null;
}
