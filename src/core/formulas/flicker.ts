import {
  InputError,
  requireBetween,
  requireFiniteResult,
  requirePositive,
} from '../basics/InputError';

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
 * Flicker risk class of a light source by IEEE Std 1789-2015 (docs/physics.md §6). A modulation
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
 * Visibility threshold of the stroboscopic effect for the standard observer at frequency f
 * (Hz), as a modulation amplitude relative to the mean: the power fit
 * T(f) = 2.865e-5·f^1.543 + 0.225 of Perz, Vogels, Sekulovski, Wang and Hu, "Stroboscopic
 * effect: contrast threshold function and dependence on illumination level", JOSA A 35(2):309
 * (2018). The SVM of CIE TN 006:2016 divides each component by it.
 * @example svmThreshold(100) // 0.2599… (2.865e-5 · 100^1.543 + 0.225)
 */
export function svmThreshold(frequencyHz: number): number {
  const f = requirePositive(frequencyHz, 'flicker frequency');
  return requireFiniteResult(2.865e-5 * Math.pow(f, 1.543) + 0.225, 'flicker frequency');
}

/**
 * Stroboscopic visibility measure, CIE TN 006:2016 (docs/physics.md §6): SVM = (Σ (C/T(f))^3.7)^(1/3.7),
 * T(f) the Perz et al. (2018) threshold fit (svmThreshold); SVM = 1 is the visibility
 * threshold for the average observer. Give the components up to 2 kHz (lightHarmonics).
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

/**
 * The shape of a lamp's light over one flicker period (docs/physics.md §6):
 * 'sine': L = L₀·(1 + M·cos ωt), the shape most flicker figures assume;
 * 'rectangular': PWM, on at the high level for `dutyCycle` of each period, at the low level otherwise;
 * 'rectified': the full-wave rectified sine of a plain driver, L = B + A·|sin(ωt/2)|, whose
 *   humps repeat at the flicker frequency (twice the mains).
 */
export type LightShape = 'sine' | 'rectangular' | 'rectified';

export interface LightWave {
  shape: LightShape;
  /** Share of each period a rectangular wave spends at its high level, strictly between 0 and 1. */
  dutyCycle?: number;
}

/** The CIE TN 006:2016 SVM counts the light's Fourier components up to this frequency. */
export const SVM_MAX_HZ = 2000;
/** Most harmonics listed: a flicker below 1 Hz is not a stroboscopic light. */
const MAX_HARMONICS = 2000;

/**
 * The light's Fourier components (amplitude relative to the mean) at the flicker frequency and
 * its harmonics up to `upToHz`, for a wave of percent flicker M = 100·(Lmax − Lmin)/(Lmax + Lmin).
 * How M sets each shape (levels normalised so that Lmax + Lmin = 2):
 * - sine: levels 1 ± M; one component, C₁ = M;
 * - rectangular, duty D: levels 1 ± M, mean 1 − M + 2·M·D; the pulse train's series gives
 *   C_m = 4·M·|sin(m·π·D)| / (m·π·(1 − M + 2·M·D)), which for a 0-to-1 wave (M = 1) is
 *   2·|sin(m·π·D)|/(m·π·D): a 50 % square wave's fundamental is 4/π times a sine's;
 * - rectified: L = B + A·|sin|, Lmin = B, Lmax = B + A, so B = A·(1 − M)/(2·M); from
 *   |sin x| = 2/π − (4/π)·Σ cos(2kx)/(4k² − 1), C_k = (4/π)/((4k² − 1)·(B/A + 2/π)), which is
 *   2/(4k² − 1) for M = 1 (C₁ = 2/3).
 * Steady light (M = 0) has no components. At most 2000 harmonics.
 *
 * Throws InputError for an unknown shape, a duty outside (0, 1) for a rectangular wave, a
 * frequency ≤ 0 or a modulation outside 0…100.
 * @example lightHarmonics({ shape: 'rectangular', dutyCycle: 0.5 }, 100, 100, 300)
 * // [{ frequencyHz: 100, amplitude: 1.2732… (4/π) }, { frequencyHz: 200, amplitude: ~0 }, { frequencyHz: 300, amplitude: 0.4244… (4/3π) }]
 *
 * Sources: the Fourier series of a rectangular pulse train (coefficients 2·sin(mπD)/(mπ) for a
 * unit pulse) and of the full-wave rectified sine, as in tables of Fourier series (recalled;
 * both are checked against an FFT, fft.js, in the tests).
 */
export function lightHarmonics(
  wave: LightWave,
  flickerHz: number,
  modulationPercent: number,
  upToHz: number = SVM_MAX_HZ,
): LightComponent[] {
  const shape = checkShape(wave);
  const f0 = requirePositive(flickerHz, 'flicker frequency');
  const M = requireBetween(modulationPercent, 'modulation (percent flicker)', 0, 100) / 100;
  const top = requirePositive(upToHz, 'highest frequency counted');
  if (M === 0) return [];
  const count = Math.min(MAX_HARMONICS, Math.floor((top / f0) * (1 + 1e-12)));
  const out: LightComponent[] = [];
  if (shape === 'sine') {
    if (count >= 1) out.push({ frequencyHz: f0, amplitude: M });
    return out;
  }
  if (shape === 'rectangular') {
    const D = requireBetween(wave.dutyCycle, 'duty cycle', 0, 1);
    if (D === 0 || D === 1) {
      throw new InputError(
        'duty cycle',
        'The duty cycle must lie between 0 and 100 %, ends not included.',
      );
    }
    const mean = 1 - M + 2 * M * D;
    for (let m = 1; m <= count; m++) {
      const amplitude = (4 * M * Math.abs(Math.sin(m * Math.PI * D))) / (m * Math.PI * mean);
      out.push({ frequencyHz: m * f0, amplitude });
    }
    return out;
  }
  const floorPerHump = (1 - M) / (2 * M); // B/A
  for (let k = 1; k <= count; k++) {
    const amplitude = 4 / Math.PI / ((4 * k * k - 1) * (floorPerHump + 2 / Math.PI));
    out.push({ frequencyHz: k * f0, amplitude });
  }
  return out;
}

function checkShape(wave: LightWave): LightShape {
  const shape = typeof wave === 'object' && wave !== null ? wave.shape : undefined;
  if (shape === 'sine' || shape === 'rectangular' || shape === 'rectified') return shape;
  throw new InputError(
    'light waveform',
    "The light's waveform must be 'sine', 'rectangular' (PWM) or 'rectified' (a plain driver).",
  );
}

/**
 * SVM of a lamp's light (CIE TN 006:2016 with the Perz et al. 2018 threshold): its harmonics up
 * to 2 kHz (lightHarmonics) combined by svm. 0 for steady light, and for a flicker above 2 kHz,
 * which has no component the measure counts.
 * @example lightSvm({ shape: 'sine' }, 100, 26) // 1.0002… (as svm([{ frequencyHz: 100, amplitude: 0.26 }]))
 */
export function lightSvm(wave: LightWave, flickerHz: number, modulationPercent: number): number {
  const components = lightHarmonics(wave, flickerHz, modulationPercent);
  return components.length === 0 ? 0 : svm(components);
}
