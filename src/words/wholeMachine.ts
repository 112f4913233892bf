// The whole machine in words: each part's speed band, where its speed comes from, the freeze
// bands and the captions of the rate tables.
import type { FreezeBand } from '../core';
import type { DerivedPart, SpeedSource } from '../state/driveChain';
import { formatNumber } from './format';

/** Where a part's speed comes from, in a word or two. */
export const SOURCE_WORDS: Record<SpeedSource, string> = {
  typed: 'typed',
  motor: 'motor nameplate',
  wheel: 'ground speed and tyre',
  drive: 'drive',
};

/** "1,015 rpm ± 2 % (995 – 1,035 rpm), the other way to the first part". */
export function speedWords(p: DerivedPart): string {
  const rpm = formatNumber(Math.abs(p.speedHz * 60));
  const band =
    p.tolerance > 0
      ? ` ± ${formatNumber(p.tolerance * 100)} % (${formatNumber(p.lowHz * 60)} – ${formatNumber(p.highHz * 60)} rpm)`
      : '';
  const way = p.ratioToRoot < 0 ? ', turning the other way to the start of its chain' : '';
  return `${rpm} rpm${band}${way}`;
}

/** What a freeze band freezes: how far the part turns between samples. */
export function freezeWords(b: FreezeBand, samples: 'flashes' | 'frames'): string {
  if (b.p === 0) return 'Turns too slowly to look anything but still';
  const order = b.p === 1 ? `one pitch between ${samples}` : `${b.p} pitches between ${samples}`;
  return b.dense ? `${order}; where exactly depends on the actual speed` : order;
}

/** A rate table's caption: how many bands, how many shown, in which order. */
export function bandCaption(total: number, shown: number, order: string): string {
  const all = `${total} ${total === 1 ? 'band' : 'bands'}`;
  return shown < total
    ? `${all}; ${shown} shown (${order}), all in the CSV`
    : `${all} (${order.replace(/^widest shown, /, '')})`;
}
