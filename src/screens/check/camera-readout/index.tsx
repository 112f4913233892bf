import { formatExposure, formatNumber } from '../../../words/format';
import { check, type CameraResult } from '../../../state/check';
import { Panel } from '../../../ui/panel';
import style from './style.module.css';

interface Props {
  class?: string;
}

const BLUR_WORDS: Record<CameraResult['blurLook'], string> = {
  sharp: 'sharp',
  streaked: 'streaked: edges drawn out along the turn',
  smeared: 'smeared into an even disc: single features cannot be seen',
};

const SKEW_WORDS: Record<CameraResult['skewLook'], string> = {
  straight: 'straight',
  bent: 'bent into curves',
  broken: 'broken into pieces: more than one pitch passes during the readout',
};

/** For a camera: blur per frame and the rolling-shutter bend. */
export function CameraReadout({ class: extra }: Props) {
  const c = check.value.camera;
  if (!c) return null;
  return (
    <Panel title="In each frame" id="camera-readout" class={extra}>
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
