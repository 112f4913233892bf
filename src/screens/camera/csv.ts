// The camera plan's settings (or, with none, its near misses) as CSV (RFC 4180 via the core).
import { csvTable, type CameraPlan, type CameraSetting, type CsvColumn } from '../../core';

import { settingWords } from '../../words/cameraPlan';

/** The settings (or, with none, the near misses) as CSV. */
export function cameraCsv(plan: CameraPlan): string {
  const rows = plan.settings.length > 0 ? plan.settings : plan.nearMisses;
  const columns: CsvColumn<CameraSetting>[] = [
    { label: 'rank', value: (r) => rows.indexOf(r) + 1 },
    { label: 'frame rate (fps)', value: (r) => r.frameRate },
    { label: 'exposure (s)', value: (r) => r.exposureS },
    { label: 'shutter angle (°)', value: (r) => r.shutterAngle },
    { label: 'look', value: (r) => r.look },
    { label: 'apparent speed (rpm)', value: (r) => r.apparentRpm },
    { label: 'apparent speed low (rpm)', value: (r) => r.apparentRpmRange[0] },
    { label: 'apparent speed high (rpm)', value: (r) => r.apparentRpmRange[1] },
    { label: 'misleading within tolerance', value: (r) => r.misleading },
    { label: 'blur (°)', value: (r) => r.blurDegrees },
    { label: 'blur (pitches)', value: (r) => r.blurPitches },
    { label: 'rolling-shutter bend (°)', value: (r) => r.skewDegrees },
    { label: 'pattern contrast left', value: (r) => r.residualContrast },
    { label: 'rolling-shutter bend (pitches)', value: (r) => r.skewPitches },
    { label: 'readout longer than a frame', value: (r) => r.readoutLongerThanFrame },
    { label: 'reaches the goal', value: (r) => r.reaches },
    { label: 'fails', value: (r) => r.blocks.join(' ') },
    { label: 'score', value: (r) => r.score },
    { label: 'what it looks like', value: (r) => settingWords(r, plan) },
  ];
  return csvTable(columns, rows);
}
