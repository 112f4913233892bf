// The speed finder's second method, by sound (docs/physics.md §11): what was heard, the speeds
// it holds for the part as set now, and their join with the strobe readings. The sound code is
// kept out of the first paint: the screen hands its functions over (soundCore) when the
// by-sound panel loads them, and only types are imported here. Nothing here holds audio: the
// spectrum is kept, in memory only, so that a change of the part or the expected speed reads
// it again without another recording.
import { computed, signal } from '@preact/signals';
import type {
  ListenOptions,
  ListeningSession,
  SoundCaptureProblem,
  SoundRecording,
} from '../audio';
import {
  apparentMotion,
  type joinSoundWithStrobe,
  type Look,
  type soundSpectrum,
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
  saveFoundSpeed,
  strobeRangeHz,
  type SavedSpeed,
  type SaveTarget,
  type HeardOrigin,
} from './speedFinder';

/** The core's sound functions the state needs, once their code has loaded. */
export interface SoundCore {
  soundSpectrum: typeof soundSpectrum;
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

/** The limits a picked file is held to, for the sentences that name them. */
export interface FileLimits {
  maxFileBytes: number;
  maxRecordingS: number;
}

/**
 * Where sound comes from: the phone's microphone and picked files (screens/speed-finder/sound/
 * capture.ts), or a fake in the tests. Its failures are SoundCaptureErrors (src/audio); only
 * their shape is read here, so the capture code stays in the sound method's own chunk.
 */
export interface SoundCapture {
  /** Starts listening (from a user's action): a session that ends with a recording or a SoundCaptureError. */
  listen(opts: ListenOptions): ListeningSession;
  /** Decodes a picked file; rejects with a SoundCaptureError. */
  decodeFile(file: Blob): Promise<SoundRecording>;
  /** The limits a picked file is held to, for the sentences that name them. */
  limits: FileLimits;
}

/**
 * Where sound comes from: the phone's own microphone and files, set when the sound method's
 * code loads (load.ts), unless something was set before (the behaviour tests set a fake).
 */
export const soundCapture = signal<SoundCapture | null>(null);

/** Seconds recorded when nobody stops early: enough for a spectrum to 0.05 % (docs/physics.md §11). */
export const LISTEN_S = 4;

/** Where a recording came from. */
export interface SoundSource {
  source: 'microphone' | 'file';
  fileName?: string;
}

/**
 * Where getting the sound stands: idle (with or without a result in heardSound), listening,
 * analysing (a file being decoded, or any recording being read), or a problem. A problem
 * never clears what was heard before; a clipped recording is kept to analyse anyway.
 */
export type ListenStatus =
  | { kind: 'idle' }
  | { kind: 'listening'; recordedS: number; totalS: number }
  | { kind: 'analysing'; from: SoundSource }
  | {
      kind: 'problem';
      /** What went wrong: a capture problem, or 'unreadable' with the core's or the browser's words. */
      code: SoundCaptureProblem | 'unreadable';
      /** For 'unreadable' only: what the core or the browser said (capture problems are worded on screen). */
      message?: string;
      /** A clipped recording, kept to analyse anyway. */
      kept?: { recording: SoundRecording; from: SoundSource };
    };

export const listenStatus = signal<ListenStatus>({ kind: 'idle' });

let session: ListeningSession | null = null;
/** Counts the starts, so that an abandoned attempt's late answer is dropped. */
let attemptNo = 0;

/** A SoundCaptureError, told by its shape (the class lives in the lazy chunk). */
function captureCode(error: unknown): SoundCaptureProblem | undefined {
  return error instanceof Error && error.name === 'SoundCaptureError'
    ? (error as Error & { code: SoundCaptureProblem }).code
    : undefined;
}

/** Reads a recording into a spectrum (the samples are dropped here) and makes it what was heard. */
export function analyseRecording(recording: SoundRecording, from: SoundSource): void {
  const core = soundCore.peek();
  if (!core) {
    listenStatus.value = {
      kind: 'problem',
      code: 'unreadable',
      message: 'The sound method is not loaded yet: open it again in a moment.',
    };
    return;
  }
  listenStatus.value = { kind: 'analysing', from };
  const spectrum = attempt(() => core.soundSpectrum(recording.samples, recording.sampleRateHz));
  if (!spectrum.ok) {
    listenStatus.value = { kind: 'problem', code: 'unreadable', message: spectrum.message };
    return;
  }
  heardSound.value = {
    spectrum: spectrum.result,
    ...from,
    heardAtMs: Date.now(),
  };
  listenStatus.value = { kind: 'idle' };
}

function failed(error: unknown, from: SoundSource): void {
  const code = captureCode(error);
  if (code === undefined) {
    listenStatus.value = {
      kind: 'problem',
      code: 'unreadable',
      message: 'The sound could not be read in this browser.',
    };
    return;
  }
  if (code === 'cancelled') {
    listenStatus.value = { kind: 'idle' };
    return;
  }
  const recording = (error as { recording?: SoundRecording }).recording;
  listenStatus.value = {
    kind: 'problem',
    code,
    ...(recording ? { kept: { recording, from } } : {}),
  };
}

/** Listens for LISTEN_S seconds (call from the Listen button: browsers start audio only on a user's action). */
export function listen(capture: SoundCapture): void {
  session?.cancel();
  const mine = ++attemptNo;
  const from: SoundSource = { source: 'microphone' };
  const current = (): boolean => mine === attemptNo;
  listenStatus.value = { kind: 'listening', recordedS: 0, totalS: LISTEN_S };
  let started: ListeningSession;
  try {
    started = capture.listen({
      seconds: LISTEN_S,
      onProgress: (recordedS, totalS) => {
        if (current() && listenStatus.peek().kind === 'listening')
          listenStatus.value = { kind: 'listening', recordedS, totalS };
      },
    });
  } catch (error) {
    failed(error, from);
    return;
  }
  session = started;
  started.recording
    .then(
      (recording) => current() && analyseRecording(recording, from),
      (error: unknown) => current() && failed(error, from),
    )
    .finally(() => {
      if (session === started) session = null;
    });
}

/** Ends listening now and reads what was recorded so far. */
export function stopListening(): void {
  session?.stop();
}

/** Ends listening and drops the recording (leaving the screen): what was heard before stays. */
export function cancelListening(): void {
  attemptNo++;
  session?.cancel();
  session = null;
  if (listenStatus.peek().kind !== 'problem') listenStatus.value = { kind: 'idle' };
}

/** Decodes and reads a picked recording. */
export function analyseFile(capture: SoundCapture, file: File): Promise<void> {
  session?.cancel();
  const mine = ++attemptNo;
  const from: SoundSource = { source: 'file', fileName: file.name };
  listenStatus.value = { kind: 'analysing', from };
  return capture.decodeFile(file).then(
    (recording) => {
      if (mine === attemptNo) analyseRecording(recording, from);
    },
    (error: unknown) => {
      if (mine === attemptNo) failed(error, from);
    },
  );
}

/** Reads the clipped recording a problem kept, as the user asked. */
export function analyseKept(): void {
  const status = listenStatus.peek();
  if (status.kind === 'problem' && status.kept)
    analyseRecording(status.kept.recording, status.kept.from);
}

/**
 * The one way a speed heard reaches the part: the speed, with its precision (origin.precisionHz)
 * as the part's tolerance, and its origin (how, when, how precise) handed back for the note
 * "by sound, 12 Dec, ±0.035 %" (words/sound.ts heardOriginWords). Kept in one place so that it can
 * follow the set-up's own way of taking a derived speed. Throws DataError, changing nothing,
 * as saveFoundSpeed does.
 */
export async function applyHeardSpeed(
  speedHz: number,
  origin: HeardOrigin,
  target: SaveTarget = { kind: 'setup' },
): Promise<SavedSpeed> {
  return saveFoundSpeed(speedHz, featuresInUse.peek(), target, origin);
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
