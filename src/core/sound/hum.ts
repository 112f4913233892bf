import type { SoundSpectrum } from './spectrum';

/** A spectral line taken for mains hum rather than the machine. */
export interface HumLine {
  hz: number;
  /** Supply it belongs to, Hz. */
  mainsHz: 50 | 60;
  /** hz ≈ harmonic · mains frequency. */
  harmonic: number;
  levelDb: number;
  prominenceDb: number;
}

export interface Hum {
  lines: HumLine[];
  /** Per spectrum bin: 1 where a hum line's main lobe lies (the machine cannot be read there). */
  mask: Uint8Array;
}

/**
 * How far a grid's frequency is taken to stray from nominal: ±0.5 % (a judgement; large
 * grids hold a few tenths of a hertz, small ones and generators stray further).
 */
const GRID_SHARE = 0.005;
/** …or a quarter bin, when that is wider (a line's frequency is known to a few hundredths of a bin). */
const ANCHOR_BINS = 0.25;
/**
 * A line counts as a hum harmonic within ±0.05 % of m times the supply's actual frequency, or
 * ±0.3 bin if wider: the supply holds steady over a few seconds and its frequency is known to
 * a small fraction of a bin from the anchor line, so only lines that sit on the hum are taken.
 */
const HUM_SHARE = 0.0005;
const HUM_BINS = 0.3;
/** Hum harmonics marked: up to the 40th (2 kHz on a 50 Hz supply, 2.4 kHz on 60 Hz). */
const MAX_HUM_HARMONIC = 40;
/** Bins either side of a hum line left out: the Hann main lobe (±2 bins). */
const LOBE_BINS = 2;

/**
 * Mains hum in a spectrum: transformers, lamps and motors hum at the supply frequency fm and
 * its multiples, strongest at 2·fm (magnetostriction). A supply's actual frequency is fixed by
 * one of its lines within ±0.5 % of fm…4·fm: the one whose multiples 1…4 find the most lines
 * (hum comes as a family), then the most prominent. Every line at a multiple of it (to 0.05 %,
 * at least 0.3 bin) is marked as hum and its main lobe masked, so the tone finder neither
 * counts it for a speed nor holds its absence against one. With the supply unknown, both are
 * tried and one kept (a site has one supply): the one with more of its first four harmonics
 * present, then the one nearer its nominal frequency.
 */
export function findHum(spectrum: SoundSpectrum, mainsHz?: 50 | 60): Hum {
  const families = (mainsHz ? [mainsHz] : ([50, 60] as const))
    .map((supply) => humFamily(spectrum, supply))
    .filter((f) => f !== undefined);
  families.sort((a, b) => b.support - a.support || a.offset - b.offset);
  const lines = families[0]?.lines ?? [];
  const mask = new Uint8Array(spectrum.power.length);
  for (const line of lines) {
    const bin = Math.round(line.hz / spectrum.binHz);
    for (let k = bin - LOBE_BINS; k <= bin + LOBE_BINS; k++) {
      if (k >= 0 && k < mask.length) mask[k] = 1;
    }
  }
  return { lines, mask };
}

interface Family {
  lines: HumLine[];
  /** How many of the harmonics 1…4 have a line. */
  support: number;
  /** |actual/nominal − 1|. */
  offset: number;
}

function humFamily(spectrum: SoundSpectrum, supply: 50 | 60): Family | undefined {
  const { peaks, binHz } = spectrum;
  let best: (Family & { prominenceDb: number }) | undefined;
  for (const p of peaks) {
    const harmonic = Math.round(p.hz / supply);
    if (harmonic < 1 || harmonic > 4) continue;
    const off = Math.abs(p.hz - harmonic * supply);
    if (off > Math.max(GRID_SHARE * harmonic * supply, ANCHOR_BINS * binHz)) continue;
    const actualHz = p.hz / harmonic;
    const lines = linesAt(spectrum, actualHz, supply);
    const support = new Set(lines.filter((l) => l.harmonic <= 4).map((l) => l.harmonic)).size;
    if (
      !best ||
      support > best.support ||
      (support === best.support && p.prominenceDb > best.prominenceDb)
    ) {
      best = {
        lines,
        support,
        offset: Math.abs(actualHz / supply - 1),
        prominenceDb: p.prominenceDb,
      };
    }
  }
  return best && { lines: best.lines, support: best.support, offset: best.offset };
}

/** The lines at multiples of actualHz (to 0.05 %, at least 0.3 bin). */
function linesAt(spectrum: SoundSpectrum, actualHz: number, supply: 50 | 60): HumLine[] {
  const lines: HumLine[] = [];
  for (const p of spectrum.peaks) {
    const harmonic = Math.round(p.hz / actualHz);
    if (harmonic < 1 || harmonic > MAX_HUM_HARMONIC) continue;
    const off = Math.abs(p.hz - harmonic * actualHz);
    if (off > Math.max(HUM_SHARE * harmonic * actualHz, HUM_BINS * spectrum.binHz)) continue;
    lines.push({
      hz: p.hz,
      mainsHz: supply,
      harmonic,
      levelDb: p.levelDb,
      prominenceDb: p.prominenceDb,
    });
  }
  return lines;
}
