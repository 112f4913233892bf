// Per-pixel geometry of the preview, computed once per canvas size so a frame allocates nothing.

export interface PixelTables {
  width: number;
  height: number;
  /** Angle of each pixel centre about the canvas centre, turns in [0, 1), clockwise on screen from +x. */
  angleTurns: Float64Array;
  /** Angle one pixel spans at that radius, turns: the box filter that smooths the blade edges. */
  pixelTurns: Float32Array;
  /** Share of the pixel inside the blade ring (hub to tips), 0…1, edges smoothed over one pixel. */
  ringWeight: Float32Array;
  /** Share of the pixel inside the hub, 0…1. */
  hubWeight: Float32Array;
}

/**
 * Angle, angular footprint and ring/hub weights of every pixel of a width×height canvas.
 * Radii are shares of half the shorter side; y grows downward, so angles grow clockwise.
 */
export function buildPixelTables(
  width: number,
  height: number,
  hubRadius: number,
  tipRadius: number,
): PixelTables {
  const count = width * height;
  const tables: PixelTables = {
    width,
    height,
    angleTurns: new Float64Array(count),
    pixelTurns: new Float32Array(count),
    ringWeight: new Float32Array(count),
    hubWeight: new Float32Array(count),
  };
  const cx = width / 2;
  const cy = height / 2;
  const half = Math.min(width, height) / 2;
  const hubPx = hubRadius * half;
  const tipPx = tipRadius * half;
  const TAU = 2 * Math.PI;
  for (let y = 0; y < height; y++) {
    const dy = y + 0.5 - cy;
    for (let x = 0; x < width; x++) {
      const i = y * width + x;
      const dx = x + 0.5 - cx;
      const r = Math.hypot(dx, dy);
      let turns = Math.atan2(dy, dx) / TAU;
      if (turns < 0) turns += 1;
      tables.angleTurns[i] = turns;
      // One pixel's width seen from the centre; capped at a whole turn near the centre.
      tables.pixelTurns[i] = r > 1 / TAU ? 1 / (TAU * r) : 1;
      // A linear ramp one pixel wide approximates the pixel's area share at a circular edge.
      const hub = clamp01(hubPx - r + 0.5);
      tables.hubWeight[i] = hub;
      tables.ringWeight[i] = Math.min(1 - hub, clamp01(tipPx - r + 0.5));
    }
  }
  return tables;
}

/** Tables built lately, newest last: the preview's two canvases share one size. */
const recent: Array<{ hubRadius: number; tipRadius: number; tables: PixelTables }> = [];
const RECENT_KEPT = 2;

/**
 * The tables for a canvas, shared by every renderer that asks for the same size and radii:
 * building them is the costliest step of a first frame, and they are only ever read.
 */
export function sharedPixelTables(
  width: number,
  height: number,
  hubRadius: number,
  tipRadius: number,
): PixelTables {
  const found = recent.find(
    (r) =>
      r.tables.width === width &&
      r.tables.height === height &&
      r.hubRadius === hubRadius &&
      r.tipRadius === tipRadius,
  );
  if (found) return found.tables;
  const tables = buildPixelTables(width, height, hubRadius, tipRadius);
  recent.push({ hubRadius, tipRadius, tables });
  if (recent.length > RECENT_KEPT) recent.shift();
  return tables;
}

function clamp01(v: number): number {
  return v < 0 ? 0 : v > 1 ? 1 : v;
}
