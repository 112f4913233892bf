import { formatNumber, formatPercent } from '../../words/format';
import { listedAnswer, type LightingResult } from '../../state/check';
import { Panel } from '../panel';
import { RISK_LINE_WORDS } from '../../words/lighting';
import style from './style.module.css';

interface Props {
  class?: string;
  /** The light to describe, for a screen other than the check (defaults to the check's). */
  lighting?: LightingResult;
}

/** The light's shape in words, with a PWM light's duty. */
function waveWords(l: LightingResult): string {
  switch (l.wave.shape) {
    case 'sine':
      return 'Sine';
    case 'rectangular':
      return `PWM, on ${formatPercent(100 * (l.wave.dutyCycle ?? 0.5))} of each period`;
    case 'rectified':
      return 'Rectified mains';
  }
}

/**
 * For lighting: the flicker and its waveform, its risk class by IEEE Std 1789-2015, and its
 * stroboscopic visibility (SVM, CIE TN 006:2016, with the threshold fit of Perz et al. 2018)
 * from the light's harmonics up to 2 kHz.
 */
export function LightingReadout({ class: extra, lighting }: Props) {
  const l = lighting ?? listedAnswer.value.lighting;
  if (!l) return null;
  const visible = l.svm >= 1;
  const steady = l.modulationPercent === 0;
  return (
    <Panel
      title="The light"
      id="lighting-readout"
      class={extra}
      // Skipped off screen when it follows the check, whose lists change with each keystroke.
      offscreenSkipped={lighting === undefined}
    >
      <dl class={style.facts}>
        <div>
          <dt>Flicker</dt>
          <dd>
            {formatNumber(l.flickerHz)} Hz at {formatPercent(l.modulationPercent)}
          </dd>
          <dd class={style.words} data-testid="light-wave">
            {waveWords(l)}
            {!steady &&
              `: its ${formatNumber(l.flickerHz)} Hz component swings ${formatPercent(100 * l.fundamental)} of the mean light (a sine of the same percent flicker: ${formatPercent(l.modulationPercent)})${l.harmonicCount > 1 ? `; ${l.harmonicCount} components up to 2 kHz counted` : ''}.`}
          </dd>
        </div>
        <div data-risk={l.risk}>
          <dt>IEEE Std 1789-2015</dt>
          <dd data-testid="flicker-risk">{RISK_LINE_WORDS[l.risk]}</dd>
          <dd class={style.words}>
            At {formatNumber(l.flickerHz)} Hz the lines are {formatPercent(l.noEffectPercent)} (no
            observable effect) and {formatPercent(l.lowRiskPercent)} (low risk).
          </dd>
        </div>
        <div>
          <dt>Stroboscopic visibility (SVM)</dt>
          <dd data-testid="svm">{formatNumber(l.svm, 2)}</dd>
          <dd class={style.words}>
            {steady
              ? 'Steady light: no stroboscopic effect.'
              : l.harmonicCount === 0
                ? 'No component below 2 kHz: the measure counts none.'
                : visible
                  ? 'At or above 1: most people will see the effect.'
                  : 'Below 1: most people will not notice the effect, but some will.'}{' '}
            SVM as defined in CIE TN 006:2016, with the visibility threshold fit of Perz et al.,
            JOSA A 35(2):309 (2018).
          </dd>
        </div>
      </dl>
    </Panel>
  );
}
