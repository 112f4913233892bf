import { InputError, requireBetween, requireFiniteResult, requirePositive } from './InputError';

export type FlickerRisk = 'no-effect' | 'low-risk' | 'elevated';

/**
 * IEEE Std 1789-2015 recommended-practice lines, percent modulation allowed at flicker
 * frequency f (Hz). Low risk: 0.025·f below 90 Hz, 0.08·f from 90 Hz to 1250 Hz, no limit
 * above. No observable effect: 0.01·f below 90 Hz, 0.0333·f from 90 Hz to 3000 Hz, no limit above.
 * Boundaries: 90 Hz belongs to the upper segment; 1250 Hz and 3000 Hz still carry their line.
 */
export function flickerLimits(flickerHz: number): {
  lowRiskPercent: number;
  noEffectPercent: number;
} {
  const f = requirePositive(flickerHz, 'flicker frequency');
  const lowRiskPercent = f < 90 ? 0.025 * f : f <= 1250 ? 0.08 * f : 100;
  const noEffectPercent = f < 90 ? 0.01 * f : f <= 3000 ? 0.0333 * f : 100;
  return {
    lowRiskPercent: Math.min(lowRiskPercent, 100),
    noEffectPercent: Math.min(noEffectPercent, 100),
  };
}

/**
 * Flicker risk class of a light source by IEEE Std 1789-2015 (physics.md §6). A modulation
 * on a line counts on the lower-risk side (≤). Percent flicker = 100·(Lmax − Lmin)/(Lmax + Lmin).
 * Units: Hz, percent 0…100. Throws InputError for a frequency ≤ 0 or a modulation outside 0…100.
 * @example flickerRisk(120, 5) // 'low-risk' (no-effect line 4 %, low-risk line 9.6 %)
 */
export function flickerRisk(flickerHz: number, modulationPercent: number): FlickerRisk {
  const { lowRiskPercent, noEffectPercent } = flickerLimits(flickerHz);
  const m = requireBetween(modulationPercent, 'modulation (percent flicker)', 0, 100);
  if (m <= noEffectPercent) return 'no-effect';
  if (m <= lowRiskPercent) return 'low-risk';
  return 'elevated';
}

/**
 * Percent flicker from the highest and lowest light level: 100·(Lmax − Lmin)/(Lmax + Lmin)
 * (IES definition, as used by IEEE Std 1789-2015).
 * @example percentFlicker(150, 50) // 50
 */
export function percentFlicker(maxLevel: number, minLevel: number): number {
  const hi = requirePositive(maxLevel, 'highest light level');
  const lo = requireBetween(minLevel, 'lowest light level', 0, hi);
  // Halve huge levels first so that hi + lo cannot overflow (exact at that size).
  const [h, l] = hi > 8e307 ? [hi / 2, lo / 2] : [hi, lo];
  return 100 * ((h - l) / (h + l));
}

/** One sinusoidal component of the light: frequency (Hz) and amplitude relative to the mean (0…1+). */
export interface LightComponent {
  frequencyHz: number;
  amplitude: number;
}

/**
 * Visibility threshold of the stroboscopic effect at f, as given in physics.md §6 for the
 * CIE TN 006:2016 stroboscopic visibility measure: T(f) = 2.865e-5·f^1.543 + 0.225.
 */
export function svmThreshold(frequencyHz: number): number {
  const f = requirePositive(frequencyHz, 'flicker frequency');
  return requireFiniteResult(2.865e-5 * Math.pow(f, 1.543) + 0.225, 'flicker frequency');
}

/**
 * Stroboscopic visibility measure, CIE TN 006:2016 (physics.md §6): SVM = (Σ (C/T(f))^3.7)^(1/3.7);
 * SVM = 1 is the visibility threshold for the average observer.
 * Throws InputError for no components, a frequency ≤ 0 or a negative amplitude.
 * @example svm([{ frequencyHz: 100, amplitude: 0.26 }]) // 1.000292193008748 (just above the threshold)
 */
export function svm(components: LightComponent[]): number {
  if (!Array.isArray(components) || components.length === 0) {
    throw new InputError(
      'light components',
      'Give at least one flicker component (frequency and amplitude).',
    );
  }
  let sum = 0;
  components.forEach((c, i) => {
    const T = svmThreshold(requirePositive(c?.frequencyHz, `frequency of component ${i + 1}`));
    const C = requireBetween(c?.amplitude, `amplitude of component ${i + 1}`, 0, 10);
    sum += Math.pow(C / T, 3.7);
  });
  return Math.pow(sum, 1 / 3.7);
}
