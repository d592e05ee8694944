import fs from 'node:fs';
import path from 'node:path';
import { FAMILY_WEIGHTS, fontFaceCss, SUBSET_RANGES } from '../../../components/fonts/faces';
import { fonts } from '../../../components/theme';

describe('web fonts', () => {
  test('subset ranges are the ones the installed @fontsource/inter publishes (its unicode.json)', () => {
    const published = JSON.parse(fs.readFileSync(path.join(require.resolve('@fontsource/inter/package.json'), '..', 'unicode.json'), 'utf8')) as Record<string, string>;
    for (const [subset, range] of Object.entries(SUBSET_RANGES)) expect(range).toBe(published[subset]);
  });

  test('every family the theme names gets a WOFF2 face per subset, swapping in, over every weight', () => {
    expect(Object.keys(FAMILY_WEIGHTS).sort()).toEqual(Object.values(fonts).sort());
    const urls: string[] = [];
    const css = fontFaceCss((weight, subset) => {
      const url = `/assets/inter-${subset}-${weight}-normal.woff2`;
      urls.push(url);
      return url;
    });
    const rules = css.split('\n');
    expect(rules).toHaveLength(Object.keys(FAMILY_WEIGHTS).length * Object.keys(SUBSET_RANGES).length);
    for (const rule of rules) {
      expect(rule).toMatch(/^@font-face\{font-family:"Inter_\d00\w+";font-style:normal;font-weight:100 900;font-display:swap;src:url\("[^"]+\.woff2"\) format\("woff2"\);unicode-range:U\+[0-9A-F,+-U]+\}$/);
    }
    expect(css).toContain('font-family:"Inter_700Bold"');
    expect(rules.find((r) => r.includes('"Inter_600SemiBold"') && r.includes('latin-ext'))).toContain(SUBSET_RANGES['latin-ext']);
    expect(new Set(urls).size).toBe(8);
    // The files the app requires exist in the installed package.
    for (const weight of [400, 500, 600, 700]) {
      for (const subset of ['latin', 'latin-ext']) expect(fs.existsSync(require.resolve(`@fontsource/inter/files/inter-${subset}-${weight}-normal.woff2`))).toBe(true);
    }
  });
});
