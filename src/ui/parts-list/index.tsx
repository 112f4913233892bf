import { useLayoutEffect, useRef, useState } from 'preact/hooks';
import { formatNumber } from '../../words/format';
import { useFollowingText } from '../followingText';
import { partLabel, activeIndex } from '../../state/model';
import { addPart, removePart, renamePart, selectPart } from '../../state/parts';
import { setup } from '../../state/setup';
import { DataError } from '../../state/validate';
import { Panel } from '../panel';
import style from './style.module.css';

interface Props {
  class?: string;
  /** Heading of the panel. */
  title?: string;
}

function messageOf(error: unknown): string {
  if (error instanceof DataError) return error.message;
  throw error;
}

/**
 * The parts of the current set-up: pick the one to edit (the part form below edits it), add
 * one, rename or remove the chosen one. Every screen shares the same list.
 */
export function PartsList({ class: extra, title = 'Parts' }: Props) {
  const s = setup.value;
  const active = activeIndex(s);
  const chosen = s.parts[active];
  const [problem, setProblem] = useState<string | null>(null);
  const list = useRef<HTMLUListElement>(null);
  // The remove button goes disabled (or its part away) under the keyboard's focus, which would
  // drop to the page body: after a removal, focus moves to the part now chosen (WCAG 2.4.3).
  const focusChosen = useRef(false);
  // Before the paint, so no frame passes with focus on the page body.
  useLayoutEffect(() => {
    if (!focusChosen.current) return;
    focusChosen.current = false;
    list.current?.querySelector<HTMLButtonElement>('button[aria-pressed="true"]')?.focus();
  });
  // Another part chosen, or its name changed elsewhere: the field follows, in the same render.
  const { text: name, edit } = useFollowingText(
    `${active} ${chosen.name}`,
    (shown) => shown === chosen.name,
    () => chosen.name,
  );

  const act = (action: () => void) => {
    try {
      action();
      setProblem(null);
    } catch (error) {
      setProblem(messageOf(error));
    }
  };

  const onName = (event: Event) => {
    const next = (event.currentTarget as HTMLInputElement).value;
    edit(next, null);
    act(() => renamePart(active, next));
  };

  return (
    <Panel title={title} id="parts-list" class={extra}>
      <ul class={style.list} data-testid="parts-list" ref={list}>
        {s.parts.map((p, i) => (
          <li key={i}>
            <button
              type="button"
              class={style.part}
              aria-pressed={i === active ? 'true' : 'false'}
              onClick={() => act(() => selectPart(i))}
            >
              <span class={style.name}>{partLabel(s, i)}</span>
              <span class={style.facts}>
                {formatNumber(p.speedRpm)} rpm · {p.features}{' '}
                {p.features === 1 ? 'mark' : 'blades or marks'} · ±
                {formatNumber(p.tolerancePercent)} %
              </span>
            </button>
          </li>
        ))}
      </ul>
      <div class={style.field}>
        <label class={style.label} for="part-name">
          Name of the chosen part
        </label>
        <input
          id="part-name"
          class={style.input}
          type="text"
          autoComplete="off"
          value={name}
          onInput={onName}
          aria-invalid={problem ? 'true' : undefined}
          aria-describedby={problem ? 'parts-problem' : undefined}
        />
      </div>
      <div class={style.actions}>
        <button type="button" class={style.button} onClick={() => act(addPart)}>
          Add a part
        </button>
        <button
          type="button"
          class={style.button}
          onClick={() =>
            act(() => {
              removePart(active);
              focusChosen.current = true;
            })
          }
          disabled={s.parts.length <= 1}
        >
          Remove the chosen part
        </button>
      </div>
      {problem && (
        <p id="parts-problem" class={style.problem} role="alert">
          {problem}
        </p>
      )}
    </Panel>
  );
}
