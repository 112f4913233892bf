// How the preview's part looks: colours and proportions. Plain data; the view fills the
// colours from CSS custom properties so the screen's palette decides.

/** An sRGB colour, channels 0…255. */
export type Rgb = readonly [number, number, number];

export interface PreviewLook {
  background: Rgb;
  blade: Rgb;
  /** The marked blade (blade 0), so whole turns can be told from pitch steps. */
  mark: Rgb;
  hub: Rgb;
  /** Blade width as a share of the pitch (0…1). */
  bladeDuty: number;
  /** Widest blade, degrees: keeps a single mark or a two-blade part from looking like a pie. */
  maxBladeDeg: number;
  /** Hub and blade-tip radii as shares of half the shorter side of the canvas. */
  hubRadius: number;
  tipRadius: number;
}

/** Our own neutral look, used until the view passes the screen's colours. */
export const defaultPreviewLook: Readonly<PreviewLook> = Object.freeze({
  background: [244, 241, 234] as Rgb,
  blade: [38, 70, 83] as Rgb,
  mark: [214, 96, 46] as Rgb,
  hub: [24, 40, 48] as Rgb,
  // 0.4 of a pitch reads as blades rather than slots at every count from 4 up.
  bladeDuty: 0.4,
  maxBladeDeg: 36,
  hubRadius: 0.16,
  tipRadius: 0.94,
});

/**
 * Blade width in pitches for `features` blades: the look's duty, narrowed so no blade is
 * wider than maxBladeDeg.
 * @example bladeDutyFor(1, defaultPreviewLook) // 0.1 (36° of a 360° pitch)
 */
export function bladeDutyFor(
  features: number,
  look: Pick<PreviewLook, 'bladeDuty' | 'maxBladeDeg'>,
): number {
  return Math.min(look.bladeDuty, (look.maxBladeDeg * features) / 360);
}
