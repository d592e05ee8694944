import type { Positions } from './layout';

/** Index of the depot nearest (wx, wy) within `radius` world units, or −1. */
export function depotAt(xy: Positions, wx: number, wy: number, radius: number): number {
  let best = -1, bestD = radius * radius;
  for (let i = 0, n = xy.length / 2; i < n; i++) {
    const dx = xy[2 * i] - wx, dy = xy[2 * i + 1] - wy;
    const d = dx * dx + dy * dy;
    if (d <= bestD) {
      bestD = d;
      best = i;
    }
  }
  return best;
}

/** Squared distance from point p to segment a–b. */
export function segmentDistance2(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const vx = bx - ax, vy = by - ay;
  const len2 = vx * vx + vy * vy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((px - ax) * vx + (py - ay) * vy) / len2));
  const dx = ax + t * vx - px, dy = ay + t * vy - py;
  return dx * dx + dy * dy;
}

/** Index of the lane (ends[2e], ends[2e+1] are depot indices) nearest the point within `tolerance`, or −1. */
export function laneAt(xy: Positions, ends: Int32Array, wx: number, wy: number, tolerance: number): number {
  let best = -1, bestD = tolerance * tolerance;
  for (let e = 0, m = ends.length / 2; e < m; e++) {
    const a = ends[2 * e], b = ends[2 * e + 1];
    if (a < 0 || b < 0) continue;
    const d = segmentDistance2(wx, wy, xy[2 * a], xy[2 * a + 1], xy[2 * b], xy[2 * b + 1]);
    if (d <= bestD) {
      bestD = d;
      best = e;
    }
  }
  return best;
}
