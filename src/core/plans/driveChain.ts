import {
  InputError,
  requireBetween,
  requireFinite,
  requirePositive,
  requireWhole,
} from '../basics/InputError';
import { MAX_SYMMETRY } from '../basics/types';
import {
  beltSpeedHz,
  gearSpeedHz,
  motorSpeedHz,
  tyreDiameterM,
  wheelSpeedHz,
} from '../formulas/drives';

/** Where the first part's speed comes from. */
export type ChainRoot =
  /** A known speed, rev/s (signed), with a relative tolerance (0.02 = ±2 %). */
  | { kind: 'fixed'; speedHz: number; tolerance?: number }
  /** An induction motor: its speed lies between the speeds at the smallest and largest slip (fractions, e.g. 0.01…0.04). */
  | { kind: 'motor'; mainsHz: number; poles: number; minSlip: number; maxSlip: number }
  /**
   * A wheel rolling at a ground speed (m/s, signed), with its diameter given as an ISO metric
   * tyre size ('205/55R16') or in metres; tolerance covers speedometer error and tyre wear.
   */
  | {
      kind: 'wheel';
      groundSpeedMps: number;
      tyreSize?: string;
      diameterM?: number;
      tolerance?: number;
    };

/** How a part is driven by the part before it (or by parts[from]). */
export type ChainLink =
  /**
   * Belt: f2 = f1·D1/D2 (an open belt keeps the direction, a crossed one reverses it). Slip
   * (percent, 0…20) makes the driven pulley run up to that much slower, never faster.
   */
  | {
      kind: 'belt';
      driverDiameterM: number;
      drivenDiameterM: number;
      slipPercent?: number;
      crossed?: boolean;
    }
  /** Gear pair: f2 = f1·z1/z2; an external mesh reverses the direction, an internal (ring) gear keeps it. */
  | { kind: 'gear'; driverTeeth: number; drivenTeeth: number; internal?: boolean }
  /** On the same shaft: same speed. */
  | { kind: 'shaft' };

export interface ChainPartSpec {
  /** What the crew calls it: "motor fan", "drum". */
  name: string;
  /** Identical, equally spaced features (blades, spokes, teeth); 1 = a single mark. */
  symmetry: number;
  /** How it is driven; required for every part but the first (which turns at the root speed). */
  link?: ChainLink;
  /** Index (from 0) of the driving part, an earlier one. Default: the part just before. */
  from?: number;
}

export interface ChainSpec {
  root: ChainRoot;
  parts: ChainPartSpec[];
}

/** A part of the chain with its speed: usable directly as a Part (speedHz, symmetry, tolerance). */
export interface ChainPart {
  name: string;
  symmetry: number;
  /** Signed speed at the middle of its band, rev/s. */
  speedHz: number;
  /** Relative half-width of the band around speedHz (worst case). */
  tolerance: number;
  /** The band of |speed| carried along the chain, rev/s (lowHz ≤ |speedHz| ≤ highHz). */
  lowHz: number;
  highHz: number;
  /** Signed speed ratio to the first part, without slip (−1/3: a third as fast, reversed). */
  ratioToRoot: number;
}

/** checkPart accepts tolerances up to ±50 %; a wider band means the chain says little. */
const MAX_TOLERANCE = 0.5;

