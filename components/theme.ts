/** Spinyard's own light palette and type scale ("yard at dawn": ink teal, amber signal, paper). */
export const colors = {
  paper: '#F4F1EA',
  surface: '#FFFFFF',
  surfaceSunk: '#ECE7DC',
  ink: '#12343B',
  inkSoft: '#3E5C63',
  text: '#1C2529',
  textMuted: '#5A6468',
  line: '#D6CFC0',
  signal: '#E8A33D',
  signalDeep: '#935700', // ≥ 4.5:1 on surfaceSunk too
  /** Selected rows (a pale signal). */
  signalSoft: '#F6DDB2',
  focus: '#2E67B8', // harbour blue; ≥ 3:1 on every background (SC 1.4.11)
  danger: '#A93A2C', // brick red
  dangerSoft: '#F3E0D6',
  success: '#1B7343', // ≥ 4.5:1 on surfaceSunk too (tests/unit/fuzz/contrast.test.ts)
  successSoft: '#E3F3E8',
  warnSoft: '#FFF4DC',
  onInk: '#F4F1EA',
} as const;

/**
 * Region colours for drawn partitions, our own set: harbour, amber, dusk violet, salmon, olive,
 * aqua, rust brown, sky. Light and dark alternate so that every pair stays apart under protan
 * and deutan vision too, and the first two (the two sides of a cut) are the furthest apart
 * (tests/unit/fuzz/palette.test.ts measures both).
 */
export const regionColors = ['#1E5F74', '#E2A03F', '#564C9F', '#EAAC97', '#756B1D', '#4CC0CF', '#7F4E42', '#5F9EE6'] as const;

export const space = { xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32 } as const;
export const radius = { sm: 6, md: 10, lg: 16, pill: 999 } as const;

export const fonts = {
  regular: 'Inter_400Regular',
  medium: 'Inter_500Medium',
  semibold: 'Inter_600SemiBold',
  bold: 'Inter_700Bold',
} as const;

export const type = {
  title: { fontFamily: fonts.bold, fontSize: 22, lineHeight: 28, color: colors.text },
  heading: { fontFamily: fonts.semibold, fontSize: 17, lineHeight: 24, color: colors.text },
  body: { fontFamily: fonts.regular, fontSize: 15, lineHeight: 22, color: colors.text },
  small: { fontFamily: fonts.regular, fontSize: 13, lineHeight: 18, color: colors.textMuted },
  label: { fontFamily: fonts.medium, fontSize: 13, lineHeight: 18, color: colors.inkSoft },
  mono: { fontFamily: 'monospace', fontSize: 13, lineHeight: 18, color: colors.text },
} as const;

/** Wide layout (side rail, tables) from this window width up. */
export const WIDE_BREAKPOINT = 1024;
/**
 * The keyboard focus mark of every pressable control: an outline, which takes no room, so taking
 * focus never moves anything (a thicker border once re-wrapped a row of tabs between a tap's
 * press and release, and the tap was lost).
 */
export const focusRing = { outlineColor: colors.focus, outlineWidth: 2, outlineStyle: 'solid', outlineOffset: 1 } as const;

/** Smallest touch target (WCAG 2.5.5 / common practice). */
export const TOUCH = 44;
