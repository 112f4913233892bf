// The camera plan's table: each setting, what it looks like, and a button to open it in check.
import { type CameraPlan, type CameraSetting } from '../../core';
import { formatExposure, formatNumber, formatPrecise } from '../../words/format';

import { type ResultColumn } from '../../ui/result-table';

import { CONDITION_NAMES, settingLook, settingWords } from '../../words/cameraPlan';
import style from './style.module.css';

export function columnsFor(
  open: (s: CameraSetting) => void,
  plan: CameraPlan,
): ReadonlyArray<ResultColumn<CameraSetting>> {
  return [
    { label: 'Rank', numeric: true, cell: (_, i) => String(i + 1) },
    { label: 'Frame rate', numeric: true, cell: (r) => `${formatPrecise(r.frameRate)} fps` },
    {
      label: 'Exposure',
      numeric: true,
      cell: (r) => `${formatExposure(r.exposureS)} (${formatNumber(r.shutterAngle)}°)`,
    },
    { label: 'Looks', cell: (r) => settingLook(r) },
    {
      label: 'Blur',
      numeric: true,
      cell: (r) => `${formatNumber(r.blurDegrees)}°, ${formatNumber(r.blurPitches)} pitch`,
    },
    { label: 'Bend', numeric: true, cell: (r) => `${formatNumber(r.skewDegrees)}°` },
    {
      label: 'Goal',
      cell: (r) =>
        r.reaches ? 'Reaches it' : `Fails: ${r.blocks.map((c) => CONDITION_NAMES[c]).join(', ')}`,
    },
    { label: 'Score', numeric: true, cell: (r) => formatNumber(r.score, r.score < 10 ? 1 : 0) },
    { label: 'What it looks like', cell: (r) => settingWords(r, plan) },
    {
      label: 'Try it',
      action: true,
      cell: (r) => (
        <button type="button" class={style.open} onClick={() => open(r)}>
          Open in check
        </button>
      ),
    },
  ];
}
