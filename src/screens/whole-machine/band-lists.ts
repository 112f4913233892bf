// Which bands the whole-machine screen lists, and which rate a tap sets. Pure: the screen and
// its tests share them.
import type { FreezeBand } from '../../core';

export interface RateSpan {
  fromHz: number;
  toHz: number;
}

/** The middle of a band on a ratio scale: rates are compared by ratio (a log axis). */
export function middleHz(band: RateSpan): number {
  return Math.sqrt(band.fromHz * band.toHz);
}

/**
 * The rate a tap on a freeze band sets: the single-image rate for the nominal speed when it
 * lies in the band (it can fall outside where another part's still span cuts the band), else
 * the band's middle.
 * @example freezeRateToSet({ fromHz: 23.95, toHz: 24.05, p: 1, lockRateHz: 24, dense: false }) // 24
 */
export function freezeRateToSet(band: FreezeBand): number {
  return band.lockRateHz >= band.fromHz && band.lockRateHz <= band.toHz
    ? band.lockRateHz
    : middleHz(band);
}

/**
 * The freeze bands to list: highest rate first (the first is the plain single image, p = 1;
 * lower ones are sub-multiples), at most `count`.
 */
export function freezeBandsShown(bands: readonly FreezeBand[], count: number): FreezeBand[] {
  return [...bands].sort((a, b) => b.fromHz - a.fromHz).slice(0, count);
}

/**
 * The bands where nothing looks still to list: the `count` widest by ratio (room to hold a rate
 * while speeds drift), highest rate first.
 */
export function noStillBandsShown<T extends RateSpan>(bands: readonly T[], count: number): T[] {
  const width = (b: RateSpan) => Math.log(b.toHz / b.fromHz);
  return [...bands]
    .sort((a, b) => width(b) - width(a))
    .slice(0, count)
    .sort((a, b) => b.fromHz - a.fromHz);
}
