/**
 * Colour arithmetic for the palette tests, from the published definitions:
 *  - sRGB transfer function: IEC 61966-2-1:1999 (as restated in WCAG 2.1's "relative luminance");
 *  - relative luminance and contrast ratio: W3C, WCAG 2.1 (2018), definitions section;
 *  - CIE 1976 L*a*b* with the D65 white (CIE 15:2004, "Colorimetry"); ΔE*ab = Euclidean distance;
 *  - colour-vision deficiency: Machado, Oliveira & Fernandes, "A physiologically-based model for
 *    simulation of color vision deficiency", IEEE TVCG 15(6), 2009 — severity 1.0 matrices on
 *    linear RGB [matrix entries from memory].
 */
export type Rgb = [number, number, number];

export function hexRgb(hex: string): Rgb {
  const m = /^#([0-9a-f]{6})$/i.exec(hex);
  if (!m) throw new Error(`not a #rrggbb colour: ${hex}`);
  return [0, 2, 4].map((i) => parseInt(m[1].slice(i, i + 2), 16)) as Rgb;
}

const toLinear = (c: number) => { const s = c / 255; return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4; };
const fromLinear = (c: number) => { const s = Math.min(1, Math.max(0, c)); return 255 * (s <= 0.0031308 ? 12.92 * s : 1.055 * s ** (1 / 2.4) - 0.055); };
const linear = (hex: string): Rgb => hexRgb(hex).map(toLinear) as Rgb;

export function luminance(hex: string): number {
  const [r, g, b] = linear(hex);
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

export function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi + 0.05) / (lo + 0.05);
}

/** CIE L*a*b* (D65) of an sRGB colour given as linear RGB. */
function labOfLinear([r, g, b]: Rgb): Rgb {
  const x = (0.4124 * r + 0.3576 * g + 0.1805 * b) / 0.95047;
  const y = 0.2126 * r + 0.7152 * g + 0.0722 * b;
  const z = (0.0193 * r + 0.1192 * g + 0.9505 * b) / 1.08883;
  const f = (t: number) => (t > (6 / 29) ** 3 ? Math.cbrt(t) : t / (3 * (6 / 29) ** 2) + 4 / 29);
  return [116 * f(y) - 16, 500 * (f(x) - f(y)), 200 * (f(y) - f(z))];
}

export const lab = (hex: string): Rgb => labOfLinear(linear(hex));

export function deltaE(a: string, b: string): number {
  const [p, q] = [lab(a), lab(b)];
  return Math.hypot(p[0] - q[0], p[1] - q[1], p[2] - q[2]);
}

const MACHADO: Record<'protan' | 'deutan', number[][]> = {
  protan: [[0.152286, 1.052583, -0.204868], [0.114503, 0.786281, 0.099216], [-0.003882, -0.048116, 1.051998]],
  deutan: [[0.367322, 0.860646, -0.227968], [0.280085, 0.672501, 0.047413], [-0.011820, 0.042940, 0.968881]],
};

/** The colour as seen with full protanopia or deuteranopia, as #rrggbb. */
export function simulate(hex: string, kind: 'protan' | 'deutan'): string {
  const v = linear(hex);
  const out = MACHADO[kind].map((row) => fromLinear(row[0] * v[0] + row[1] * v[1] + row[2] * v[2]));
  return `#${out.map((c) => Math.round(c).toString(16).padStart(2, '0')).join('')}`;
}
