import { formatNumber, formatPercent } from '../../lib/format';
import { check, type LightingResult } from '../../state/check';
import { Panel } from '../Panel';
import style from './style.module.css';

interface Props {
  class?: string;
  /** The light to describe, for a screen other than the check (defaults to the check's). */
  lighting?: LightingResult;
}

const RISK_WORDS: Record<LightingResult['risk'], string> = {
  'no-effect': 'Below the no-observable-effect line',
  'low-risk': 'Between the no-effect and low-risk lines',
  elevated: 'Above the low-risk line',
};

/** For lighting: the flicker, its risk class by IEEE Std 1789-2015 and its visibility (CIE TN 006:2016). */
export function LightingReadout({ class: extra, lighting }: Props) {
  const l = lighting ?? check.value.lighting;
  if (!l) return null;
  const visible = l.svm >= 1;
  return (
    <Panel title="The light" id="lighting-readout" class={extra}>
      <dl class={style.facts}>
        <div>
          <dt>Flicker</dt>
          <dd>
            {formatNumber(l.flickerHz)} Hz at {formatPercent(l.modulationPercent)}
          </dd>
        </div>
        <div data-risk={l.risk}>
          <dt>IEEE Std 1789-2015</dt>
          <dd data-testid="flicker-risk">{RISK_WORDS[l.risk]}</dd>
          <dd class={style.words}>
            At {formatNumber(l.flickerHz)} Hz the lines are {formatPercent(l.noEffectPercent)} (no
            observable effect) and {formatPercent(l.lowRiskPercent)} (low risk).
          </dd>
        </div>
        <div>
          <dt>Stroboscopic visibility (SVM)</dt>
          <dd data-testid="svm">{formatNumber(l.svm, 2)}</dd>
          <dd class={style.words}>
            {l.modulationPercent === 0
              ? 'Steady light: no stroboscopic effect.'
              : visible
                ? 'At or above 1: most people will see the effect (CIE TN 006:2016).'
                : 'Below 1: most people will not notice the effect, but some will (CIE TN 006:2016).'}
          </dd>
        </div>
      </dl>
    </Panel>
  );
}
