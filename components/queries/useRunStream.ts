import { useEffect, useState } from 'react';
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { openEventStream } from '../api/client';
import type { RunDetail } from '../runs/types';
import { applyRunEvent, parseRunEvent } from './run-events';
import { runKeys } from './runKeys';

const EVENTS = ['snapshot', 'progress', 'status', 'end'] as const;

/**
 * Keeps one run's cache fresh from the server's progress stream while `live`. Answers whether
 * the stream is open: the caller polls only when it is not (no EventSource, not open yet, or
 * failed). The stream closes when the run ends, `live` turns false or the screen goes away;
 * after a failure this screen stays on polling rather than reconnecting again and again.
 */
export function useRunStream(id: number | null | undefined, live: boolean): boolean {
  const qc = useQueryClient();
  const [open, setOpen] = useState(false);
  const [failed, setFailed] = useState(false);
  useEffect(() => {
    if (!id || !live || failed) return;
    const source = openEventStream(`/runs/${id}/events`);
    if (!source) {
      setFailed(true);
      return;
    }
    let closed = false;
    const close = () => {
      closed = true;
      source.close();
      setOpen(false);
    };
    source.onopen = () => setOpen(true);
    // EventSource would reconnect by itself; a stream that breaks hands over to polling instead.
    source.onerror = () => {
      if (closed) return;
      close();
      setFailed(true);
    };
    for (const name of EVENTS) source.addEventListener(name, (e) => {
      if (!closed && handle(qc, id, name, (e as MessageEvent<string>).data)) close();
    });
    return close;
  }, [qc, id, live, failed]);
  return open && !failed;
}

/** Apply one event to the cache; true when the run has ended. */
function handle(qc: QueryClient, id: number, name: string, data: string): boolean {
  const event = parseRunEvent(name, data);
  if (!event) return false;
  const outcome = applyRunEvent(qc.getQueryData<RunDetail>(runKeys.detail(id)), event);
  if (outcome.run) qc.setQueryData(runKeys.detail(id), outcome.run);
  if (outcome.refetch) void qc.invalidateQueries({ queryKey: runKeys.detail(id), exact: true });
  if (outcome.done) void qc.invalidateQueries({ queryKey: runKeys.lists() });
  return outcome.done;
}
