// The logger's table as CSV (RFC 4180 via the core), with the sample rate and range on every row;
// numbers as rounded on screen, yes and no in words.
import { csvTable, type CsvColumn, type LoggerComponent, type LoggerPlan } from '../../core';
import { preciseNumber, shownNumber } from '../../words/format';
import { yesNo } from '../../words/report';
import { componentLabel, componentWords } from '../../words/logger';

/** The components as CSV, with the sample rate and converter range on every row. */
export function loggerCsv(plan: LoggerPlan, sampleRateHz: number): string {
  const columns: CsvColumn<LoggerComponent>[] = [
    { label: 'component', value: (c) => componentLabel(c) },
    { label: 'frequency (Hz)', value: (c) => preciseNumber(c.hz) },
    { label: 'sample rate (Hz)', value: () => preciseNumber(sampleRateHz) },
    { label: 'lands at (Hz)', value: (c) => preciseNumber(c.foldedHz) },
    { label: 'aliased', value: (c) => yesNo(c.aliases) },
    { label: 'filter gain (dB)', value: (c) => shownNumber(c.gainDb) },
    { label: 'attenuation needed (dB)', value: (c) => shownNumber(c.neededDb) },
    { label: 'converter range (dB)', value: () => shownNumber(plan.rangeDb) },
    { label: 'pass', value: (c) => yesNo(c.pass) },
    { label: 'in words', value: (c) => componentWords(c, plan) },
  ];
  return csvTable(columns, plan.components);
}
