// Colours for the canvas from the page's CSS custom properties, so the screen's palette (and
// its dark set) decides how the preview looks.
import { defaultPreviewLook, type PreviewLook, type Rgb } from '../../../render/look';

/**
 * Reads "#rgb", "#rrggbb", "rgb(r, g, b)" or "rgba(r, g, b, a)", the forms a canvas gives back
 * for a fillStyle; null for anything else.
 * @example parseCssColour('#0d3b4f') // [13, 59, 79]
 * @example parseCssColour('rgba(242, 177, 52, 0.5)') // [242, 177, 52]
 */
export function parseCssColour(text: string): Rgb | null {
  const t = text.trim().toLowerCase();
  const hex = /^#([0-9a-f]{3}|[0-9a-f]{6})$/.exec(t);
  if (hex) {
    const h = hex[1].length === 3 ? [...hex[1]].map((c) => c + c).join('') : hex[1];
    return [parseInt(h.slice(0, 2), 16), parseInt(h.slice(2, 4), 16), parseInt(h.slice(4, 6), 16)];
  }
  const rgb = /^rgba?\(\s*([\d.]+)\s*,?\s*([\d.]+)\s*,?\s*([\d.]+)/.exec(t);
  if (rgb) {
    const channels = [rgb[1], rgb[2], rgb[3]].map((v) =>
      Math.max(0, Math.min(255, Math.round(Number(v)))),
    );
    return channels.every(Number.isFinite) ? [channels[0], channels[1], channels[2]] : null;
  }
  return null;
}

/**
 * The value of custom property `name` on `element` as sRGB, resolved through a 2D context's
 * colour parser (which accepts every CSS colour form); `fallback` when unset or unreadable.
 */
export function readCssColour(
  element: Element,
  name: string,
  probe: CanvasRenderingContext2D | null,
  fallback: Rgb,
): Rgb {
  const value = getComputedStyle(element).getPropertyValue(name).trim();
  if (!value) return fallback;
  const direct = parseCssColour(value);
  if (direct || !probe) return direct ?? fallback;
  probe.fillStyle = '#010203'; // a sentinel: an unparsable value leaves it unchanged
  probe.fillStyle = value;
  const resolved = String(probe.fillStyle);
  return resolved === '#010203' && value !== '#010203'
    ? fallback
    : (parseCssColour(resolved) ?? fallback);
}

/** The preview's look from the custom properties the widget's stylesheet sets on `element`. */
export function lookFromCss(element: Element, probe: CanvasRenderingContext2D | null): PreviewLook {
  const d = defaultPreviewLook;
  return {
    ...d,
    background: readCssColour(element, '--preview-background', probe, d.background),
    blade: readCssColour(element, '--preview-blade', probe, d.blade),
    mark: readCssColour(element, '--preview-mark', probe, d.mark),
    hub: readCssColour(element, '--preview-hub', probe, d.hub),
  };
}
