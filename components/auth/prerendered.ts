import { useLayoutEffect } from 'react';

/**
 * The prerendered copy of a page (server/lib/prerender.ts writes it into the HTML at build): a
 * layer above the app that shows the form before any script has run. Once the app's own form is
 * on screen, the copy is removed in the same frame and what the visitor typed into it (and where
 * the cursor was) moves to the real fields. The id must match server/lib/prerender.ts's
 * PRERENDERED_ID (a client module cannot import server code; tests/unit/web/prerender.test.ts
 * checks both).
 */
export const PRERENDERED_ID = 'prerendered';

/** Remove the copy; answer the values typed into it by testID, and which field had focus. */
export function takeOverPrerendered(): { values: Record<string, string>; focused: string | null } | null {
  if (typeof document === 'undefined') return null;
  const layer = document.getElementById(PRERENDERED_ID);
  if (!layer) return null;
  const values: Record<string, string> = {};
  layer.querySelectorAll<HTMLInputElement>('input[data-testid]').forEach((input) => {
    if (input.value) values[input.dataset.testid!] = input.value;
  });
  const active = document.activeElement as HTMLElement | null;
  const focused = active && layer.contains(active) ? active.dataset?.testid ?? null : null;
  layer.remove();
  return { values, focused };
}

/**
 * For a form that may have been prerendered: before the first paint of the real form, remove the
 * copy and hand over its typed values (`fill(testID, value)`) and focus.
 */
export function usePrerenderedHandover(fill: (testID: string, value: string) => void): void {
  useLayoutEffect(() => {
    const taken = takeOverPrerendered();
    if (!taken) return;
    for (const [id, value] of Object.entries(taken.values)) fill(id, value);
    if (taken.focused) Array.from(document.querySelectorAll<HTMLElement>('[data-testid]')).find((e) => e.dataset.testid === taken.focused)?.focus();
    // Once, when the form first appears.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);
}
