// The speed by sound in words (docs/physics.md §11): how sure each speed is, why no speed was
// heard, what went wrong while getting the sound, what each speed was heard as, the hum, and
// where an applied speed came from. Built from the core's and the capture's codes and numbers.
import type { HumLine, SoundConfidence, SoundSpeedCandidate, SoundSpeeds } from '../core';
import type { SoundCaptureProblem } from '../audio';
import {
  toleranceFromPrecision,
  type FinderPartKind,
  type HeardOrigin,
} from '../state/speedFinder';
import type { FileLimits, HeardSound } from '../state/soundSpeed';
import { formatNumber } from './format';

/** How sure a speed is, as a short label and a sentence that says what it means. */
export const CONFIDENCE_WORDS: Readonly<
  Record<SoundConfidence, { label: string; meaning: string }>
> = {
  clear: {
    label: 'Clear',
    meaning: 'Two or more lines agree, and no other speed fits the sound nearly as well.',
  },
  likely: {
    label: 'Likely',
    meaning:
      'The best fit, but another speed fits almost as well, or it rests on a single line. One strobe reading settles it.',
  },
  tied: {
    label: 'Tied',
    meaning:
      'Another speed fits the sound just as well: the sound alone cannot choose. An expected speed or one strobe reading settles it.',
  },
  possible: {
    label: 'Possible',
    meaning: 'Fits the sound clearly worse than the best; kept because it still explains lines.',
  },
  faint: {
    label: 'Faint',
    meaning:
      'Its strongest line stands less than 16 dB above the noise: hold the phone nearer the part and listen again.',
  },
};

/** Why no speed came out of a recording. */
export type NoToneReason = NonNullable<SoundSpeeds['noTone']>;

/**
 * Why no speed was heard, and what to do about it.
 * @example noToneWords('hum-only', { minHz: 2, maxHz: 250 }) // "Only mains hum was heard …"
 */
export function noToneWords(reason: NoToneReason, searchedHz: { minHz: number; maxHz: number }) {
  switch (reason) {
    case 'silent':
      return 'Nothing was heard: the recording is silent. Check that the microphone is not covered or muted, and hold the phone nearer the part.';
    case 'no-lines':
      return 'No tone stands out of the noise. Hold the phone nearer the part (outside its guard), away from other machines, and listen again.';
    case 'hum-only':
      return 'Only mains hum was heard (lines at multiples of the supply frequency), nothing of the part. Move nearer the part, away from transformers and lamps, and listen again.';
    case 'no-match':
      return (
        `Tones were heard, but none fits a speed between ${formatNumber(searchedHz.minHz * 60)} and ` +
        `${formatNumber(searchedHz.maxHz * 60)} rpm with this count of features. Check the count and the expected speed.`
      );
  }
}

/** A recording that reached full scale: the speed usually survives, but the screen says so. */
export const CLIPPED_WORDS =
  'The recording reached full scale (it is clipped): distortion adds lines at the same multiples, so the speed usually survives, but hold the phone a little farther away and listen again to be sure.';

/** Where the sound goes: nowhere. Shown beside the Listen button. */
export const PRIVACY_WORDS =
  'The sound stays on this phone: it is analysed here and never sent or stored. Only the speed found is kept.';

/** The way round a microphone that cannot be used. */
const FILE_ROUTE =
  'You can record with the phone’s own voice recorder instead and open the file with “Analyse a recording”.';

/**
 * What went wrong while getting the sound, in a sentence with what to do next. Microphone
 * problems point to the file route.
 * @example captureProblemWords('mic-absent', limits) // "No microphone was found on this device. You can record …"
 */
export function captureProblemWords(code: SoundCaptureProblem, limits: FileLimits): string {
  switch (code) {
    case 'mic-refused':
      return `The microphone was refused. Allow it for this page in the browser’s site settings, then press Listen again. ${FILE_ROUTE}`;
    case 'mic-absent':
      return `No microphone was found on this device. ${FILE_ROUTE}`;
    case 'mic-busy':
      return `The microphone is in use by another app or could not be started. Close the other app and press Listen again. ${FILE_ROUTE}`;
    case 'mic-unavailable':
      return `The microphone could not be opened. ${FILE_ROUTE}`;
    case 'no-audio-support':
      return `This browser cannot record sound here (it needs a secure page and audio worklets). ${FILE_ROUTE}`;
    case 'too-short':
      return 'Too little was recorded: at least half a second is needed, and 4 seconds is best. Press Listen and let it run.';
    case 'silence':
      return 'Nothing was heard: the recording is silent. Check that the microphone is not covered or muted, and hold the phone nearer the part.';
    case 'clipping':
      return 'The sound was too loud for the microphone (the recording is clipped). Hold the phone a little farther from the part and listen again, or analyse this recording anyway.';
    case 'cancelled':
      return 'Listening was stopped before anything was kept.';
    case 'not-audio':
      return 'This file is not a recording this browser can read. Pick a sound file, for example one from the phone’s voice recorder.';
    case 'file-too-large':
      return `The file is larger than ${formatNumber(limits.maxFileBytes / 1024 / 1024)} MB, the most read here. Trim it to a minute or so where the part runs steadily.`;
    case 'file-too-long':
      return `The recording is longer than ${formatNumber(limits.maxRecordingS / 60)} minutes, the longest read here. Trim it to a stretch where the part runs steadily.`;
  }
}

/** The features of a part of this kind, for labels and sentences. */
export const FEATURE_WORDS: Readonly<Record<FinderPartKind, { one: string; many: string }>> = {
  fan: { one: 'blade', many: 'blades' },
  gear: { one: 'tooth', many: 'teeth' },
  other: { one: 'feature', many: 'features' },
};

