import type { Deps } from './deps';
import type { AppExtras } from './app';

/** Hooks the feature modules plug into (authentication, demo seed). */
export function serverExtras(_deps: Deps): AppExtras {
  return {};
}

export async function afterStart(_deps: Deps, _opts: { seedDemo: boolean }): Promise<void> {}
