/**
 * The drawing canvas's keys: what each does, and that the sentence shown to people names every
 * key the canvas acts on (a hint that left out Enter once hid the keyboard way to add a depot).
 */
import { canvasKeyAction, canvasKeysSentence, KEY_PAN_PX } from '../../../components/drawing/canvasKeys';

describe('canvas keys', () => {
  test('arrow keys pan the view by one step, + and = zoom in, - and − zoom out', () => {
    expect(canvasKeyAction('ArrowLeft', false)).toEqual({ kind: 'pan', dx: KEY_PAN_PX, dy: 0 });
    expect(canvasKeyAction('ArrowDown', true)).toEqual({ kind: 'pan', dx: 0, dy: -KEY_PAN_PX });
    for (const k of ['+', '=']) expect(canvasKeyAction(k, true)).toEqual({ kind: 'zoom', factor: 1.25 });
    for (const k of ['-', '−']) expect(canvasKeyAction(k, false)).toEqual({ kind: 'zoom', factor: 0.8 });
  });

  test('Enter and Space add a depot, but not on a read-only drawing; other keys are left alone', () => {
    expect(canvasKeyAction('Enter', false)).toEqual({ kind: 'add' });
    expect(canvasKeyAction(' ', false)).toEqual({ kind: 'add' });
    expect(canvasKeyAction('Enter', true)).toBeNull();
    for (const k of ['Tab', 'a', 'Escape', 'Delete']) expect(canvasKeyAction(k, false)).toBeNull();
  });

  test('the sentence names each key that acts, and no key that does not', () => {
    const editable = canvasKeysSentence(false);
    for (const word of ['Enter', 'Space', 'arrow keys', '+', '−']) expect(editable).toContain(word);
    const readOnly = canvasKeysSentence(true);
    expect(readOnly).not.toMatch(/Enter|Space/);
    for (const word of ['arrow keys', '+', '−']) expect(readOnly).toContain(word);
  });
});
