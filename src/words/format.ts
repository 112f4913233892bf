// Number formatting for the screen. Every function here returns text for any input and
// never the words NaN or Infinity: a value that is not a finite number shows as a dash.

/** Shown in place of a number that cannot be computed. */
export const NO_VALUE = '—';

/**
 * `value` rounded to at most `decimals` places, trailing zeros dropped, thousands grouped with
 * commas: what `new Intl.NumberFormat('en-US', { maximumFractionDigits: decimals })` writes.
 * Like it, this rounds the number's shortest decimal form (1.005 is "1.005", not the binary
 * 1.00499…) half away from zero; test/words/format.test.ts compares the two. Written by hand
 * because building each Intl formatter costs milliseconds on a phone, on the way to the first
 * paint.
 */
function groupedFixed(value: number, decimals: number): string {
  const { whole, fraction } = roundedDecimal(Math.abs(value), decimals);
  let grouped = whole.slice(0, ((whole.length - 1) % 3) + 1);
  for (let i = grouped.length; i < whole.length; i += 3) grouped += ',' + whole.slice(i, i + 3);
  return (value < 0 ? '-' : '') + grouped + (fraction ? '.' + fraction : '');
}

/** The digits of `abs` (finite, not negative) rounded half up at `decimals` places, trailing zeros dropped. */
function roundedDecimal(abs: number, decimals: number): { whole: string; fraction: string } {
  // The shortest text that reads back as abs: "1.005", "1.2e-7", "1e+21".
  const [mantissa, exponent] = String(abs).split('e');
  const [intPart, fracPart = ''] = mantissa.split('.');
  let digits = intPart + fracPart;
  // Where the decimal point falls among the digits.
  let point = intPart.length + (exponent ? Number(exponent) : 0);
  if (point < 0) {
    digits = '0'.repeat(-point) + digits;
    point = 0;
  }
  if (point > digits.length) digits = digits.padEnd(point, '0');
  const keep = point + decimals;
  let kept = digits.slice(0, keep).padEnd(keep, '0');
  if (digits.length > keep && digits[keep] >= '5') {
    // Carry the one up through the nines.
    let i = kept.length - 1;
    while (i >= 0 && kept[i] === '9') i--;
    kept =
      i < 0
        ? '1' + '0'.repeat(kept.length)
        : kept.slice(0, i) + String(Number(kept[i]) + 1) + '0'.repeat(kept.length - i - 1);
    if (i < 0) point++;
  }
  const whole = kept.slice(0, point).replace(/^0+(?=\d)/, '') || '0';
  const fraction = kept.slice(point).replace(/0+$/, '');
  return { whole, fraction };
}

/** Decimals that keep about four significant figures without printing noise. */
function decimalsFor(abs: number): number {
  if (abs >= 1000) return 0;
  if (abs >= 100) return 1;
  if (abs >= 10) return 2;
  if (abs >= 1) return 3;
  return 4;
}

/**
 * A number for reading: thousands grouped with commas, about four significant figures,
 * trailing zeros dropped, no "-0".
 * @example formatNumber(1770) // "1,770"
 * @example formatNumber(29.97002997) // "29.97"
 * @example formatNumber(NaN) // "—"
 */
export function formatNumber(value: number, decimals?: number): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return NO_VALUE;
  const d = decimals ?? decimalsFor(Math.abs(value));
  const text = groupedFixed(value, d);
  // Rounding can leave "-0": a speed of zero has no direction.
  return /^-0(\.0*)?$/.test(text) ? '0' : text;
}

/**
 * A number to five significant figures (at least whole units), for rates a person sets on a
 * dial: "1,769.6", "23.976", "119.88".
 * @example formatPrecise(1769.64) // "1,769.6"
 */
export function formatPrecise(value: number): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return NO_VALUE;
  const abs = Math.abs(value);
  const decimals = abs === 0 ? 0 : Math.max(0, Math.min(6, 4 - Math.floor(Math.log10(abs))));
  return formatNumber(value, decimals);
}

/**
 * A number to put back into an input field: no grouping (so it reads back unchanged),
 * at most seven significant figures, never in exponent form for everyday magnitudes.
 * @example numberForField(30000 / 1001) // "29.97003"
 * @example numberForField(12000) // "12000"
 */
export function numberForField(value: number): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return '';
  if (value === 0) return '0';
  const rounded = Number(value.toPrecision(7));
  const abs = Math.abs(rounded);
  if (abs >= 1e-6 && abs < 1e15) {
    // toFixed avoids exponent form; trim the zeros it pads with.
    const decimals = Math.max(0, Math.min(12, 6 - Math.floor(Math.log10(abs))));
    return rounded
      .toFixed(decimals)
      .replace(/(\.\d*?)0+$/, '$1')
      .replace(/\.$/, '');
  }
  return String(rounded);
}

/**
 * A signed speed in rpm with its direction in words.
 * @example formatRpmWithDirection(-12.25, 1) // "12.25 rpm backward"
 */
export function formatRpmWithDirection(rpm: number, referenceSign: number): string {
  if (!Number.isFinite(rpm)) return NO_VALUE;
  const text = formatNumber(Math.abs(rpm));
  if (text === '0') return '0 rpm';
  const sameWay = Math.sign(rpm) === (referenceSign < 0 ? -1 : 1);
  return `${text} rpm ${sameWay ? 'forward' : 'backward'}`;
}

/**
 * A percentage: "1.5 %".
 * @example formatPercent(1.5) // "1.5 %"
 */
export function formatPercent(value: number): string {
  const text = formatNumber(value);
  return text === NO_VALUE ? text : `${text} %`;
}

/**
 * An exposure time as people say it: "1/500 s" when shorter than a second, else "2 s".
 * @example formatExposure(0.002) // "1/500 s"
 */
export function formatExposure(seconds: number): string {
  if (!Number.isFinite(seconds) || seconds <= 0) return NO_VALUE;
  if (seconds >= 1) return `${formatNumber(seconds)} s`;
  return `1/${formatNumber(1 / seconds)} s`;
}

/**
 * A number rounded as formatNumber shows it (about four significant figures), for a table cell:
 * a spreadsheet gets the figure on screen, never 2000.0000000000002. NaN or Infinity give null
 * (an empty cell).
 * @example shownNumber(2000.0000000000002) // 2000
 * @example shownNumber(29.97002997) // 29.97
 */
export function shownNumber(value: number, decimals?: number): number | null {
  if (typeof value !== 'number' || !Number.isFinite(value)) return null;
  const d = decimals ?? decimalsFor(Math.abs(value));
  const rounded = Number(value.toFixed(d));
  return Object.is(rounded, -0) ? 0 : rounded;
}

/**
 * A rate rounded as formatPrecise shows it (five significant figures, at least whole units).
 * @example preciseNumber(1769.64) // 1769.6
 */
export function preciseNumber(value: number): number | null {
  if (typeof value !== 'number' || !Number.isFinite(value)) return null;
  const abs = Math.abs(value);
  const decimals = abs === 0 ? 0 : Math.max(0, Math.min(6, 4 - Math.floor(Math.log10(abs))));
  return shownNumber(value, decimals);
}
