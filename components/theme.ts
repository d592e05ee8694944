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
  focus: '#1F6FEB',
  danger: '#B3261E',
  dangerSoft: '#FBE9E7',
  success: '#1B7343', // ≥ 4.5:1 on surfaceSunk too (tests/unit/fuzz/contrast.test.ts)
  successSoft: '#E3F3E8',
  warnSoft: '#FFF4DC',
  onInk: '#F4F1EA',
} as const;

/** Region colours for drawn partitions (distinct under common colour-vision deficiencies). */
export const regionColors = ['#2D6A9F', '#D0782A', '#4E9A6B', '#8E5BA8', '#C9A227', '#3A8C8C', '#B0476B', '#6B6F2A'] as const;

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
/** Smallest touch target (WCAG 2.5.5 / common practice). */
export const TOUCH = 44;
