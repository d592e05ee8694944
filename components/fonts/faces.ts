import { fonts } from '../theme';

/**
 * The app's four Inter faces as CSS @font-face rules (web). Each family name in theme.ts maps to
 * one weight of Inter, served as WOFF2 subsets from @fontsource/inter (SIL Open Font License
 * 1.1, its LICENSE file ships in the package): the Latin subset for ordinary text and the
 * Latin Extended subset, which the browser fetches only when a page shows such a letter
 * (unicode-range). Each face claims every weight (100 900), so a style that also sets
 * fontWeight gets the file, not a synthesised bold. `font-display: swap` shows text at once in
 * a system font and swaps Inter in, so fonts never hold the first screen back.
 */

/** Subset ranges as @fontsource/inter 5.3 publishes them (its unicode.json; a unit test compares). */
export const SUBSET_RANGES = {
  latin: 'U+0000-00FF,U+0131,U+0152-0153,U+02BB-02BC,U+02C6,U+02DA,U+02DC,U+0304,U+0308,U+0329,U+2000-206F,U+20AC,U+2122,U+2191,U+2193,U+2212,U+2215,U+FEFF,U+FFFD',
  'latin-ext': 'U+0100-02BA,U+02BD-02C5,U+02C7-02CC,U+02CE-02D7,U+02DD-02FF,U+0304,U+0308,U+0329,U+1D00-1DBF,U+1E00-1E9F,U+1EF2-1EFF,U+2020,U+20A0-20AB,U+20AD-20C0,U+2113,U+2C60-2C7F,U+A720-A7FF',
} as const;
export type Subset = keyof typeof SUBSET_RANGES;

/** theme.ts family name → Inter weight. */
export const FAMILY_WEIGHTS: Record<(typeof fonts)[keyof typeof fonts], number> = {
  [fonts.regular]: 400,
  [fonts.medium]: 500,
  [fonts.semibold]: 600,
  [fonts.bold]: 700,
};

/** URL of one subset file of one weight (resolved by the caller: bundler assets on web). */
export type FaceUrl = (weight: number, subset: Subset) => string;

/** The @font-face rules for every family and subset, as one stylesheet text. */
export function fontFaceCss(urlOf: FaceUrl): string {
  const rules: string[] = [];
  for (const [family, weight] of Object.entries(FAMILY_WEIGHTS)) {
    for (const subset of Object.keys(SUBSET_RANGES) as Subset[]) {
      rules.push(`@font-face{font-family:${JSON.stringify(family)};font-style:normal;font-weight:100 900;font-display:swap;src:url(${JSON.stringify(urlOf(weight, subset))}) format("woff2");unicode-range:${SUBSET_RANGES[subset]}}`);
    }
  }
  return rules.join('\n');
}
