// The speed finder: what the technician recorded at the strobe, what they expect, and the next
// step of the usual procedure from the core's speedFinderSteps (docs/physics.md §7). The readings
// live here, outside the screen, so changing tabs loses none of them.
import { computed } from '@preact/signals';
import {
  InputError,
  motorExpectedRange,
  speedFinderSteps,
  type Range,
  type SpeedFinderStep,
} from '../core';
import { setupWithDerivedSpeed } from './derivedSpeed';
import { deriveParts, speedSourceOf } from './driveChain';
import { saveMachine, updateMachine, type SaveResult } from './machines';
import {
  defaultExpectation,
  partLabel,
  type Expectation,
  type FinderPartKind,
  type Setup,
  activeIndex,
  activePartOf,
} from './model';
import { keepLastGood } from './outcome';
import { activePart, setSamplerKind, setStrobeRateFpm, setup } from './setup';
import {
  expectation,
  finderFeatures,
  finderPartKind,
  readingId,
  readings,
  type RecordedReading,
} from './toolInputs';
import { markSaved, openBaseVersion, openMachineId, setHeader, workContent } from './work';

export type { Expectation, FinderPartKind, RecordedReading };
export { defaultExpectation, expectation, finderFeatures, finderPartKind, readings };

/** Most images a technician is asked to count: beyond about eight nobody counts them reliably (a judgement). */
export const MAX_IMAGES_SEEN = 8;

export function addReading(rateFpm: number, images: number): void {
  readings.value = [...readings.value, { id: readingId(), rateFpm, images }];
}

export function changeReading(id: number, change: Partial<Omit<RecordedReading, 'id'>>): void {
  readings.value = readings.value.map((r) => (r.id === id ? { ...r, ...change } : r));
}

export function removeReading(id: number): void {
  readings.value = readings.value.filter((r) => r.id !== id);
}

export function clearReadings(): void {
  readings.value = [];
}

/** The features the finder works with. */
export const featuresInUse = computed(() => finderFeatures.value ?? activePart.value.features);

/** The strobe's own range from the set-up, Hz. */
export const strobeRangeHz = computed<Range>(() => {
  const { minFpm, maxFpm } = setup.value.strobe;
  return { minHz: minFpm / 60, maxHz: maxFpm / 60 };
});

/**
 * The expected speed range in rev/s, or undefined for none. Throws the core's InputError for a
 * motor it refuses or an empty range.
 * @example expectedRange({ ...defaultExpectation, mode: 'motor', mainsHz: 60, poles: 4 }) // { minHz: 28.5, maxHz: 30 }
 */
export function expectedRange(e: Expectation): Range | undefined {
  if (e.mode === 'none') return undefined;
  if (e.mode === 'nameplate') {
    if (!(e.nameplateRpm > 0) || !(e.plusMinusPercent > 0 && e.plusMinusPercent <= 50)) {
      throw new InputError(
        'expected speed',
        'Give the expected speed above 0 rpm and how far off it may be, more than 0 and at most 50 %.',
      );
    }
    const share = e.plusMinusPercent / 100;
    return {
      minHz: (e.nameplateRpm * (1 - share)) / 60,
      maxHz: (e.nameplateRpm * (1 + share)) / 60,
    };
  }
  if (e.mode === 'motor') {
    return motorExpectedRange(e.mainsHz, e.poles, {
      min: e.minSlipPercent / 100,
      max: e.maxSlipPercent / 100,
    });
  }
  if (!(e.fromRpm < e.toRpm)) {
    throw new InputError(
      'expected speed',
      'The expected speed range is empty: the lowest speed must be below the highest.',
    );
  }
  return { minHz: e.fromRpm / 60, maxHz: e.toRpm / 60 };
}

/** The procedure's next step for what is recorded now; the last good one while the core refuses the input. */
export const finderStep = keepLastGood<SpeedFinderStep>(() =>
  speedFinderSteps({
    readings: readings.value.map((r) => ({ rateHz: r.rateFpm / 60, images: r.images })),
    symmetry: featuresInUse.value,
    strobeRange: strobeRangeHz.value,
    expect: expectedRange(expectation.value),
  }),
);

/** Sets the check screen's sampler to the strobe, flashing at rateHz. */
export function applyRateToStrobe(rateHz: number): void {
  if (!(Number.isFinite(rateHz) && rateHz > 0)) return;
  setSamplerKind('strobe');
  setStrobeRateFpm(rateHz * 60);
}

/** One change the speed found makes to the set-up (src/words/speedFinder.ts says it in words). */
export type SpeedChange =
  | { kind: 'speed'; part: string; fromRpm: number; toRpm: number }
  | { kind: 'leaves-motor' | 'leaves-wheel'; part: string }
  | { kind: 'leaves-drive'; part: string; driver: string }
  | { kind: 'features'; part: string; from: number; to: number }
  | { kind: 'tolerance'; part: string; fromPercent: number; toPercent: number }
  | { kind: 'driven-speed'; part: string; fromRpm: number; toRpm: number };

/**
 * Where a speed found came from, when it carries its own precision: heard (by sound), or heard
 * and confirmed by a strobe reading. The precision becomes the part's tolerance.
 */
export interface HeardOrigin {
  method: 'sound' | 'sound-and-strobe';
  /** ± rev/s. */
  precisionHz: number;
  /** When the sound was heard (ms since 1970), for the note "by sound, 12 Dec, ±0.1 %". */
  heardAtMs: number;
}

/**
 * A precision as a tolerance, ± percent of the speed, rounded up to two significant figures (a
 * tolerance is never tighter than the measurement), within what a part's tolerance accepts.
 * @example toleranceFromPrecision(29.1667, 0.01) // 0.035
 */
