// A one-line description of a saved machine for the list.
import { formatNumber, formatPrecise } from '../../words/format';
import { featureWords } from '../../words/partKinds';
import { type Machine, type Setup, activePartOf } from '../../state/model';

/**
 * "Fan: 1,770 rpm, 6 blades · strobe at 1,770 fpm" (the chosen part and the sampler).
 * @example setupSummary(defaultSetup) // "Fan: 1,770 rpm, 6 blades · strobe at 1,770 fpm"
 */
export function setupSummary(s: Setup): string {
  const part = activePartOf(s);
  const name = part.name.trim() ? `${part.name.trim()}: ` : '';
  const sampler =
    s.samplerKind === 'strobe'
      ? `strobe at ${formatPrecise(s.strobe.rateFpm)} fpm`
      : s.samplerKind === 'camera'
        ? `camera at ${formatPrecise(s.camera.frameRate)} fps`
        : `lighting on ${s.lighting.mainsHz} Hz mains`;
  return `${name}${formatNumber(part.speedRpm)} rpm, ${featureWords(part)} · ${sampler}`;
}

/**
 * A saved machine in one line: how many parts, then the chosen part and the sampler.
 * @example machineSummary(example) // "2 parts · Cooler fan (8 blades): 1,015 rpm, 8 blades · strobe at 1,015 fpm"
 */
export function machineSummary(m: Machine): string {
  const count = m.setup.parts.length;
  return `${count === 1 ? '1 part' : `${count} parts`} · ${setupSummary(m.setup)}`;
}
