import type { Positions } from './layout';

/** Screen = world · k + (x, y). */
export interface ViewTransform {
  k: number;
  x: number;
  y: number;
}

export const MIN_ZOOM = 0.05;
export const MAX_ZOOM = 12;
const clampZoom = (k: number) => Math.min(MAX_ZOOM, Math.max(MIN_ZOOM, k));

export const toWorld = (t: ViewTransform, sx: number, sy: number): [number, number] => [(sx - t.x) / t.k, (sy - t.y) / t.k];
export const toScreen = (t: ViewTransform, wx: number, wy: number): [number, number] => [wx * t.k + t.x, wy * t.k + t.y];

/** The transform that shows every depot inside width×height with `padding` px to spare. */
/** Screen bands covered by controls (px): a fit keeps every depot out of them. */
export interface Insets {
  top: number;
  right: number;
  bottom: number;
  left: number;
}

const NO_INSETS: Insets = { top: 0, right: 0, bottom: 0, left: 0 };

export function fitTransform(xy: Positions, fullWidth: number, fullHeight: number, padding = 48, insets: Insets = NO_INSETS): ViewTransform {
  // Fit into the area the controls leave free, then shift back into canvas coordinates.
  const width = Math.max(1, fullWidth - insets.left - insets.right);
  const height = Math.max(1, fullHeight - insets.top - insets.bottom);
  const t = fitFree(xy, width, height, padding);
  return { k: t.k, x: t.x + insets.left, y: t.y + insets.top };
}

function fitFree(xy: Positions, width: number, height: number, padding: number): ViewTransform {
  const n = xy.length / 2;
  if (n === 0 || width <= 0 || height <= 0) return { k: 1, x: width / 2, y: height / 2 };
  let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity;
  for (let i = 0; i < n; i++) {
    minX = Math.min(minX, xy[2 * i]); maxX = Math.max(maxX, xy[2 * i]);
    minY = Math.min(minY, xy[2 * i + 1]); maxY = Math.max(maxY, xy[2 * i + 1]);
  }
  const w = Math.max(maxX - minX, 1), h = Math.max(maxY - minY, 1);
  // A single depot or a tight cluster should not zoom in absurdly far.
  const k = clampZoom(Math.min((width - 2 * padding) / w, (height - 2 * padding) / h, 2));
  return { k, x: width / 2 - ((minX + maxX) / 2) * k, y: height / 2 - ((minY + maxY) / 2) * k };
}

/** Zoom by `factor` keeping the world point under (sx, sy) fixed (wheel, pinch, buttons). */
export function zoomAt(t: ViewTransform, factor: number, sx: number, sy: number): ViewTransform {
  const k = clampZoom(t.k * factor);
  const f = k / t.k;
  return { k, x: sx - (sx - t.x) * f, y: sy - (sy - t.y) * f };
}

export const panBy = (t: ViewTransform, dx: number, dy: number): ViewTransform => ({ k: t.k, x: t.x + dx, y: t.y + dy });

/**
 * Two-finger gesture: the world point that was under the fingers' starting midpoint follows the
 * midpoint, and the zoom follows the finger spread (d / d0), relative to the transform at the start.
 */
export function pinchTransform(t0: ViewTransform, mid0: readonly [number, number], mid: readonly [number, number], d0: number, d: number): ViewTransform {
  const moved = panBy(t0, mid[0] - mid0[0], mid[1] - mid0[1]);
  return zoomAt(moved, d / Math.max(d0, 1), mid[0], mid[1]);
}
