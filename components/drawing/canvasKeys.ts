/**
 * The drawing canvas's keys (web), in one table: the handler and every sentence that names the
 * keys read it, so the words cannot drift from what the keys do.
 */
export type CanvasKeyAction = { kind: 'pan'; dx: number; dy: number } | { kind: 'zoom'; factor: number } | { kind: 'add' };

/** Pixels one arrow key press moves the view. */
export const KEY_PAN_PX = 40;
const ZOOM_IN = 1.25;
const ZOOM_OUT = 0.8;

const PAN: Record<string, [number, number]> = { ArrowLeft: [KEY_PAN_PX, 0], ArrowRight: [-KEY_PAN_PX, 0], ArrowUp: [0, KEY_PAN_PX], ArrowDown: [0, -KEY_PAN_PX] };

/** What a key does on the canvas, or null when the canvas leaves it alone (Tab, letters, …). */
export function canvasKeyAction(key: string, readOnly: boolean): CanvasKeyAction | null {
  if (PAN[key]) return { kind: 'pan', dx: PAN[key][0], dy: PAN[key][1] };
  if (key === '+' || key === '=') return { kind: 'zoom', factor: ZOOM_IN };
  if (key === '-' || key === '−') return { kind: 'zoom', factor: ZOOM_OUT };
  // Enter or Space: the keyboard's tap on empty space (a depot at the centre of the view).
  if ((key === 'Enter' || key === ' ') && !readOnly) return { kind: 'add' };
  return null;
}

/** The keys in words, for the visible hint and the canvas's accessible name. */
export function canvasKeysSentence(readOnly: boolean): string {
  const view = 'arrow keys pan, + and − zoom';
  return readOnly ? view : `Enter or Space adds a depot at the centre; ${view}`;
}
