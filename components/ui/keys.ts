/**
 * Keyboard behaviour of checkboxes and radio groups after the WAI-ARIA Authoring Practices Guide
 * (W3C, "ARIA Authoring Practices Guide", Checkbox and Radio Group patterns): react-native-web
 * presses only buttons with Space and gives radios no arrow keys, so these fill the gap.
 */
export interface KeyEvent {
  key?: string;
  nativeEvent?: { key?: string };
  preventDefault?: () => void;
}

const keyOf = (e: KeyEvent) => e.key ?? e.nativeEvent?.key ?? '';

/** Checkbox: Space toggles (and does not scroll the page). */
export function checkboxKeyDown(e: KeyEvent, toggle: () => void): void {
  const k = keyOf(e);
  if (k === ' ' || k === 'Spacebar') {
    e.preventDefault?.();
    toggle();
  }
}

/**
 * Radio `index` of `count`: Down/Right choose the next radio, Up/Left the previous (wrapping),
 * Space chooses the focused one; `choose(i)` selects radio i and moves the focus to it.
 */
export function radioKeyDown(e: KeyEvent, index: number, count: number, choose: (i: number) => void): void {
  const k = keyOf(e);
  const step = k === 'ArrowDown' || k === 'ArrowRight' ? 1 : k === 'ArrowUp' || k === 'ArrowLeft' ? -1 : 0;
  if (step !== 0) {
    e.preventDefault?.();
    choose((index + step + count) % count);
  } else if (k === ' ' || k === 'Spacebar') {
    e.preventDefault?.();
    choose(index);
  }
}
