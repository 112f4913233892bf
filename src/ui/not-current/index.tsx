import type { ComponentChildren } from 'preact';
import { memoWith } from '../memo';
import type { FieldProblem } from '../../state/fieldProblems';
import style from './style.module.css';

/** Brings a field into view and puts the cursor in it. */
export function focusField(id: string): void {
  const field = document.getElementById(id);
  if (!field) return;
  field.scrollIntoView?.({ block: 'center' });
  field.focus({ preventScroll: true });
}

/** "Speed", "Speed and Flash rate", "Speed, Tolerance and Flash rate". */
export function fieldNames(problems: readonly FieldProblem[]): string {
  const names = problems.map((p) => p.label);
  return names.length <= 1
    ? (names[0] ?? '')
    : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

/** One button per refused field, each taking the cursor to its field. */
export function FixButtons({ problems }: { problems: readonly FieldProblem[] }) {
  return (
    <span class={style.fixes}>
      {problems.map((p) => (
        <button
          key={p.id}
          type="button"
          class={style.fix}
          onClick={() => focusField(p.id)}
          data-testid="fix-field"
        >
          Fix {p.label}
        </button>
      ))}
    </span>
  );
}

interface Props {
  /** Refused fields the content below was worked out from. */
  problems: readonly FieldProblem[];
  /** The core's refusal of entries that each read well, when it refused them. */
  refusal?: string;
  children: ComponentChildren;
}

/**
 * Content worked out from entries that are refused right now: dimmed, out of reach (no tap can
 * act on a stale rate, no screen reader reads it as current) and marked "Not current" with the
 * fields to fix. The content stays in place, with its state, so it comes back as it was.
 */
function NotCurrentView({ problems, refusal, children }: Props) {
  const stale = problems.length > 0 || refusal !== undefined;
  return (
    <div class={style.wrap} data-current={stale ? 'false' : 'true'}>
      {stale && (
        <p class={style.note} data-testid="not-current">
          {problems.length > 0 ? (
            <>
              Not current: fix {fieldNames(problems)} first. <FixButtons problems={problems} />
            </>
          ) : (
            'Not current: these entries cannot be worked out (see the answer above).'
          )}
        </p>
      )}
      <div
        class={stale ? `${style.content} ${style.stale}` : style.content}
        inert={stale}
        aria-hidden={stale ? 'true' : undefined}
      >
        {children}
      </div>
    </div>
  );
}

/** The same refused fields, field by field (a new list of the same refusals changes nothing). */
function sameProblems(a: readonly FieldProblem[], b: readonly FieldProblem[]): boolean {
  return (
    a.length === b.length &&
    a.every((p, i) => p.id === b[i].id && p.label === b[i].label && p.message === b[i].message)
  );
}

/**
 * Re-renders only when the refusals or the content change: a guard whose parent re-renders
 * with the same content and the same refusals does nothing.
 */
export const NotCurrent = memoWith(
  NotCurrentView,
  (before, after) =>
    before.children === after.children &&
    before.refusal === after.refusal &&
    sameProblems(before.problems, after.problems),
);

interface WithdrawnProps {
  problems: readonly FieldProblem[];
  refusal?: string;
  /** What is withdrawn, as the headline says it: "verdict", "answer". */
  what: string;
  /** Test id of the headline (the place the answer's headline has when there is one). */
  testId?: string;
}

/** "No verdict until Speed is fixed", "No answer: these entries cannot be worked out". */
function withdrawnHeadline(problems: readonly FieldProblem[], what: string): string {
  return problems.length > 0
    ? `No ${what} until ${fieldNames(problems)} ${problems.length === 1 ? 'is' : 'are'} fixed`
    : `No ${what}: these entries cannot be worked out`;
}

/** What a withdrawn answer says, in one line to be read out: its headline, then each message. */
export function withdrawnWords(
  problems: readonly FieldProblem[],
  refusal: string | undefined,
  what: string,
): string {
  const lines = [
    withdrawnHeadline(problems, what),
    ...problems.map((p) => `${p.label}: ${p.message}`),
    ...(refusal !== undefined ? [refusal] : []),
  ];
  return lines.map((line) => (/[.!?]$/.test(line) ? line : `${line}.`)).join(' ');
}

/**
 * An answer withdrawn where it stood because its entries are refused (docs/physics.md §10): which
 * field to fix, the field's own message, and a button that takes the cursor there.
 */
export function Withdrawn({ problems, refusal, what, testId }: WithdrawnProps) {
  return (
    <div class={style.withdrawn} data-testid="withdrawn">
      <p class={style.headline} data-testid={testId}>
        {withdrawnHeadline(problems, what)}
      </p>
      <ul class={style.messages}>
        {problems.map((p) => (
          <li key={p.id}>
            {p.label}: {p.message}
          </li>
        ))}
        {refusal !== undefined && <li>{refusal}</li>}
      </ul>
      {problems.length > 0 && <FixButtons problems={problems} />}
    </div>
  );
}
