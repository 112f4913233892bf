import { useEffect, useMemo, useRef, useState } from 'preact/hooks';
import { apparentMotion, InputError, type Part, type Sampler } from '../../../core';
import { CanvasPreview } from '../../../render/canvasPreview';
import { checkScene, sampleIndexAt, sampleTimeS, type PreviewScene } from '../../../render/scene';

import { lookFromCss } from './css-colour';
import { useFrameLoop } from '../../../ui/frameLoop';
import { readLive, type Live } from '../../../ui/live';
import { safetyCautions } from '../../../words/cautions';
import { lookPhrase } from '../../../words/look';
import {
  counterText,
  emptyScene,
  flashesInRiskRange,
  prefersReducedMotion,
  sceneFromProps,
} from './scene';
import style from './style.module.css';

export interface Props {
  /** The part, in the core's units: signed speed in rev/s and its feature count. */
  part: Part;
  /** 'flash': a strobe or flickering light watched live; 'frames': a camera. */
  sampler: Sampler;
  /** Flashes or frames per second. */
  rateHz: number;
  /** Camera exposure, or a strobe's flash duration (0 = an instant), seconds. */
  exposureS: number;
  /** Camera rolling-shutter readout, top to bottom, seconds (0 = global shutter). */
  readoutS?: number;
  /**
   * Show the stillness caution of docs/physics.md §10 when what is drawn can mislead (default true).
   * Pass false only where the screen shows it right beside the preview. The caution about the
   * playback's own flashing shows either way: only the preview knows how fast it flashes. A
   * signal where that changes as the entries do (only the cautions follow it).
   */
  showCautions?: Live<boolean>;
  class?: string;
}

/** Playback speeds: how many times slower than real time the part's clock runs. */
const SLOW_FACTORS = [1, 2, 5, 10, 30, 100] as const;

/**
 * The window the true view integrates, in real seconds: one refresh of a 60 Hz display, which
 * is also about as much as the eye resolves of a fast part. A part that turns a whole pitch or
 * more in it shows as the even blur a person sees.
 */
const DISPLAY_FRAME_S = 1 / 60;

/**
 * The part as the sampler shows it, beside the part as it really turns, drawn per pixel by the
 * analytic renderer (src/render). Plays in real time or slowed, pauses, steps one sample.
 */
