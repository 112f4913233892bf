// The drive chains of a set-up (the whole-machine screen). A part without a drive starts a
// chain: its speed is typed (or applied from a wheel's road speed), or comes from a motor. A
// part with a drive is turned by an earlier part through a belt, a gear pair or a shared shaft. The core's driveChain carries
// speeds and tolerances along (docs/physics.md §8); this file turns set-ups into its input and
// writes what it gives back into the parts, so the check screen and saved machines keep it.
import {
  driveChain,
  InputError,
  kmhToMps,
  motorSpeedHz,
  mphToMps,
  tyreDiameterM,
  wheelSpeedHz,
  type ChainLink,
  type ChainPart,
  type ChainPartSpec,
  type ChainRoot,
} from '../core';
import {
  MAX_SPEED_RPM,
  partLabel,
  type PartDrive,
  type PartSpec,
  type Setup,
  type WheelSpec,
  corePartOf,
  newPartLike,
  withoutOrigin,
} from './model';
import { keepLastGood } from './outcome';
import { defaultMotor, defaultWheelInputs, setup } from './setup';
import { requirePartRoom } from './partRoom';
import { DataError } from './read';

/** Where a part's speed comes from. */
export type SpeedSource = 'typed' | 'motor' | 'wheel' | 'drive';

/** A part of the set-up with the speed band its chain gives it. */
export interface DerivedPart extends ChainPart {
  /** Its place in the set-up's parts, from 0. */
  index: number;
  source: SpeedSource;
}

/** A wheel when a part first becomes one (setup.ts): 50 km/h on a 205/55R16 tyre. */
export const defaultWheel: WheelSpec = defaultWheelInputs;

export function speedSourceOf(part: PartSpec): SpeedSource {
  if (part.drive) return 'drive';
  if (part.wheel) return 'wheel';
  if (part.motor) return 'motor';
  return 'typed';
}

/**
 * The speed a wheel's road speed and tyre give, rpm (signed as the road speed): what the part
 * form offers to apply (docs/physics.md §8, f = v/(π·D)).
 * Throws the core's InputError for a tyre size it cannot read.
 * @example wheelSpeedRpm({ groundSpeed: 100, unit: 'km/h', tyreSize: '205/55R16' }) // 839.56 (to 2 decimals)
 */
export function wheelSpeedRpm(wheel: WheelSpec): number {
  const { groundSpeed, unit } = wheel;
  const groundSpeedMps = unit === 'mph' ? mphToMps(groundSpeed) : kmhToMps(groundSpeed);
  return wheelSpeedHz(groundSpeedMps, tyreDiameterM(wheel.tyreSize)) * 60;
}

/**
 * The core's chain start for a part without a drive. A wheel starts its chain at the speed it
 * holds (the one last applied from its road speed), like a typed speed.
 */
export function chainRootOf(part: PartSpec): ChainRoot {
  const { speedHz, tolerance } = corePartOf(part);
  if (part.motor) {
    // As on the check screen: the motor gives the speed at its slip, the part's tolerance the band.
    const { mainsHz, poles, slipPercent } = part.motor;
    const sign = part.speedRpm < 0 ? -1 : 1;
    return {
      kind: 'fixed',
      speedHz: sign * motorSpeedHz(mainsHz, poles, slipPercent / 100),
      tolerance,
    };
  }
  return { kind: 'fixed', speedHz, tolerance };
}

/** The core's link for a drive (pulley diameters in metres). */
export function chainLinkOf(drive: PartDrive): ChainLink {
  if (drive.kind === 'belt') {
    return {
      kind: 'belt',
      driverDiameterM: drive.driverMm / 1000,
      drivenDiameterM: drive.drivenMm / 1000,
      slipPercent: drive.slipPercent,
    };
  }
  if (drive.kind === 'gear')
    return { kind: 'gear', driverTeeth: drive.driverTeeth, drivenTeeth: drive.drivenTeeth };
  return { kind: 'shaft' };
}

/**
 * Every part's speed band, in set-up order: each chain (a part without a drive and the parts
 * it turns, directly or through others) goes through the core's driveChain.
 * Throws the core's InputError for a chain it refuses (a tyre size it cannot read, a band
 * wider than ±50 %, a drive from a part that is not an earlier one).
 * @example deriveParts(defaultSetup)[0].speedHz // 29.5 (1770 rpm, typed)
 */
