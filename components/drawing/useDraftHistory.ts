import { useCallback, useMemo, useState } from 'react';
import { record, redo, startHistory, undo, type History } from './history';
import type { Draft } from './draft';

/**
 * The draft shared by the drawing and the tables, with undo/redo and an unsaved-changes flag
 * (the draft differs from the last one saved or loaded).
 */
export function useDraftHistory(initial: Draft) {
  const [state, setState] = useState<{ h: History<Draft>; saved: Draft }>(() => ({ h: startHistory(initial), saved: initial }));
  const commit = useCallback((next: Draft) => setState((s) => ({ ...s, h: record(s.h, next) })), []);
  const doUndo = useCallback(() => setState((s) => ({ ...s, h: undo(s.h) })), []);
  const doRedo = useCallback(() => setState((s) => ({ ...s, h: redo(s.h) })), []);
  /** Start over from a loaded or just-saved draft (clears undo history). */
  const reset = useCallback((d: Draft) => setState({ h: startHistory(d), saved: d }), []);
  /** The current draft was saved: keep history, clear the unsaved flag. */
  const markSaved = useCallback(() => setState((s) => ({ ...s, saved: s.h.present })), []);
  return useMemo(
    () => ({
      draft: state.h.present,
      commit,
      undo: doUndo,
      redo: doRedo,
      reset,
      markSaved,
      canUndo: state.h.past.length > 0,
      canRedo: state.h.future.length > 0,
      dirty: state.h.present !== state.saved,
    }),
    [state, commit, doUndo, doRedo, reset, markSaved],
  );
}
export type DraftHistory = ReturnType<typeof useDraftHistory>;
