// The camera plan's settings (or, with none, its near misses) as CSV (RFC 4180 via the core).
import { csvTable, type CameraPlan, type CameraSetting, type CsvColumn } from '../../core';
import { preciseNumber, shownNumber } from '../../words/format';
import { yesNo } from '../../words/report';

import { settingWords } from '../../words/cameraPlan';

/** The settings (or, with none, the near misses) as CSV. */
export function cameraCsv(plan: CameraPlan): string {
  const rows = plan.settings.length > 0 ? plan.settings : plan.nearMisses;
  const columns: CsvColumn<CameraSetting>[] = [
    { label: 'rank', value: (r) => rows.indexOf(r) + 1 },
    { label: 'frame rate (fps)', value: (r) => preciseNumber(r.frameRate) },
    { label: 'exposure (s)', value: (r) => Number(r.exposureS.toPrecision(4)) },
    { label: 'shutter angle (°)', value: (r) => shownNumber(r.shutterAngle) },
    { label: 'look', value: (r) => r.look },
    { label: 'apparent speed (rpm)', value: (r) => shownNumber(r.apparentRpm) },
    { label: 'apparent speed low (rpm)', value: (r) => shownNumber(r.apparentRpmRange[0]) },
    { label: 'apparent speed high (rpm)', value: (r) => shownNumber(r.apparentRpmRange[1]) },
    { label: 'misleading within tolerance', value: (r) => yesNo(r.misleading) },
    { label: 'blur (°)', value: (r) => shownNumber(r.blurDegrees) },
    { label: 'blur (pitches)', value: (r) => shownNumber(r.blurPitches) },
    { label: 'rolling-shutter bend (°)', value: (r) => shownNumber(r.skewDegrees) },
    { label: 'pattern contrast left', value: (r) => shownNumber(r.residualContrast) },
    { label: 'rolling-shutter bend (pitches)', value: (r) => shownNumber(r.skewPitches) },
    { label: 'readout longer than a frame', value: (r) => yesNo(r.readoutLongerThanFrame) },
    { label: 'reaches the goal', value: (r) => yesNo(r.reaches) },
    { label: 'fails', value: (r) => r.blocks.join(' ') },
    { label: 'score', value: (r) => shownNumber(r.score) },
    { label: 'what it looks like', value: (r) => settingWords(r, plan) },
  ];
  return csvTable(columns, rows);
}