/**
 * Every part's speed along a chain of drives (docs/physics.md §8): motor → belt → fan, gear stages,
 * a wheel from ground speed. Each part's band of speeds is the driving part's band times the
 * link's ratio (worst case, carried as an interval): relative tolerances add through ratio
 * links, and belt slip lowers the bottom of the band. Each part is reported at the middle of
 * its band with the relative half-width as its tolerance, so the result feeds apparentMotion,
 * rateBands, freezeRates and noStillRates directly.
 *
 * Units: rev/s, metres, m/s, percent for belt slip, fractions for motor slip and tolerances.
 * Throws InputError for an unknown root or link kind, a missing link, a `from` that is not an
 * earlier part, bad numbers (via the drive formulas), or a band wider than ±50 %.
 *
 * @example
 * // A 4-pole motor on 50 Hz (1450–1500 rpm) drives a fan by a 100 mm → 250 mm belt.
 * driveChain({ root: { kind: 'motor', mainsHz: 50, poles: 4, minSlip: 0, maxSlip: 1 / 30 },
 *   parts: [{ name: 'motor', symmetry: 1 },
 *           { name: 'fan', symmetry: 6, link: { kind: 'belt', driverDiameterM: 0.1, drivenDiameterM: 0.25 } }] })[1]
 * // { name: 'fan', symmetry: 6, lowHz: 9.666…, highHz: 10, speedHz: 9.833…, tolerance: 0.01695…, ratioToRoot: 0.4 }
 *
 * Sources: IEC 60034-1 / NEMA MG 1 synchronous speed 120·fm/P; belt D1·n1 = D2·n2 and gear
 * z1·n1 = z2·n2 (any machine-design handbook); ISO 4000-1 tyre size arithmetic.
 */
export function driveChain(spec: ChainSpec): ChainPart[] {
  if (typeof spec !== 'object' || spec === null) {
    throw new InputError('drive chain', "Give the chain's first speed and its parts.");
  }
  if (!Array.isArray(spec.parts) || spec.parts.length === 0) {
    throw new InputError('parts', 'Give at least one part in the chain.');
  }
  const root = rootBand(spec.root);
  const out: ChainPart[] = [];
  spec.parts.forEach((p, i) => {
    const label = `part ${i + 1}`;
    if (typeof p !== 'object' || p === null)
      throw new InputError(label, `${label} must give a name and a number of features.`);
    const name = typeof p.name === 'string' && p.name.trim() !== '' ? p.name.trim() : label;
    const symmetry = requireWhole(p.symmetry, `features of ${name}`, 1, MAX_SYMMETRY);
    let band: Band;
    if (i === 0) {
      band = root;
    } else {
      const from =
        p.from === undefined ? i - 1 : requireWhole(p.from, `part driving ${name}`, 0, i - 1);
      if (p.link === undefined)
        throw new InputError(
          `link of ${name}`,
          `Say how ${name} is driven: belt, gear or same shaft.`,
        );
      band = applyLink(bandOf(out[from]), p.link, name);
    }
    out.push(toPart(name, symmetry, band));
  });
  return out;
}

/** A signed nominal speed, its |speed| band, and the signed ratio to the root. */
interface Band {
  nominalHz: number;
  lowHz: number;
  highHz: number;
  ratio: number;
}

function rootBand(root: ChainRoot): Band {
  if (typeof root !== 'object' || root === null) {
    throw new InputError(
      'first speed',
      'Say where the first speed comes from: a known speed, a motor or a wheel.',
    );
  }
  switch (root.kind) {
    case 'fixed': {
      const f = requireFinite(root.speedHz, 'speed');
      const u = requireBetween(root.tolerance ?? 0, 'speed tolerance', 0, MAX_TOLERANCE);
      return {
        nominalHz: f,
        lowHz: Math.abs(f) * (1 - u),
        highHz: Math.abs(f) * (1 + u),
        ratio: 1,
      };
    }
    case 'motor': {
      const minSlip = requireBetween(root.minSlip, 'smallest slip', 0, 0.5);
      const maxSlip = requireBetween(root.maxSlip, 'largest slip', 0, 0.5);
      if (minSlip > maxSlip) {
        throw new InputError(
          'slip',
          `The smallest slip (${minSlip}) must not be above the largest (${maxSlip}).`,
        );
      }
      const lowHz = motorSpeedHz(root.mainsHz, root.poles, maxSlip);
      const highHz = motorSpeedHz(root.mainsHz, root.poles, minSlip);
      return { nominalHz: (lowHz + highHz) / 2, lowHz, highHz, ratio: 1 };
    }
    case 'wheel': {
      const u = requireBetween(root.tolerance ?? 0, 'speed tolerance', 0, MAX_TOLERANCE);
      let diameterM: number;
      if (root.tyreSize !== undefined) diameterM = tyreDiameterM(root.tyreSize);
      else if (root.diameterM !== undefined)
        diameterM = requirePositive(root.diameterM, 'wheel diameter');
      else
        throw new InputError(
          'wheel diameter',
          'Give the tyre size (e.g. 205/55R16) or the wheel diameter.',
        );
      const f = wheelSpeedHz(root.groundSpeedMps, diameterM);
      return {
        nominalHz: f,
        lowHz: Math.abs(f) * (1 - u),
        highHz: Math.abs(f) * (1 + u),
        ratio: 1,
      };
    }
    default:
      throw new InputError(
        'first speed',
        'The first speed must be a known speed, a motor or a wheel.',
      );
  }
}

