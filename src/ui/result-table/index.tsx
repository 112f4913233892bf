import type { ComponentChildren } from 'preact';
import style from './style.module.css';

export interface ResultColumn<T> {
  /** Heading; on a phone it labels the value inside each card. */
  label: string;
  cell: (row: T, index: number) => ComponentChildren;
  /** Right-aligned, tabular figures. */
  numeric?: boolean;
  /** Buttons only: left off the printed page. */
  action?: boolean;
}

interface Props<T> {
  /** Names the table for screen readers and in print. */
  caption: string;
  columns: ReadonlyArray<ResultColumn<T>>;
  rows: readonly T[];
  rowKey: (row: T, index: number) => string;
  /** A word styling the row: 'hazard', 'caution', 'fine', 'pass', 'fail'. */
  rowState?: (row: T) => string | undefined;
  testId?: string;
}

/**
 * A table of results: a real table on wide screens and on paper, a stack of labelled cards on
 * a phone, so no row needs sideways scrolling.
 */
export function ResultTable<T>({ caption, columns, rows, rowKey, rowState, testId }: Props<T>) {
  return (
    <table class={style.table} data-testid={testId}>
      <caption class={style.caption}>{caption}</caption>
      <thead>
        <tr>
          {columns.map((c) => (
            <th
              key={c.label}
              scope="col"
              class={c.numeric ? style.numeric : undefined}
              data-print={c.action ? 'hide' : undefined}
            >
              {c.label}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.map((row, i) => (
          <tr key={rowKey(row, i)} data-state={rowState?.(row)}>
            {columns.map((c) => (
              <td
                key={c.label}
                data-label={c.label}
                class={c.numeric ? style.numeric : undefined}
                data-print={c.action ? 'hide' : undefined}
              >
                {c.cell(row, i)}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