/** The tone a part of this kind sings at n·f (common practice in machinery diagnostics). */
export const TONE_NAMES: Readonly<Record<FinderPartKind, string>> = {
  fan: 'blade-pass tone',
  gear: 'gear-mesh tone',
  other: 'pattern tone',
};

/**
 * What a speed was heard as: its strongest line and how many more lines agree.
 * @example heardAsWords(fan1750, 'fan') // "blade-pass tone at 175 Hz, with 2 harmonics and a shaft line"
 */
export function heardAsWords(c: SoundSpeedCandidate, kind: FinderPartKind): string {
  const pattern = c.lines.filter((l) => l.kind === 'pattern').length;
  const shaft = c.lines.filter((l) => l.kind === 'shaft').length;
  const some = (n: number, one: string, many: string) => (n === 1 ? `a ${one}` : `${n} ${many}`);
  if (c.basis === 'shaft') {
    const more = shaft - 1;
    let text = `shaft line at ${formatNumber(c.toneHz)} Hz`;
    if (more > 0) text += `, with ${more === 1 ? 'one more' : `${more} more`}`;
    if (pattern > 0) text += `${more > 0 ? ' and' : ', with'} the ${TONE_NAMES[kind]}`;
    return text;
  }
  const extras = [
    ...(pattern > 1 ? [some(pattern - 1, 'harmonic', 'harmonics')] : []),
    ...(shaft > 0 ? [some(shaft, 'shaft line', 'shaft lines')] : []),
  ];
  const text = `${TONE_NAMES[kind]} at ${formatNumber(c.toneHz)} Hz`;
  return extras.length ? `${text}, with ${extras.join(' and ')}` : `${text} alone`;
}

/**
 * A speed heard and its precision, as figures: the precision in rpm rounded up to two
 * significant figures (never claiming more than was measured), the speed to the same decimals
 * (at most two), and the precision as ± percent of the speed, as it becomes the part's
 * tolerance (toleranceFromPrecision).
 * @example speedFigures({ speedHz: 29.1572, precisionHz: 0.00132 }) // { rpm: '1,749.43', plusMinus: '0.08', percent: '0.0046' }
 */
export function speedFigures(c: { speedHz: number; precisionHz: number }): {
  rpm: string;
  plusMinus: string;
  percent: string;
} {
  const p = Math.abs(c.precisionHz * 60);
  const percent = formatNumber(toleranceFromPrecision(c.speedHz, c.precisionHz));
  if (!(p > 0) || !Number.isFinite(p)) {
    return { rpm: formatNumber(c.speedHz * 60), plusMinus: formatNumber(p), percent };
  }
  const lead = Math.floor(Math.log10(p));
  const decimals = Math.max(0, Math.min(2, 1 - lead));
  const step = 10 ** (lead - 1);
  const rounded = Math.ceil(p / step - 1e-9) * step;
  return {
    rpm: formatNumber(c.speedHz * 60, decimals),
    plusMinus: formatNumber(rounded, Math.max(decimals, 1 - lead)),
    percent,
  };
}

/**
 * A speed heard, with its precision in rpm and in percent.
 * @example soundSpeedWords({ speedHz: 29.1572, precisionHz: 0.00132 }) // "1,749.43 rpm ± 0.08 rpm (±0.0046 %)"
 */
export function soundSpeedWords(c: { speedHz: number; precisionHz: number }): string {
  const { rpm, plusMinus, percent } = speedFigures(c);
  return `${rpm} rpm ± ${plusMinus} rpm (±${percent} %)`;
}

/**
 * A mains hum line, marked as such.
 * @example humWords({ hz: 100, mainsHz: 50, harmonic: 2 }) // "Mains hum at 100 Hz (2 × 50 Hz)"
 */
export function humWords(h: Pick<HumLine, 'hz' | 'mainsHz' | 'harmonic'>): string {
  const which = h.harmonic === 1 ? `the ${h.mainsHz} Hz supply` : `${h.harmonic} × ${h.mainsHz} Hz`;
  return `Mains hum at ${formatNumber(h.hz)} Hz (${which})`;
}

/**
 * Where the sound came from and how much of it was read.
 * @example heardFromWords({ source: 'microphone', spectrum: { durationS: 4, analysedS: 4 } }) // "4 s from the microphone"
 */
export function heardFromWords(
  heard: Pick<HeardSound, 'source' | 'fileName'> & {
    spectrum: { durationS: number; analysedS: number };
  },
): string {
  const seconds = (s: number) =>
    s < 120 ? `${formatNumber(s, 1)} s` : `${formatNumber(s / 60, 0)} minutes`;
  const from =
    heard.source === 'microphone' ? 'from the microphone' : `from “${heard.fileName ?? 'a file'}”`;
  const whole = `${seconds(heard.spectrum.durationS)} ${from}`;
  return heard.spectrum.analysedS < heard.spectrum.durationS - 0.05
    ? `${whole} (its middle ${seconds(heard.spectrum.analysedS)} read)`
    : whole;
}

/**
 * A day as the origin note writes it: "12 Dec".
 * @example dayWords(Date.UTC(2025, 11, 12, 12)) // "12 Dec"
 */
export function dayWords(ms: number): string {
  return new Date(ms).toLocaleDateString('en-GB', { day: 'numeric', month: 'short' });
}

/**
 * Where a speed applied to the part came from, with its tolerance.
 * @example heardOriginWords({ method: 'sound', precisionHz: 0.01, heardAtMs }, 0.035) // "by sound, 12 Dec, ±0.035 %"
 */
export function heardOriginWords(origin: HeardOrigin, tolerancePercent: number): string {
  const how = origin.method === 'sound' ? 'by sound' : 'by sound, confirmed by strobe';
  return `${how}, ${dayWords(origin.heardAtMs)}, ±${formatNumber(tolerancePercent)} %`;
}