function applyLink(b: Band, link: ChainLink, name: string): Band {
  if (typeof link !== 'object' || link === null) {
    throw new InputError(`link of ${name}`, `Say how ${name} is driven: belt, gear or same shaft.`);
  }
  switch (link.kind) {
    case 'shaft':
      return b;
    case 'belt': {
      // The drive formula validates the diameters; its ratio for a driver at 1 rev/s.
      const k =
        beltSpeedHz(1, link.driverDiameterM, link.drivenDiameterM) * (link.crossed ? -1 : 1);
      const slip =
        requireBetween(link.slipPercent ?? 0, `belt slip of ${name} (percent)`, 0, 20) / 100;
      const lowHz = b.lowHz * Math.abs(k) * (1 - slip);
      const highHz = b.highHz * Math.abs(k);
      // With slip the nominal speed sits mid-band, not at the slip-free ratio.
      const sign = Math.sign(b.nominalHz * k);
      return { nominalHz: (sign * (lowHz + highHz)) / 2, lowHz, highHz, ratio: b.ratio * k };
    }
    case 'gear': {
      const external = gearSpeedHz(1, link.driverTeeth, link.drivenTeeth);
      const k = link.internal ? -external : external;
      return {
        nominalHz: b.nominalHz * k,
        lowHz: b.lowHz * Math.abs(k),
        highHz: b.highHz * Math.abs(k),
        ratio: b.ratio * k,
      };
    }
    default:
      throw new InputError(
        `link of ${name}`,
        `${name} must be driven by a belt, a gear or the same shaft.`,
      );
  }
}

/** Re-forms a reported part into a band (its band is kept exactly, not re-derived from the tolerance). */
function bandOf(p: ChainPart): Band {
  return { nominalHz: p.speedHz, lowHz: p.lowHz, highHz: p.highHz, ratio: p.ratioToRoot };
}

function toPart(name: string, symmetry: number, b: Band): ChainPart {
  if (!Number.isFinite(b.highHz) || !Number.isFinite(b.ratio) || !Number.isFinite(b.nominalHz)) {
    throw new InputError(
      `speed of ${name}`,
      `The speed of ${name} comes out too large to work with: check the drives before it.`,
    );
  }
  const mid = (b.lowHz + b.highHz) / 2;
  const tolerance = mid === 0 ? 0 : (b.highHz - b.lowHz) / (2 * mid);
  if (tolerance > MAX_TOLERANCE) {
    throw new InputError(
      `tolerance of ${name}`,
      `The speed of ${name} is uncertain by more than ±50 % after the drives before it; narrow the slip or tolerances.`,
    );
  }
  // Tiny round-off must not flip a zero speed's sign or push the middle off the nominal.
  const sign = Math.sign(b.nominalHz) || 1;
  return {
    name,
    symmetry,
    speedHz: mid === 0 ? 0 : sign * mid,
    tolerance,
    lowHz: b.lowHz,
    highHz: b.highHz,
    ratioToRoot: b.ratio,
  };
}
