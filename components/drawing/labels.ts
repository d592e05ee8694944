/**
 * Depot names placed on the drawing without collisions, in screen pixels. Greedy, in priority
 * order (the chosen depot first, then the depots with the most lane volume): each name tries
 * above, below, right and left of its depot, then the four diagonals; when none of those is free it tries a shortened
 * name, and when that does not fit either it is left out — the full name stays one tap away
 * (a chosen depot always shows it, over other marks if it must). Boxes are estimated from the character count, which suits
 * the drawing's one font and size. Pure, so it is tested without rendering.
 */
export interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

export interface PlacedLabel {
  /** Depot index. */
  index: number;
  text: string;
  /** Text anchor point and alignment, as SVG <text> takes them. */
  x: number;
  y: number;
  anchor: 'start' | 'middle' | 'end';
  /** False when the name was shortened. */
  full: boolean;
  box: Box;
}

export interface LabelOptions {
  width: number;
  height: number;
  fontSize: number;
  /** Depot mark radius in px (labels keep clear of every mark). */
  radius: number;
  /** Depot indices in the order they get a label (earlier wins). */
  order: readonly number[];
  /** Depots whose full name must show when it fits anywhere (the chosen ones). */
  always?: ReadonlySet<number>;
  /** Areas covered by controls. */
  reserved?: readonly Box[];
  /** Characters kept when a name is shortened (plus "…"). */
  shortLength?: number;
  /** Width of a text in px as drawn (default: the character-count estimate `textWidth`). */
  measure?: (text: string) => number;
}

const overlaps = (a: Box, b: Box) => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

/** Approximate advance of the drawing font (Inter Medium ≈ 0.58 em per character, from memory). */
export const textWidth = (text: string, fontSize: number) => text.length * fontSize * 0.58;

export const shorten = (text: string, keep: number) => (text.length <= keep + 1 ? text : `${text.slice(0, keep).trimEnd()}…`);

/**
 * `xy[2i], xy[2i+1]`: screen position of depot i (NaN or off-canvas depots get no label).
 * Returns the labels to draw; depots left out have none.
 */
export function placeLabels(xy: ArrayLike<number>, names: readonly string[], o: LabelOptions): PlacedLabel[] {
  const h = o.fontSize * 1.25;
  const gap = 3;
  const r = o.radius;
  const marks: Box[] = [];
  for (let i = 0; i < names.length; i++) {
    const x = xy[2 * i], y = xy[2 * i + 1];
    if (Number.isFinite(x) && Number.isFinite(y)) marks.push({ x: x - r, y: y - r, w: 2 * r, h: 2 * r });
  }
  const taken: Box[] = [...(o.reserved ?? [])];
  const inside = (b: Box) => b.x >= 0 && b.y >= 0 && b.x + b.w <= o.width && b.y + b.h <= o.height;
  const free = (b: Box, own: number) => inside(b) && !taken.some((t) => overlaps(t, b)) && !marks.some((m, k) => k !== own && overlaps(m, b));
  const candidates = (i: number, text: string) => {
    const x = xy[2 * i], y = xy[2 * i + 1];
    const w = o.measure ? o.measure(text) : textWidth(text, o.fontSize);
    // Text baseline sits ~0.8 of the box height below its top.
    return [
      { box: { x: x - w / 2, y: y - r - gap - h, w, h }, anchor: 'middle' as const, tx: x, ty: y - r - gap - h * 0.2 },
      { box: { x: x - w / 2, y: y + r + gap, w, h }, anchor: 'middle' as const, tx: x, ty: y + r + gap + h * 0.8 },
      { box: { x: x + r + gap, y: y - h / 2, w, h }, anchor: 'start' as const, tx: x + r + gap, ty: y + h * 0.3 },
      { box: { x: x - r - gap - w, y: y - h / 2, w, h }, anchor: 'end' as const, tx: x - r - gap, ty: y + h * 0.3 },
      // Diagonals, for depots near an edge or a neighbour.
      { box: { x: x + r * 0.7, y: y + r + gap, w, h }, anchor: 'start' as const, tx: x + r * 0.7, ty: y + r + gap + h * 0.8 },
      { box: { x: x + r * 0.7, y: y - r - gap - h, w, h }, anchor: 'start' as const, tx: x + r * 0.7, ty: y - r - gap - h * 0.2 },
      { box: { x: x - r * 0.7 - w, y: y + r + gap, w, h }, anchor: 'end' as const, tx: x - r * 0.7, ty: y + r + gap + h * 0.8 },
      { box: { x: x - r * 0.7 - w, y: y - r - gap - h, w, h }, anchor: 'end' as const, tx: x - r * 0.7, ty: y - r - gap - h * 0.2 },
    ];
  };
  // Marks are indexed by depot only when every depot has a position; otherwise compare boxes.
  const markIndex = marks.length === names.length;
  const out: PlacedLabel[] = [];
  const seen = new Set<number>();
  const ordered = [...(o.always ?? []), ...o.order];
  for (const i of ordered) {
    if (seen.has(i) || i < 0 || i >= names.length) continue;
    seen.add(i);
    const x = xy[2 * i], y = xy[2 * i + 1];
    if (!Number.isFinite(x) || !Number.isFinite(y) || x < 0 || y < 0 || x > o.width || y > o.height) continue;
    const name = names[i];
    const short = shorten(name, o.shortLength ?? 10);
    const tries = o.always?.has(i) || short === name ? [name] : [name, short];
    let placed: PlacedLabel | null = null;
    for (const text of tries) {
      for (const c of candidates(i, text)) {
        if (free(c.box, markIndex ? i : -1)) {
          placed = { index: i, text, x: c.tx, y: c.ty, anchor: c.anchor, full: text === name, box: c.box };
          break;
        }
      }
      if (placed) break;
    }
    if (!placed && o.always?.has(i)) {
      // A chosen (tapped or hovered) depot shows its full name even in a crowd: on its plate it
      // may cover other marks, but it stays inside the canvas and clear of controls and names.
      const clear = (b: Box) => inside(b) && !taken.some((t) => overlaps(t, b));
      const c = candidates(i, name).find((k) => clear(k.box)) ?? candidates(i, name).find((k) => inside(k.box));
      if (c) placed = { index: i, text: name, x: c.tx, y: c.ty, anchor: c.anchor, full: true, box: c.box };
    }
    if (placed) {
      taken.push(placed.box);
      out.push(placed);
    }
  }
  return out;
}