export function Preview({
  part,
  sampler,
  rateHz,
  exposureS,
  readoutS = 0,
  showCautions = true,
  class: extra,
}: Props) {
  const rootRef = useRef<HTMLElement>(null);
  const sampledCanvas = useRef<HTMLCanvasElement>(null);
  const trueCanvas = useRef<HTMLCanvasElement>(null);
  const counterRef = useRef<HTMLOutputElement>(null);

  const [slow, setSlow] = useState<number>(1);
  const [playing, setPlaying] = useState(
    () => !prefersReducedMotion() && !flashesInRiskRange(sampler, rateHz, 1),
  );

  // What the frame loop reads: refs, so a running loop sees changes without restarting.
  const anim = useRef({ timeS: 0, lastMs: 0, counter: '' });
  const previews = useRef<{ sampled: CanvasPreview; real: CanvasPreview } | null>(null);
  const sampledScene = useRef<PreviewScene>({
    ...emptyScene,
    sampler: sampler === 'flash' ? 'flash' : 'frames',
  });
  const trueScene = useRef<PreviewScene>({ ...emptyScene, sampler: 'true' });

  const problem = useMemo(() => {
    try {
      checkScene(sceneFromProps(part, sampler, rateHz, exposureS, readoutS));
      apparentMotion(part, rateHz, { sampler });
      return '';
    } catch (error) {
      return error instanceof InputError
        ? error.message
        : 'The preview cannot be drawn for these settings.';
    }
  }, [part, sampler, rateHz, exposureS, readoutS]);

  const motion = useMemo(
    () => (problem ? null : apparentMotion(part, rateHz, { sampler })),
    [problem, part, rateHz, sampler],
  );

  // Keep the scenes in step with the props; the loop fills in the time.
  Object.assign(sampledScene.current, sceneFromProps(part, sampler, rateHz, exposureS, readoutS));
  Object.assign(trueScene.current, {
    features: part.symmetry,
    speedHz: part.speedHz,
    exposureS: DISPLAY_FRAME_S / slow,
  });

  const draw = () => {
    const p = previews.current;
    if (!p || problem) return;
    const a = anim.current;
    sampledScene.current.timeS = a.timeS;
    trueScene.current.timeS = a.timeS;
    p.sampled.draw(sampledScene.current);
    p.real.draw(trueScene.current);
    const text = counterText(sampler, sampleIndexAt(a.timeS, rateHz), a.timeS, slow);
    if (text !== a.counter && counterRef.current) {
      counterRef.current.textContent = text;
      a.counter = text;
    }
  };

  const wake = useFrameLoop(rootRef, (now) => {
    const a = anim.current;
    if (playing) {
      // A long gap (tab in the background, a slow frame) advances at most 0.1 s of real time.
      const dt = a.lastMs > 0 ? Math.min(0.1, (now - a.lastMs) / 1000) : 0;
      a.timeS += dt / slow;
    }
    a.lastMs = playing ? now : 0;
    draw();
    return playing && !problem;
  });

  // Canvases: one renderer each, backing store sized by devicePixelRatio as the layout changes.
  useEffect(() => {
    const root = rootRef.current;
    const a = sampledCanvas.current;
    const b = trueCanvas.current;
    if (!root || !a || !b) return;
    const sampled = new CanvasPreview(a);
    const real = new CanvasPreview(b);
    previews.current = { sampled, real };
    const applyLook = () => {
      const look = lookFromCss(root, a.getContext('2d'));
      sampled.setLook(look);
      real.setLook(look);
      wake();
    };
    const resize = () => {
      const dpr = window.devicePixelRatio || 1;
      const changedA = sampled.resize(a.clientWidth, dpr);
      const changedB = real.resize(b.clientWidth, dpr);
      if (changedA || changedB) wake();
    };
    applyLook();
    resize();
    const observer = typeof ResizeObserver === 'function' ? new ResizeObserver(resize) : null;
    observer?.observe(a);
    observer?.observe(b);
    const scheme =
      typeof matchMedia === 'function' ? matchMedia('(prefers-color-scheme: dark)') : null;
    scheme?.addEventListener('change', applyLook);
    return () => {
      observer?.disconnect();
      scheme?.removeEventListener('change', applyLook);
      previews.current = null;
    };
  }, []);

  // Any change of what is shown redraws once, even while paused.
  useEffect(() => wake(), [part, sampler, rateHz, exposureS, readoutS, slow, playing, problem]);

  const stepOne = () => {
    setPlaying(false);
    const a = anim.current;
    a.timeS = sampleTimeS(sampleIndexAt(a.timeS, rateHz) + 1, rateHz);
    wake();
  };

  const sampleWord = sampler === 'flash' ? 'flash' : 'frame';
  const samplerView = sampler === 'flash' ? 'As the flashes show it' : 'As the camera shows it';

  return (
    <section
      ref={rootRef}
      class={`${style.preview} ${extra ?? ''}`}
      aria-label="Preview of the turning part"
    >
      <div class={style.views}>
        <figure class={style.view}>
          <canvas
            ref={sampledCanvas}
            class={style.canvas}
            role="img"
            aria-label={`${samplerView}: ${motion ? lookPhrase(motion.look, motion.images) : 'nothing to show'}`}
            data-testid="preview-sampled"
          />
          <figcaption class={style.caption}>{samplerView}</figcaption>
        </figure>
        <figure class={style.view}>
          <canvas
            ref={trueCanvas}
            class={style.canvas}
            role="img"
            aria-label="As it really turns"
            data-testid="preview-true"
          />
          <figcaption class={style.caption}>As it really turns</figcaption>
        </figure>
      </div>
      {problem ? (
        <p class={style.problem} role="alert">
          {problem}
        </p>
      ) : (
        <div class={style.controls}>
          <button
            type="button"
            class={style.button}
            aria-pressed={playing}
            onClick={() => {
              anim.current.lastMs = 0;
              setPlaying(!playing);
            }}
          >
            {playing ? 'Pause' : 'Play'}
          </button>
          <button type="button" class={style.button} onClick={stepOne}>
            Next {sampleWord}
          </button>
          <label class={style.speed}>
            <span>Playback</span>
            <select
              class={style.select}
              value={String(slow)}
              onChange={(e) => setSlow(Number((e.target as HTMLSelectElement).value))}
            >
              {SLOW_FACTORS.map((f) => (
                <option key={f} value={String(f)}>
                  {f === 1 ? 'Real time' : `${f}× slower`}
                </option>
              ))}
            </select>
          </label>
          <output ref={counterRef} class={style.counter} data-testid="preview-counter">
            {counterText(sampler, 0, 0, slow)}
          </output>
        </div>
      )}
      <PreviewCautions
        show={showCautions}
        misleading={motion !== null && motion.look !== 'true'}
        flashRatesHz={sampler === 'flash' && playing ? [rateHz / slow] : []}
      />
    </section>
  );
}

/**
 * Stillness that is not real (when the preview is to give that caution and what it draws can
 * mislead), and a playback that flashes at 3–60 a second. The closing planning-aid line, which
 * always applies, is the screen's to show once.
 */
function PreviewCautions({
  show,
  misleading,
  flashRatesHz,
}: {
  show: Live<boolean>;
  misleading: boolean;
  flashRatesHz: number[];
}) {
  const cautions = safetyCautions({
    apparentStillness: readLive(show) && misleading,
    flashRatesHz,
  }).slice(0, -1);
  if (cautions.length === 0) return null;
  return (
    <ul class={style.cautions}>
      {cautions.map((c) => (
        <li key={c} class={style.caution}>
          {c}
        </li>
      ))}
    </ul>
  );
}
