// The logger's table as CSV (RFC 4180 via the core), with the sample rate and range on every row.
import { csvTable, type CsvColumn, type LoggerComponent, type LoggerPlan } from '../../core';
import { componentLabel, componentWords } from '../../words/logger';

/** The components as CSV, with the sample rate and converter range on every row. */
export function loggerCsv(plan: LoggerPlan, sampleRateHz: number): string {
  const columns: CsvColumn<LoggerComponent>[] = [
    { label: 'component', value: (c) => componentLabel(c) },
    { label: 'frequency (Hz)', value: (c) => c.hz },
    { label: 'sample rate (Hz)', value: () => sampleRateHz },
    { label: 'lands at (Hz)', value: (c) => c.foldedHz },
    { label: 'aliased', value: (c) => c.aliases },
    { label: 'filter gain (dB)', value: (c) => c.gainDb },
    { label: 'attenuation needed (dB)', value: (c) => c.neededDb },
    { label: 'converter range (dB)', value: () => plan.rangeDb },
    { label: 'pass', value: (c) => c.pass },
    { label: 'in words', value: (c) => componentWords(c, plan) },
  ];
  return csvTable(columns, plan.components);
}
