import { colors, type } from '../../../components/theme';
import { contrast } from '../../support/colour';

/**
 * Text contrast of the theme's colour pairs against WCAG 2.1 AA (W3C, "Web Content Accessibility
 * Guidelines (WCAG) 2.1", 2018, SC 1.4.3 Contrast (Minimum): 4.5:1 for body text, 3:1 for large
 * text ≥ 18.66 px bold / 24 px; SC 1.4.11 Non-text Contrast: 3:1 for focus rings and control
 * borders that identify a control). Relative luminance and contrast ratio per WCAG 2.1's
 * definitions ("relative luminance", "contrast ratio"), in tests/support/colour.ts.
 */
test('the contrast formula matches WCAG reference values', () => {
  expect(contrast('#000000', '#FFFFFF')).toBeCloseTo(21, 5); // WCAG 2.1: maximum ratio 21:1
  expect(contrast('#FFFFFF', '#FFFFFF')).toBeCloseTo(1, 5);
  // #767676 on white is the well-known lightest grey passing 4.5:1 (4.54:1) [memory].
  expect(contrast('#767676', '#FFFFFF')).toBeGreaterThan(4.5);
  expect(contrast('#777777', '#FFFFFF')).toBeLessThan(4.5);
});

const BACKGROUNDS = ['paper', 'surface', 'surfaceSunk'] as const;

/** Text colours used for body-size text (13–17 px) on the page backgrounds (see components/ui). */
const BODY_TEXT = ['text', 'textMuted', 'ink', 'inkSoft', 'danger', 'success', 'signalDeep'] as const;

describe('body text on page backgrounds ≥ 4.5:1', () => {
  for (const fg of BODY_TEXT) for (const bg of BACKGROUNDS) {
    test(`${fg} on ${bg}`, () => expect(contrast(colors[fg], colors[bg])).toBeGreaterThanOrEqual(4.5));
  }
});

describe('text on coloured fills ≥ 4.5:1 (buttons, notices)', () => {
  const pairs: [keyof typeof colors, keyof typeof colors][] = [
    ['onInk', 'ink'], ['onInk', 'inkSoft'], ['onInk', 'danger'], // primary/pressed/danger buttons
    ['text', 'signalSoft'], // selected table rows
    ['text', 'dangerSoft'], ['danger', 'dangerSoft'], ['text', 'successSoft'], ['success', 'successSoft'], ['text', 'warnSoft'], ['signalDeep', 'warnSoft'], // notices
  ];
  for (const [fg, bg] of pairs) test(`${fg} on ${bg}`, () => expect(contrast(colors[fg], colors[bg])).toBeGreaterThanOrEqual(4.5));
});

describe('non-text: focus ring ≥ 3:1 against every background (SC 1.4.11)', () => {
  for (const bg of BACKGROUNDS) test(`focus on ${bg}`, () => expect(contrast(colors.focus, colors[bg])).toBeGreaterThanOrEqual(3));
});

test('the type scale uses AA colours on paper', () => {
  for (const [name, style] of Object.entries(type)) {
    const ratio = contrast(style.color, colors.paper);
    const large = style.fontSize >= 24 || (style.fontSize >= 18.66 && /Bold|SemiBold/.test(style.fontFamily));
    expect({ name, ok: ratio >= (large ? 3 : 4.5) }).toEqual({ name, ok: true });
  }
});
