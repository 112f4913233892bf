// The logger's table: one row per component, where it lands and whether it passes.
import type { LoggerComponent } from '../../core';
import type { ResultColumn } from '../../ui/result-table';
import { formatNumber, formatPrecise } from '../../words/format';
import { componentLabel } from '../../words/logger';
import style from './style.module.css';

export const COLUMNS: ReadonlyArray<ResultColumn<LoggerComponent>> = [
  { label: 'Component', cell: (c) => componentLabel(c) },
  { label: 'Frequency', numeric: true, cell: (c) => `${formatPrecise(c.hz)} Hz` },
  { label: 'Lands at', numeric: true, cell: (c) => `${formatPrecise(c.foldedHz)} Hz` },
  { label: 'Aliased', cell: (c) => (c.aliases ? 'Yes: a false tone' : 'No') },
  { label: 'Filter takes off', numeric: true, cell: (c) => `${formatNumber(-c.gainDb)} dB` },
  {
    label: 'Needed',
    numeric: true,
    cell: (c) => (c.aliases ? `${formatNumber(c.neededDb)} dB` : 'at most 3 dB loss'),
  },
  {
    label: 'Result',
    cell: (c) => (
      <strong class={c.pass ? style.pass : style.fail} data-testid="component-result">
        {c.pass ? 'Pass' : 'Fail'}
      </strong>
    ),
  },
];
