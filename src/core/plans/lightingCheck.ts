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
import { plainNumber } from '../basics/plainNumber';
import { safetyCautions } from './safetyCautions';

/** A lamp on the mains, as the lighting check sees it (physics.md §6). */
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
   * tolerance (physics.md §4: still, slowed, several images, backward, unclear): the stillness
   * caution goes with it.
   */
  aliased: boolean;
  /** Misleading under flicker people can see (SVM ≥ 1): a hazard. */
  hazard: boolean;
  verdict: LightingVerdict;
  /** In plain words. */
  text: string;
}

export interface LightingCheck {
  flickerHz: number;
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
  summary: string;
  /** What to do about it, in our words (empty when the verdict is 'fine'). */
  remedies: string[];
  /** Safety cautions that apply (physics.md §10). */
  cautions: string[];
}

const SEVERITY: Record<Look, number> = { true: 0, forward: 1, unclear: 2, backward: 3, still: 4 };

/**
 * How a lamp's flicker shows the parts of a machine (physics.md §6): the flicker frequency
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
 * Perz et al. (2018), physics.md §2–§3 (looks).
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

  const rows = parts.map((p, i) =>
    partUnderLight(p, i, flickerHz, flickers, visible, visibility, look),
  );
  const verdict: LightingVerdict = rows.some((r) => r.hazard)
    ? 'hazard'
    : rows.some((r) => r.verdict === 'caution') || risk === 'elevated'
      ? 'caution'
      : 'fine';

  return {
    flickerHz,
    risk,
    lowRiskPercent,
    noEffectPercent,
    svm: visibility,
    harmonics,
    visible,
    parts: rows,
    verdict,
    summary: summarise(verdict, flickerHz, modulation, risk, visibility, rows),
    remedies: verdict === 'fine' ? [] : remedies(lamp, flickerHz, noEffectPercent),
    cautions: safetyCautions({
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

function partUnderLight(
  raw: LitPart,
  index: number,
  flickerHz: number,
  flickers: boolean,
  visible: boolean,
  visibility: number,
  look: LookOptions,
): PartUnderLight {
  const part = checkPart(raw, `part ${index + 1}`);
  const name =
    typeof raw.name === 'string' && raw.name.trim() !== '' ? raw.name.trim() : `part ${index + 1}`;
  if (!flickers) {
    // Steady light samples nothing: every part looks as it truly turns (physics.md §6).
    return {
      name,
      look: 'true',
      apparentRpm: hzToRpm(part.speedHz),
      worstLook: 'true',
      images: 1,
      misleading: false,
      aliased: false,
      hazard: false,
      verdict: 'fine',
      text: `${name}: the light does not flicker, so it looks as it is (${plainNumber(Math.abs(hzToRpm(part.speedHz)))} rpm).`,
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
  const text = describePart(
    name,
    part.speedHz,
    worstLook,
    images,
    nominal.look,
    apparentRpm,
    flickers,
    visible,
    visibility,
    verdict,
  );
  return {
    name,
    look: nominal.look,
    apparentRpm,
    worstLook,
    images,
    misleading,
    aliased: worstLook !== 'true' || nominal.images > 1,
    hazard,
    verdict,
    text,
  };
}

function describePart(
  name: string,
  speedHz: number,
  worst: Look,
  images: number,
  nominal: Look,
  apparentRpm: number,
  flickers: boolean,
  visible: boolean,
  visibility: number,
  verdict: LightingVerdict,
): string {
  const trueSpeed = `${plainNumber(Math.abs(hzToRpm(speedHz)))} rpm`;
  if (!flickers) return `${name}: the light does not flicker, so it looks as it is (${trueSpeed}).`;
  const how =
    worst === 'still'
      ? images === 1
        ? 'look still'
        : `show ${images} images standing still`
      : worst === 'backward'
        ? 'look as if it turns backward'
        : 'look as if it turns with no clear direction';
  if (verdict === 'hazard') {
    return `${name} can ${how} under this light although it turns at ${trueSpeed}. Hazard: the flicker is visible (SVM ${plainNumber(visibility)}).`;
  }
  if (verdict === 'caution') {
    return (
      `${name} can ${how} under this light although it turns at ${trueSpeed}. The flicker is below the ` +
      `average observer's threshold (SVM ${plainNumber(visibility)} < 1), but some people may still see it.`
    );
  }
  const seen =
    nominal === 'true'
      ? 'turns the right way at its true speed'
      : `turns the right way, though it seems slower (${plainNumber(Math.abs(apparentRpm))} rpm)`;
  return `${name} ${seen}${visible ? '; the flickering motion is visible' : ''}.`;
}

function summarise(
  verdict: LightingVerdict,
  flickerHz: number,
  modulation: number,
  risk: FlickerRisk,
  visibility: number,
  rows: PartUnderLight[],
): string {
  const light =
    modulation === 0
      ? 'The light does not flicker.'
      : `The light flickers at ${plainNumber(flickerHz)} Hz with ${plainNumber(modulation)} % modulation: ` +
        `${riskWords(risk)} by IEEE Std 1789-2015, SVM ${plainNumber(visibility)}.`;
  if (verdict === 'hazard') {
    const names = rows.filter((r) => r.hazard).map((r) => r.name);
    return `${light} Hazard: ${names.join(', ')} can look still or backward while turning.`;
  }
  if (verdict === 'caution') {
    const names = rows.filter((r) => r.verdict === 'caution').map((r) => r.name);
    return names.length > 0
      ? `${light} Caution: ${names.join(', ')} can look misleading to some people.`
      : `${light} Caution: the flicker itself is above the IEEE 1789 low-risk line.`;
  }
  return `${light} No part looks still or backward under it.`;
}

function riskWords(risk: FlickerRisk): string {
  return risk === 'no-effect'
    ? 'no observable effect'
    : risk === 'low-risk'
      ? 'low risk'
      : 'above the low-risk line';
}

function remedies(lamp: Lamp, flickerHz: number, noEffectPercent: number): string[] {
  const out = [
    `Use lamps whose drivers do not flicker at this rate: electronic drivers that run the lamp at high frequency, ` +
      `or low-flicker LED drivers (at ${plainNumber(flickerHz)} Hz the IEEE 1789 no-observable-effect line is ` +
      `${plainNumber(noEffectPercent)} %).`,
  ];
  if (lamp.flicker === 'double' || lamp.flicker === 'mains') {
    out.push(
      'Where several lamps light the machine, connect neighbouring lamps to different phases of a three-phase ' +
        'supply: their flicker peaks fall at different moments and largely cancel.',
    );
  } else {
    out.push(
      "Raise the dimmer's switching frequency, or run the lamps undimmed where the dimmer then stops switching.",
    );
  }
  out.push(
    'Light the working area of the machine with a task lamp on a steady source, so the flickering light no longer dominates.',
  );
  out.push('Local lighting rules and machinery-safety rules take precedence over this check.');
  return out;
}
