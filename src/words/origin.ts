// Where a part's speed came from, in words: "from road speed 50 km/h on 205/55R16",
// "found with the strobe", with the day it was applied.
import type { SpeedOrigin } from '../state/model';
import { formatNumber } from './format';

function text(detail: SpeedOrigin['detail'], key: string): string | undefined {
  const v = detail[key];
  return typeof v === 'string' ? v : undefined;
}

function num(detail: SpeedOrigin['detail'], key: string): number | undefined {
  const v = detail[key];
  return typeof v === 'number' ? v : undefined;
}

/** The day an origin was applied, as YYYY-MM-DD (ISO 8601 calendar date). */
export function originDay(origin: SpeedOrigin): string {
  return origin.at.slice(0, 10);
}

/**
 * Where the speed came from, without the day.
 * @example originWords({ method: 'road-speed', detail: { groundSpeed: 50, unit: 'km/h', tyreSize: '205/55R16' }, at: '2026-12-02T08:00:00Z' }) // "from road speed 50 km/h on 205/55R16"
 */
export function originWords(origin: SpeedOrigin): string {
  const d = origin.detail;
  const from = text(d, 'fromPart');
  switch (origin.method) {
    case 'road-speed': {
      const speed = num(d, 'groundSpeed');
      const unit = text(d, 'unit') ?? 'km/h';
      const tyre = text(d, 'tyreSize');
      const words = ['from road speed'];
      if (speed !== undefined) words.push(`${formatNumber(speed)} ${unit}`);
      if (tyre) words.push(`on ${tyre}`);
      return words.join(' ');
    }
    case 'belt':
      return `by belt from ${from ?? 'another part'}`;
    case 'gear':
      return `through gears from ${from ?? 'another part'}`;
    case 'shaft':
      return `on the same shaft as ${from ?? 'another part'}`;
    case 'strobe':
      return 'found with the strobe';
    case 'sound': {
      const precision = num(d, 'precisionPercent');
      const how =
        text(d, 'confirmedBy') === 'strobe'
          ? 'found by sound, confirmed by strobe'
          : 'found by sound';
      return precision === undefined ? how : `${how}, ±${formatNumber(precision)} %`;
    }
    case 'nameplate': {
      const rpm = num(d, 'rpm');
      return rpm === undefined
        ? 'from the motor nameplate'
        : `from the motor nameplate, ${formatNumber(rpm)} rpm`;
    }
  }
}

/**
 * Where the speed came from and when it was applied. "Applied" keeps the day apart from the
 * words before it ("from road speed 50 km/h on 205/55R16, applied on …", not "… on 205/55R16 on …").
 * @example originLine({ method: 'strobe', detail: {}, at: '2026-12-02T08:00:00Z' }) // "Speed found with the strobe, applied on 2026-12-02."
 */
export function originLine(origin: SpeedOrigin): string {
  return `Speed ${originWords(origin)}, applied on ${originDay(origin)}.`;
}