export function toleranceFromPrecision(speedHz: number, precisionHz: number): number {
  const percent = (100 * Math.abs(precisionHz)) / Math.abs(speedHz);
  if (!(percent > 0) || !Number.isFinite(percent)) return 0;
  const step = 10 ** (Math.floor(Math.log10(percent)) - 1);
  const rounded = Number((Math.ceil(percent / step - 1e-9) * step).toPrecision(2));
  return Math.min(50, rounded);
}

/**
 * The set-up with the chosen part turning at the speed found, and what changed. A strobe
 * cannot tell direction, so the part keeps its own; the speed is applied as the part's own
 * (applyDerivedSpeed's step), with where it came from, no longer taken from a motor or a drive;
 * parts it drives follow it. A speed heard by sound (`heard`) brings its precision as the
 * part's tolerance.
 * @example withMeasuredSpeed(defaultSetup, 29.5, 6).changes // [{ kind: 'speed', part: 'Fan', fromRpm: 1770, toRpm: 1770 }]
 */
export function withMeasuredSpeed(
  s: Setup,
  speedHz: number,
  features: number,
  heard?: HeardOrigin,
): { setup: Setup; changes: SpeedChange[] } {
  const index = activeIndex(s);
  const before = s.parts[index];
  const part = partLabel(s, index);
  const sign = before.speedRpm < 0 ? -1 : 1;
  const rpm = sign * speedHz * 60;
  const changes: SpeedChange[] = [{ kind: 'speed', part, fromRpm: before.speedRpm, toRpm: rpm }];
  const source = speedSourceOf(before);
  if (source === 'motor') changes.push({ kind: 'leaves-motor', part });
  if (source === 'drive' && before.drive) {
    changes.push({ kind: 'leaves-drive', part, driver: partLabel(s, before.drive.from) });
  }
  if (features !== before.features)
    changes.push({ kind: 'features', part, from: before.features, to: features });
  const tolerancePercent = heard
    ? toleranceFromPrecision(speedHz, heard.precisionHz)
    : before.tolerancePercent;
  if (tolerancePercent !== before.tolerancePercent) {
    changes.push({
      kind: 'tolerance',
      part,
      fromPercent: before.tolerancePercent,
      toPercent: tolerancePercent,
    });
  }
  const next = setupWithDerivedSpeed(s, index, {
    speedRpm: rpm,
    features,
    tolerancePercent,
    origin: heard
      ? {
          method: 'sound',
          detail: {
            features,
            precisionPercent: tolerancePercent,
            ...(heard.method === 'sound-and-strobe' ? { confirmedBy: 'strobe' } : {}),
          },
          at: new Date(heard.heardAtMs).toISOString(),
        }
      : { method: 'strobe', detail: { features } },
  });
  try {
    const beforeParts = deriveParts(s);
    next.parts.forEach((p, i) => {
      const was = beforeParts[i].speedHz * 60;
      if (i !== index && p.drive && Math.abs(p.speedRpm - was) > 1e-9 * Math.abs(was)) {
        changes.push({
          kind: 'driven-speed',
          part: partLabel(next, i),
          fromRpm: was,
          toRpm: p.speedRpm,
        });
      }
    });
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    // A chain the core refuses keeps the speeds it last had; the whole-machine screen says why.
  }
  return { setup: next, changes };
}

/** Where to keep the speed found: the machine open now, a new machine, or only the set-up on screen. */
export type SaveTarget = { kind: 'open' } | { kind: 'new'; name: string } | { kind: 'setup' };

/** What saving the speed found did: the changes, and the machine it went to (null: the set-up only). */
export interface SavedSpeed {
  changes: SpeedChange[];
  machineName: string | null;
  /** What the store did with the machine (absent for the set-up only). */
  saved?: SaveResult;
  /** For a speed heard by sound: where it came from and the tolerance it gave the part, ± percent. */
  origin?: HeardOrigin & { tolerancePercent: number };
}

/**
 * Applies the speed found to the chosen part of the machine on screen, with where it came from
 * (the strobe, or `heard`: by sound, its precision becoming the part's tolerance), and keeps it
 * as asked. This is the one way a speed found, by strobe or by sound, reaches the part. Throws
 * DataError, changing nothing, for a machine name or set-up the saved list refuses, or an open
 * machine that was deleted meanwhile.
 */
export async function saveFoundSpeed(
  speedHz: number,
  features: number,
  target: SaveTarget,
  heard?: HeardOrigin,
): Promise<SavedSpeed> {
  const { setup: next, changes } = withMeasuredSpeed(setup.peek(), speedHz, features, heard);
  const content = { ...workContent.peek(), setup: next };
  let saved: SaveResult | undefined;
  if (target.kind === 'open') {
    const id = openMachineId.peek();
    if (id === null)
      throw new InputError('machine', 'No saved machine is open: give a name to save a new one.');
    saved = await updateMachine(id, content, openBaseVersion.peek());
  } else if (target.kind === 'new') {
    saved = await saveMachine(target.name, { ...content, name: target.name });
    markSaved(saved.machine.id, 'version' in saved.outcome ? saved.outcome.version : null);
    // The working copy is now that machine: it carries its name, so a later save to it keeps it.
    setHeader({ name: saved.machine.name });
  }
  setup.value = next;
  const tolerancePercent = activePartOf(next).tolerancePercent;
  return {
    changes,
    machineName: saved ? saved.machine.name : null,
    saved,
    ...(heard ? { origin: { ...heard, tolerancePercent } } : {}),
  };
}