export function deriveParts(s: Setup): DerivedPart[] {
  const rootOf: number[] = [];
  s.parts.forEach((part, i) => {
    const from = part.drive?.from;
    if (from === undefined) {
      rootOf.push(i);
      return;
    }
    if (!Number.isInteger(from) || from < 0 || from >= i) {
      throw new InputError(
        `drive of ${partLabel(s, i)}`,
        `${partLabel(s, i)} is driven by a part that is not before it in the list: choose its driver again.`,
      );
    }
    rootOf.push(rootOf[from]);
  });
  const out: DerivedPart[] = new Array(s.parts.length);
  for (const root of new Set(rootOf)) {
    const members = rootOf.flatMap((r, i) => (r === root ? [i] : []));
    const specs: ChainPartSpec[] = members.map((i, k) => {
      const part = s.parts[i];
      const spec: ChainPartSpec = { name: partLabel(s, i), symmetry: part.features };
      if (k === 0 || !part.drive) return spec;
      return { ...spec, link: chainLinkOf(part.drive), from: members.indexOf(part.drive.from) };
    });
    const parts = driveChain({ root: chainRootOf(s.parts[root]), parts: specs });
    members.forEach((i, k) => {
      out[i] = { ...parts[k], index: i, source: speedSourceOf(s.parts[i]) };
    });
  }
  return out;
}

/**
 * The set-up with every driven part's speed and tolerance as its chain gives them. Parts whose
 * speed is typed, applied or comes from a motor keep theirs.
 * Throws InputError as deriveParts does, or when a part would turn faster than the app accepts.
 */
export function withChainSpeeds(s: Setup): Setup {
  const derived = deriveParts(s);
  const parts = s.parts.map((part, i) => {
    if (!part.drive) return part;
    const rpm = derived[i].speedHz * 60;
    if (!(Math.abs(rpm) <= MAX_SPEED_RPM)) {
      throw new InputError(
        `speed of ${partLabel(s, i)}`,
        `${partLabel(s, i)} would turn at more than ${MAX_SPEED_RPM.toLocaleString('en-US')} rpm: check the drives and sizes before it.`,
      );
    }
    return { ...part, speedRpm: rpm, tolerancePercent: derived[i].tolerance * 100 };
  });
  return { ...s, parts };
}

function changePart(s: Setup, index: number, change: (part: PartSpec) => PartSpec): Setup {
  if (!s.parts[index]) throw new DataError('parts', 'That part is no longer in the list.');
  return { ...s, parts: s.parts.map((p, i) => (i === index ? change({ ...p }) : p)) };
}

/** A part with no speed source of its own: speed and tolerance stay as they are. */
function bare(part: PartSpec): PartSpec {
  const { motor: _motor, drive: _drive, wheel: _wheel, origin: _origin, ...rest } = part;
  return rest;
}

/**
 * Changes where part `index` takes its speed from, keeping what it showed until now: a typed
 * speed starts at its current speed; a motor starts at 4 poles on 50 Hz with 3 % slip (as on
 * the check screen); a wheel keeps its speed and offers `defaultWheel`'s road speed to apply;
 * a drive starts on the same shaft as the part before.
 * Throws DataError for an unknown part, or a drive asked of the first part.
 */
export function withSpeedSource(s: Setup, index: number, source: SpeedSource): Setup {
  return changePart(s, index, (part) => {
    if (speedSourceOf(part) === source) return part;
    const base = bare(part);
    if (source === 'typed') return base;
    if (source === 'motor') {
      const sign = part.speedRpm < 0 ? -1 : 1;
      const rpm =
        motorSpeedHz(defaultMotor.mainsHz, defaultMotor.poles, defaultMotor.slipPercent / 100) * 60;
      return { ...base, motor: { ...defaultMotor }, speedRpm: sign * rpm };
    }
    if (source === 'wheel')
      return { ...base, kind: 'wheel', wheel: { ...(part.wheel ?? defaultWheel) } };
    if (index === 0)
      throw new DataError('drive', 'The first part cannot be driven by another part.');
    return { ...base, drive: { from: index - 1, kind: 'shaft' } };
  });
}

/** Replaces part `index`'s drive (the caller keeps `from` earlier than `index`). */
export function withDrive(s: Setup, index: number, drive: PartDrive): Setup {
  return changePart(s, index, (part) => ({ ...bare(part), drive: { ...drive } }));
}

