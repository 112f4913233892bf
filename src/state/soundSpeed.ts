// The speed finder's second method, by sound (docs/physics.md §11): what was heard, the speeds
// it holds for the part as set now, and their join with the strobe readings. The sound code is
// kept out of the first paint: the screen hands its functions over (soundCore) when the
// by-sound panel loads them, and only types are imported here. Nothing here holds audio: the
// spectrum is kept, in memory only, so that a change of the part or the expected speed reads
// it again without another recording.
import { computed, signal } from '@preact/signals';
import {
  apparentMotion,
  type joinSoundWithStrobe,
  type Look,
  type SoundSpectrum,
  type SoundSpeeds,
  type SoundStrobeJoin,
  type SoundStrobeMatch,
  type speedsFromSound,
  type StepCandidate,
} from '../core';
import { attempt, keepLastGood } from './outcome';
import {
  expectation,
  expectedRange,
  featuresInUse,
  finderStep,
  readings,
  strobeRangeHz,
} from './speedFinder';

/** The core's sound functions the state needs, once their code has loaded. */
export interface SoundCore {
  speedsFromSound: typeof speedsFromSound;
  joinSoundWithStrobe: typeof joinSoundWithStrobe;
}

/** Set by the screen when the sound code has loaded; null until then. */
export const soundCore = signal<SoundCore | null>(null);

/** What was heard: the spectrum of a recording (the samples themselves are dropped once analysed). */
export interface HeardSound {
  spectrum: SoundSpectrum;
  source: 'microphone' | 'file';
  /** The picked file's name, for a file. */
  fileName?: string;
  /** When it was heard, ms since 1970 (for the note on the part's speed). */
  heardAtMs: number;
}

export const heardSound = signal<HeardSound | null>(null);

/** Whether the by-sound panel is open (its code loads the first time it opens). */
export const soundPanelOpen = signal(false);

/** Forgets what was heard: the spectrum goes, and with it every speed it gave. */
export function forgetSound(): void {
  heardSound.value = null;
}

/**
 * The speeds the sound holds for the part as set now (its features, the expected speed, the
 * mains of a motor nameplate); the last good ones while the core refuses the entries.
 */
export const soundSpeeds = keepLastGood<SoundSpeeds | undefined>(() => {
  const heard = heardSound.value;
  const core = soundCore.value;
  if (!heard || !core) return undefined;
  const e = expectation.value;
  return core.speedsFromSound(heard.spectrum, {
    symmetry: featuresInUse.value,
    expect: expectedRange(e),
    ...(e.mode === 'motor' ? { mainsHz: e.mainsHz } : {}),
  });
});

/**
 * The sound joined with the strobe readings (joinSoundWithStrobe): the speeds both allow and
 * the rate that confirms the one they agree on. Undefined while nothing was heard or the sound
 * gave no speed. Every speed that fits the readings takes part, those the strobe procedure
 * rules out too: that ruling assumes a sweep from the top, and a sound-guided reading is not one.
 */
export const soundJoin = keepLastGood<SoundStrobeJoin | undefined>(() => {
  const speeds = soundSpeeds.result.value;
  const core = soundCore.value;
  if (!speeds || !core || speeds.candidates.length === 0 || !heardSound.value) return undefined;
  const strobe =
    readings.value.length > 0 ? (finderStep.result.value?.candidates ?? []) : undefined;
  // Readings that fit no speed at all: the strobe's own step says so; the sound cannot mend them.
  if (strobe && strobe.length === 0) return undefined;
  return core.joinSoundWithStrobe(speeds.candidates, strobe, {
    symmetry: featuresInUse.value,
    rateRange: strobeRangeHz.value,
  });
});

/** A speed that fits the strobe readings, with what the sound says of it. */
export interface HeardCandidate extends StepCandidate {
  /** The sound speed it agrees with; absent when nothing heard fits it. */
  heard?: SoundStrobeMatch;
  /** The speed the sound and the readings point to together. */
  lead: boolean;
  /** What it would show at the rate the join proposes. */
  atSoundRate?: { images: number; look: Look };
}

/**
 * The strobe's candidates as the join sees them: the ones the sound agrees with first (in the
 * join's order), then the rest. Undefined until there are readings and a sound to join them with.
 */
export const heardCandidates = computed<HeardCandidate[] | undefined>(() => {
  const join = soundJoin.result.value;
  const step = finderStep.result.value;
  if (!join || !step || readings.value.length === 0 || join.status === 'sound-only')
    return undefined;
  const n = featuresInUse.value;
  const rate = join.nextRateHz;
  const lead = join.status === 'one' || join.status === 'several' ? join.matches[0] : undefined;
  const rows = step.candidates.map((c): HeardCandidate => {
    const heard = join.matches.find((m) => m.strobeSpeedHz === c.speedHz);
    const view =
      rate === undefined
        ? undefined
        : attempt(() => apparentMotion({ speedHz: c.speedHz, symmetry: n }, rate));
    return {
      ...c,
      ...(heard ? { heard } : {}),
      lead: lead !== undefined && lead.strobeSpeedHz === c.speedHz,
      ...(view?.ok ? { atSoundRate: { images: view.result.images, look: view.result.look } } : {}),
    };
  });
  const order = (r: HeardCandidate) =>
    r.heard ? join.matches.indexOf(r.heard) : join.matches.length + rows.indexOf(r);
  return rows.sort((a, b) => order(a) - order(b));
});
