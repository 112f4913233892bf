// The analytic preview renderer: draws a bladed part into an RGBA buffer as a flash, a camera
// or the eye shows it. No DOM, no Preact: it runs in node on a plain Uint8ClampedArray.
//
// Every pixel is computed on its own, in closed form (see coverage.ts): the pixel's angle is
// compared with the part's angle at that pixel's own sample time, and an exposure becomes the
// share of the swept interval the blades cover. Nothing is drawn by stacking copies.
//
// Angles are kept in turns (0…1) and reduced with floor() before they meet a pixel angle, so a
// long-running clock loses no precision. The part's angle at time t is f·t turns.
import { drawFlashes, drawSwept } from './kernels';
import { bladeDutyFor, defaultPreviewLook, type PreviewLook } from './look';
import { sharedPixelTables, type PixelTables } from './pixelTables';
import { checkScene, sampleIndexAt, type PreviewScene } from './scene';

/** Anything shaped like ImageData: RGBA bytes, row by row. */
export interface PixelBuffer {
  data: Uint8ClampedArray;
  width: number;
  height: number;
}

/**
 * Most flashes a frame of the flash preview adds up. The eye's fading image is the sum of
 * the recent flashes, each weighted by exp(−age/fade); beyond 16 flashes the oldest weigh
 * little next to the rest, and the largest image count looked for (8) still fits twice.
 */
export const MAX_FLASHES_ON_EYE = 16;

/**
 * Flashes whose part angles differ by less than this (turns; about 0.00004°, far below any
 * pixel's width) are drawn as one image with their weights added.
 */
const SAME_ANGLE_TURNS = 1e-7;

/** A flash whose weight has dropped below 1/256 cannot change an 8-bit pixel. */
const FADE_CUTOFF = Math.log(256);

export class PreviewRenderer {
  private look: PreviewLook;
  private tables: PixelTables | null = null;
  private words: Int32Array | null = null;
  private readonly flashPhase = new Float64Array(MAX_FLASHES_ON_EYE);
  private readonly flashWeight = new Float64Array(MAX_FLASHES_ON_EYE);
  /** Colours as numbers, refreshed with the look: background, blade − background, mark − blade, hub. */
  private readonly colour = new Float64Array(12);

  constructor(look: PreviewLook = defaultPreviewLook) {
    this.look = look;
    this.setColours();
  }

  /** Changes colours or proportions; the pixel tables are rebuilt only when a radius changes. */
  setLook(look: PreviewLook): void {
    if (look.hubRadius !== this.look.hubRadius || look.tipRadius !== this.look.tipRadius)
      this.tables = null;
    this.look = look;
    this.setColours();
  }

  /**
   * Draws one frame of `scene` into `target`. Allocates only when the target's size differs
   * from the previous call. Throws InputError for a scene that cannot be drawn.
   */
  render(scene: PreviewScene, target: PixelBuffer): void {
    checkScene(scene);
    const { width, height, data } = target;
    if (
      !(Number.isInteger(width) && Number.isInteger(height) && width > 0 && height > 0) ||
      data.length < width * height * 4
    ) {
      throw new RangeError(`The pixel buffer must hold ${width}×${height} RGBA pixels.`);
    }
    const tables = this.tablesFor(width, height);
    const n = scene.features;
    const duty = bladeDutyFor(n, this.look);

    if (scene.sampler === 'flash') {
      this.drawFlash(scene, tables, data, n, duty);
      return;
    }
    let startTurns: number;
    let readoutTurns = 0;
    if (scene.sampler === 'frames') {
      // Frame k starts at k/s; the top row starts its exposure then, each later row later.
      const k = sampleIndexAt(scene.timeS, scene.rateHz);
      startTurns = frac((scene.speedHz / scene.rateHz) * k);
      readoutTurns = scene.speedHz * scene.readoutS;
    } else {
      // The eye's window ends now.
      startTurns = frac(scene.speedHz * (scene.timeS - scene.exposureS));
    }
    drawSwept(
      tables,
      this.wordsOf(data),
      this.colour,
      n,
      duty,
      startTurns,
      readoutTurns,
      scene.speedHz * scene.exposureS,
    );
  }

  /** A 32-bit view of the target's bytes, so each pixel is one store; rebuilt only for a new buffer. */
  private wordsOf(data: Uint8ClampedArray): Int32Array {
    const w = this.words;
    if (
      w &&
      w.buffer === data.buffer &&
      w.byteOffset === data.byteOffset &&
      w.length === data.length >> 2
    )
      return w;
    if (data.byteOffset % 4 !== 0)
      throw new RangeError('The pixel buffer must start on a 4-byte boundary.');
    this.words = new Int32Array(data.buffer, data.byteOffset, data.length >> 2);
    return this.words;
  }

  private tablesFor(width: number, height: number): PixelTables {
    const t = this.tables;
    if (t && t.width === width && t.height === height) return t;
    this.tables = sharedPixelTables(width, height, this.look.hubRadius, this.look.tipRadius);
    return this.tables;
  }

  private setColours(): void {
    const { background: bg, blade, mark, hub } = this.look;
    for (let c = 0; c < 3; c++) {
      this.colour[c] = bg[c];
      this.colour[3 + c] = blade[c] - bg[c];
      this.colour[6 + c] = mark[c] - blade[c];
      this.colour[9 + c] = hub[c];
    }
  }

  /**
   * The eye under a flash: the sum of the latest flashes' images, each fading as
   * exp(−age/fade) and scaled so a steady image keeps its full strength. The background is
   * left steady on purpose: only the blades fade, so the preview never flashes the screen.
   */
  private drawFlash(
    scene: PreviewScene,
    tables: PixelTables,
    data: Uint8ClampedArray,
    n: number,
    duty: number,
  ): void {
    const { rateHz: s, speedHz: f, timeS: t, fadeS: fade } = scene;
    const latest = sampleIndexAt(t, s);
    const count =
      fade > 0 ? Math.min(MAX_FLASHES_ON_EYE, 1 + Math.ceil(s * fade * FADE_CUTOFF)) : 1;
    let steady = 0;
    let distinct = 0;
    for (let j = 0; j < count; j++) {
      const index = latest - j;
      const age = Math.max(0, t - index / s);
      const phase = frac((f / s) * index);
      const weight = fade > 0 ? Math.exp(-age / fade) : 1;
      steady += fade > 0 ? Math.exp(-j / (s * fade)) : 1;
      // At a lock the flashes revisit the same few angles: add their weights once, not per flash.
      let k = 0;
      while (k < distinct && turnsApart(this.flashPhase[k], phase) > SAME_ANGLE_TURNS) k++;
      if (k === distinct) {
        this.flashPhase[k] = phase;
        this.flashWeight[k] = 0;
        distinct++;
      }
      this.flashWeight[k] += weight;
    }
    for (let k = 0; k < distinct; k++) this.flashWeight[k] /= steady;
    drawFlashes(
      tables,
      this.wordsOf(data),
      this.colour,
      n,
      duty,
      this.flashPhase,
      this.flashWeight,
      distinct,
      f * scene.exposureS,
    );
  }
}

/** Distance between two angles in [0, 1) turns, the short way round. */
function turnsApart(a: number, b: number): number {
  const d = Math.abs(a - b);
  return d < 0.5 ? d : 1 - d;
}

function frac(x: number): number {
  return x - Math.floor(x);
}
