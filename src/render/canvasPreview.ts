// The preview on a canvas: owns the renderer and one ImageData, sized to the canvas's backing
// store. Nothing here is Preact; nothing allocates per frame, only when the size changes.
import { PreviewRenderer } from './preview';
import type { PreviewLook } from './look';
import type { PreviewScene } from './scene';

/**
 * Most pixels a preview canvas's backing store gets on a side. The renderer costs a few ns a
 * pixel; a phone at 3× device pixels would otherwise ask for nine times the pixels of 1×, for
 * a picture the eye cannot tell from this one at that size.
 */
export const MAX_BACKING_SIDE = 480;

/** Backing-store side in device pixels for a canvas `cssSide` CSS pixels wide at `dpr`. */
export function backingSide(cssSide: number, dpr: number): number {
  const wanted = Math.round(cssSide * (Number.isFinite(dpr) && dpr > 0 ? dpr : 1));
  return Math.max(1, Math.min(MAX_BACKING_SIDE, wanted));
}

export class CanvasPreview {
  private readonly canvas: HTMLCanvasElement;
  private readonly context: CanvasRenderingContext2D | null;
  private readonly renderer: PreviewRenderer;
  private image: ImageData | null = null;

  constructor(canvas: HTMLCanvasElement, look?: PreviewLook) {
    this.canvas = canvas;
    this.context = canvas.getContext('2d', { alpha: false });
    this.renderer = new PreviewRenderer(look);
  }

  /** False where the browser gives no 2D canvas (then nothing is drawn). */
  get usable(): boolean {
    return this.context !== null;
  }

  setLook(look: PreviewLook): void {
    this.renderer.setLook(look);
  }

  /** Sizes the backing store for a square canvas `cssSide` CSS pixels wide; true when it changed. */
  resize(cssSide: number, dpr: number): boolean {
    const side = backingSide(cssSide, dpr);
    if (this.canvas.width === side && this.canvas.height === side && this.image) return false;
    this.canvas.width = side;
    this.canvas.height = side;
    this.image = this.context ? this.context.createImageData(side, side) : null;
    return true;
  }

  /** Draws one frame. Throws InputError (from the renderer) for a scene that cannot be drawn. */
  draw(scene: PreviewScene): void {
    if (!this.context || !this.image) return;
    this.renderer.render(scene, this.image);
    this.context.putImageData(this.image, 0, 0);
  }
}
