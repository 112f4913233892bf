// A one-line description of a saved machine's set-up for the list.
import { formatNumber, formatPrecise } from '../../words/format';
import { type Setup, activePartOf } from '../../state/model';

/**
 * "Cooler fan (8 blades): 1,015 rpm, 8 features · strobe at 1,015 fpm".
 * @example setupSummary(defaultSetup) // "Fan: 1,770 rpm, 6 features · strobe at 1,770 fpm"
 */
export function setupSummary(s: Setup): string {
  const part = activePartOf(s);
  const features = part.features === 1 ? '1 mark' : `${formatNumber(part.features)} features`;
  const name = part.name.trim() ? `${part.name.trim()}: ` : '';
  const sampler =
    s.samplerKind === 'strobe'
      ? `strobe at ${formatPrecise(s.strobe.rateFpm)} fpm`
      : s.samplerKind === 'camera'
        ? `camera at ${formatPrecise(s.camera.frameRate)} fps`
        : `lighting on ${s.lighting.mainsHz} Hz mains`;
  return `${name}${formatNumber(part.speedRpm)} rpm, ${features} · ${sampler}`;
}
