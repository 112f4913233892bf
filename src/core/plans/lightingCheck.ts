import { InputError, requireBetween, requirePositive } from '../basics/InputError';
import { checkPart, type Look, type Part } from '../basics/types';
import { checkLookOptions, type LookOptions } from '../physics/lookOptions';
import { apparentMotion } from '../physics/apparentMotion';
import { stillRates } from './freezeRates';
import {
  flickerLimits,
  flickerRisk,
  lightHarmonics,
  svm,
  type FlickerRisk,
  type LightComponent,
  type LightWave,
} from '../formulas/flicker';
import { hzToRpm } from '../formulas/units';
import { cautionCodes, type CautionCode } from './cautions';

/** A lamp on the mains, as the lighting check sees it (docs/physics.md §6). */
export interface Lamp {
  /** Mains frequency: 50 or 60 Hz. */
  mainsHz: number;
  /** 'double': twice the mains (most lamps on AC); 'mains': at the mains; or a frequency in Hz (PWM dimmers). */
  flicker: 'double' | 'mains' | number;
  /** Percent flicker, 100·(Lmax − Lmin)/(Lmax + Lmin), 0…100. */
  modulationPercent: number;
  /** The light's shape over a flicker period (lightHarmonics). Default: a sine. */
  waveform?: LightWave;
}

/** A part of the machine under the light. */
export interface LitPart extends Part {
  name?: string;
}

export type LightingVerdict = 'fine' | 'caution' | 'hazard';

export interface PartUnderLight {
  name: string;
  /** The part's own signed speed, rev/s: how it really turns. */
  speedHz: number;
  /** What the part shows at its nominal speed. */
  look: Look;
  /** Signed apparent speed at its nominal speed, rpm (0 when it looks still). */
  apparentRpm: number;
  /** The most misleading look for any speed within its tolerance (still > backward > unclear > forward > true). */
  worstLook: Look;
  /** Images standing still in the worst look (1 otherwise). */
  images: number;
  /** It can look still, backward or of unclear direction. */
  misleading: boolean;
  /**
   * The flickering light shows it other than as it truly turns, at some speed within its
   * tolerance (docs/physics.md §4: still, slowed, several images, backward, unclear): the stillness
   * caution goes with it.
   */
  aliased: boolean;
  /** Misleading under flicker people can see (SVM ≥ 1): a hazard. */
  hazard: boolean;
  verdict: LightingVerdict;
}

/**
 * What to do about a misleading light, by code (src/words/lighting.ts says each in words):
 * drivers that do not flicker at this rate; neighbouring lamps on different phases (for mains
 * flicker); a faster dimmer (for a dimmer's own flicker); a task lamp on a steady source; and
 * local rules first.
 */
export type LightingRemedy =
  'steady-drivers' | 'split-phases' | 'faster-dimmer' | 'task-lamp' | 'local-rules';

export interface LightingCheck {
  flickerHz: number;
  /** Percent flicker of the lamp, as given (0: steady light, which samples nothing). */
  modulationPercent: number;
  /** IEEE Std 1789-2015 class of the flicker (see flickerRisk). */
  risk: FlickerRisk;
  /** IEEE Std 1789-2015 lines at this frequency, percent. */
  lowRiskPercent: number;
  noEffectPercent: number;
  /**
   * Stroboscopic visibility measure (CIE TN 006:2016, threshold fit of Perz et al. 2018) of the
   * light's harmonics up to 2 kHz for its waveform (lightSvm).
   */
  svm: number;
  /** The components the SVM counts: the flicker frequency and its harmonics up to 2 kHz, relative to the mean. */
  harmonics: LightComponent[];
  /** SVM ≥ 1: the average observer sees the stroboscopic effect. */
  visible: boolean;
  parts: PartUnderLight[];
  verdict: LightingVerdict;
  /** What to do about it, most telling first (empty when the verdict is 'fine'). */
  remedies: LightingRemedy[];
  /** Safety cautions that apply (docs/physics.md §10). */
  cautions: CautionCode[];
}

/** What every part is checked against: the light, and the judgements of how the eye reads it. */
interface Light {
  flickerHz: number;
  /** The light flickers at all (modulation above 0 %). */
  flickers: boolean;
  /** SVM ≥ 1: the average observer sees the stroboscopic effect. */
  visible: boolean;
  look: LookOptions;
}

const SEVERITY: Record<Look, number> = { true: 0, forward: 1, unclear: 2, backward: 3, still: 4 };

/**
 * How a lamp's flicker shows the parts of a machine (docs/physics.md §6): the flicker frequency
 * (twice the mains, the mains, or a custom rate), its IEEE Std 1789-2015 risk and the CIE TN
 * 006:2016 SVM of the light's harmonics up to 2 kHz for its waveform (sine unless given;
 * threshold fit of Perz et al., JOSA A 35(2):309, 2018); for each part, what
 * it looks like under that light (apparentMotion, sampler 'flash') and the worst look for any
 * speed within its tolerance (still spans in closed form from stillRates, the other looks at
 * the band's ends and middle: between them a look can change only through a still lock).
 * A part that can look still, backward or of unclear direction under visible flicker
 * (SVM ≥ 1) is a hazard; under flicker below that threshold it is a caution.
 *
 * Units: Hz, percent, rev/s; the words use rpm. Throws InputError for mains other than 50 or
 * 60 Hz, an unknown flicker, a custom frequency ≤ 0, a modulation outside 0…100, no parts, a
 * bad part or bad look options.
 *
 * @example
 * // A two-jaw chuck on a 2-pole 50 Hz motor at its synchronous 3000 rpm (IEC 60034-1) under
 * // lamps flickering at 100 Hz with 30 % modulation: the jaws stand still. A hazard.
 * lightingCheck({ mainsHz: 50, flicker: 'double', modulationPercent: 30 },
 *   [{ name: 'chuck', speedHz: 50, symmetry: 2 }]).parts[0].worstLook // 'still'
 *
 * Steady light (0 % modulation) samples nothing: every part looks as it truly turns.
 *
 * Sources: IEEE Std 1789-2015 (risk lines), CIE TN 006:2016 (SVM) with the threshold fit of
 * Perz et al. (2018), docs/physics.md §2–§3 (looks).
 */
