import type { Permission } from '../../shared/permissions';

export type GlyphName = 'network' | 'runs' | 'team' | 'billing' | 'account';

/** The shell's five destinations, in order. `needs` hides a destination from roles that lack it. */
export const destinations: Array<{ href: '/networks' | '/runs' | '/team' | '/billing' | '/account'; label: string; glyph: GlyphName; needs?: Permission }> = [
  { href: '/networks', label: 'Networks', glyph: 'network' },
  { href: '/runs', label: 'Runs', glyph: 'runs' },
  { href: '/team', label: 'Team', glyph: 'team' },
  { href: '/billing', label: 'Billing', glyph: 'billing', needs: 'billing:read' },
  { href: '/account', label: 'Account', glyph: 'account' },
];