/** Replaces part `index`'s motor; its speed follows (direction kept). */
export function withMotor(s: Setup, index: number, motor: NonNullable<PartSpec['motor']>): Setup {
  return changePart(s, index, (part) => {
    const sign = part.speedRpm < 0 ? -1 : 1;
    const rpm = motorSpeedHz(motor.mainsHz, motor.poles, motor.slipPercent / 100) * 60;
    return { ...bare(part), motor: { ...motor }, speedRpm: sign * rpm };
  });
}

/**
 * Replaces part `index`'s road speed and tyre. Its speed stays until the user applies the one
 * they give (applyDerivedSpeed); the origin of that speed stays too.
 */
export function withWheel(s: Setup, index: number, wheel: WheelSpec): Setup {
  return changePart(s, index, (part) => {
    const { motor: _motor, drive: _drive, ...rest } = part;
    return { ...rest, wheel: { ...wheel } };
  });
}

/** Changes plain fields of part `index` (name, features, typed speed, tolerance). */
export function withPartFields(
  s: Setup,
  index: number,
  fields: Partial<Pick<PartSpec, 'name' | 'features' | 'speedRpm' | 'tolerancePercent'>>,
): Setup {
  // A typed speed is the user's own: any recorded origin no longer holds.
  return changePart(s, index, (part) =>
    fields.speedRpm === undefined ? { ...part, ...fields } : { ...withoutOrigin(part), ...fields },
  );
}

/**
 * Adds a part at the end, on the same shaft as part `from` (the user then picks the drive).
 * Throws DataError, changing nothing, when the set-up is full or `from` is not a part.
 */
export function withDrivenPart(s: Setup, from: number): Setup {
  requirePartRoom(s);
  const driver = s.parts[from];
  if (!driver) throw new DataError('parts', 'That part is no longer in the list.');
  const part: PartSpec = { ...newPartLike(s.parts, driver), drive: { from, kind: 'shaft' } };
  return { ...s, parts: [...s.parts, part] };
}

/**
 * Removes part `index`. Parts it drove keep the speed and tolerance they had and take them as
 * typed values from now on, so nothing they showed is lost; later drives are renumbered. The
 * chosen part stays chosen (or its neighbour, when it was the one removed).
 * Throws DataError, changing nothing, for the last part or an unknown index.
 */
export function withoutPart(s: Setup, index: number): Setup {
  if (s.parts.length <= 1) throw new DataError('parts', 'A set-up needs at least one part.');
  if (!s.parts[index]) throw new DataError('parts', 'That part is no longer in the list.');
  let current: readonly PartSpec[] = s.parts;
  try {
    current = withChainSpeeds(s).parts;
  } catch {
    // A chain the core refuses keeps the speeds last written.
  }
  const parts = current.flatMap((part, i): PartSpec[] => {
    if (i === index) return [];
    const drive = part.drive;
    if (!drive || drive.from < index) return [part];
    if (drive.from === index) return [bare(part)];
    return [{ ...part, drive: { ...drive, from: drive.from - 1 } }];
  });
  const activePart =
    s.activePart > index ? s.activePart - 1 : Math.min(s.activePart, parts.length - 1);
  return { ...s, parts, activePart };
}

/**
 * Applies an edit to the current set-up and writes the chains' speeds into it. When the core
 * refuses the chain, the edit is kept as typed (nothing lost) and the speeds stay as they were;
 * `chain.problem` says why. Throws what the edit throws (DataError), changing nothing.
 */
export function editChain(edit: (s: Setup) => Setup): void {
  const next = edit(setup.peek());
  try {
    setup.value = withChainSpeeds(next);
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    setup.value = next;
  }
}

/** Writes the chains' speeds into the current set-up when they changed (a typed root speed, say). */
export function syncChainSpeeds(): void {
  const s = setup.peek();
  try {
    const next = withChainSpeeds(s);
    if (
      next.parts.some(
        (p, i) =>
          p.speedRpm !== s.parts[i].speedRpm || p.tolerancePercent !== s.parts[i].tolerancePercent,
      )
    ) {
      setup.value = next;
    }
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
  }
}

/** The current set-up's parts with their speed bands, kept at the last good value when the core refuses a chain. */
export const chain = keepLastGood(() => deriveParts(setup.value));
