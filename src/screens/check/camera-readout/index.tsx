import { formatExposure, formatNumber } from '../../../words/format';
import { listedAnswer } from '../../../state/check';
import { BLUR_WORDS, SKEW_WORDS } from '../../../words/check';
import { Panel } from '../../../ui/panel';
import style from './style.module.css';

interface Props {
  class?: string;
}

/** For a camera: blur per frame and the rolling-shutter bend. */
export function CameraReadout({ class: extra }: Props) {
  const c = listedAnswer.value.camera;
  if (!c) return null;
  return (
    <Panel title="In each frame" id="camera-readout" class={extra} offscreenSkipped>
      <dl class={style.facts}>
        <div>
          <dt>Exposure</dt>
          <dd>
            {formatExposure(c.exposureS)} ({formatNumber(c.shutterAngleDeg)}°)
          </dd>
        </div>
        <div data-look={c.blurLook}>
          <dt>Blur per frame</dt>
          <dd data-testid="blur">
            {formatNumber(c.blurDeg)}° of turn, {formatNumber(c.blurPitches)} pitches
          </dd>
          <dd class={style.words}>{BLUR_WORDS[c.blurLook]}</dd>
        </div>
        <div data-look={c.skewLook}>
          <dt>Rolling-shutter bend</dt>
          <dd data-testid="skew">
            {formatNumber(c.skewDeg)}° top to bottom, {formatNumber(c.skewPitches)} pitches
          </dd>
          <dd class={style.words}>Blades look {SKEW_WORDS[c.skewLook]}</dd>
        </div>
      </dl>
    </Panel>
  );
}