export function lightingCheck(
  lamp: Lamp,
  parts: LitPart[],
  opts?: Partial<LookOptions>,
): LightingCheck {
  if (typeof lamp !== 'object' || lamp === null) {
    throw new InputError(
      'lamp',
      'Give the mains frequency, how the lamp flickers and its modulation.',
    );
  }
  if (lamp.mainsHz !== 50 && lamp.mainsHz !== 60) {
    throw new InputError(
      'mains frequency',
      `The mains frequency must be 50 or 60 Hz (got ${String(lamp.mainsHz)}).`,
    );
  }
  const flickerHz = flickerFrequency(lamp);
  const modulation = requireBetween(lamp.modulationPercent, 'modulation (percent flicker)', 0, 100);
  if (!Array.isArray(parts) || parts.length === 0) {
    throw new InputError(
      'parts',
      'Give at least one part of the machine to check under this light.',
    );
  }
  const look = checkLookOptions(opts);
  const { lowRiskPercent, noEffectPercent } = flickerLimits(flickerHz);
  const risk = flickerRisk(flickerHz, modulation);
  const harmonics = lightHarmonics(lamp.waveform ?? { shape: 'sine' }, flickerHz, modulation);
  const visibility = harmonics.length === 0 ? 0 : svm(harmonics);
  const visible = visibility >= 1;
  const flickers = modulation > 0;

  const light: Light = { flickerHz, flickers, visible, look };
  const rows = parts.map((p, i) => partUnderLight(p, i, light));
  const verdict: LightingVerdict = rows.some((r) => r.hazard)
    ? 'hazard'
    : rows.some((r) => r.verdict === 'caution') || risk === 'elevated'
      ? 'caution'
      : 'fine';

  return {
    flickerHz,
    modulationPercent: modulation,
    risk,
    lowRiskPercent,
    noEffectPercent,
    svm: visibility,
    harmonics,
    visible,
    parts: rows,
    verdict,
    remedies:
      verdict === 'fine'
        ? []
        : [
            'steady-drivers',
            lamp.flicker === 'double' || lamp.flicker === 'mains'
              ? 'split-phases'
              : 'faster-dimmer',
            'task-lamp',
            'local-rules',
          ],
    cautions: cautionCodes({
      apparentStillness: rows.some((r) => r.aliased),
      flashRatesHz: flickers ? [flickerHz] : [],
    }),
  };
}

function flickerFrequency(lamp: Lamp): number {
  if (lamp.flicker === 'double') return 2 * lamp.mainsHz;
  if (lamp.flicker === 'mains') return lamp.mainsHz;
  if (typeof lamp.flicker === 'number') return requirePositive(lamp.flicker, 'flicker frequency');
  throw new InputError(
    'flicker',
    "The flicker must be 'double' (twice the mains), 'mains', or a frequency in Hz.",
  );
}

function partUnderLight(raw: LitPart, index: number, light: Light): PartUnderLight {
  const { flickerHz, flickers, visible, look } = light;
  const part = checkPart(raw, `part ${index + 1}`);
  const name =
    typeof raw.name === 'string' && raw.name.trim() !== '' ? raw.name.trim() : `part ${index + 1}`;
  if (!flickers) {
    // Steady light samples nothing: every part looks as it truly turns (docs/physics.md §6).
    return {
      name,
      speedHz: part.speedHz,
      look: 'true',
      apparentRpm: hzToRpm(part.speedHz),
      worstLook: 'true',
      images: 1,
      misleading: false,
      aliased: false,
      hazard: false,
      verdict: 'fine',
    };
  }
  const opts = { ...look, sampler: 'flash' as const };
  const nominal = apparentMotion(part, flickerHz, opts);
  const apparentRpm = nominal.look === 'still' ? 0 : hzToRpm(nominal.apparentHz);

  // Still anywhere in the tolerance band: the closed-form still spans around this one rate.
  const stills = stillRates(
    [part],
    { minHz: flickerHz * (1 - 1e-9), maxHz: flickerHz * (1 + 1e-9) },
    opts,
  );
  let worstLook: Look = nominal.look;
  let images = nominal.look === 'still' ? nominal.images : 1;
  if (stills.length > 0) {
    worstLook = 'still';
    images = Math.min(...stills.map((s) => s.images));
  } else {
    for (const speedHz of [
      part.speedHz * (1 - part.tolerance),
      part.speedHz * (1 + part.tolerance),
    ]) {
      const m = apparentMotion({ ...part, speedHz }, flickerHz, opts);
      if (SEVERITY[m.look] > SEVERITY[worstLook]) worstLook = m.look;
    }
  }
  const misleading =
    flickers && (worstLook === 'still' || worstLook === 'backward' || worstLook === 'unclear');
  const hazard = misleading && visible;
  const verdict: LightingVerdict = hazard ? 'hazard' : misleading ? 'caution' : 'fine';
  return {
    name,
    speedHz: part.speedHz,
    look: nominal.look,
    apparentRpm,
    worstLook,
    images,
    misleading,
    aliased: worstLook !== 'true' || nominal.images > 1,
    hazard,
    verdict,
  };
}
