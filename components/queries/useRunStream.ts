import { useEffect, useRef, useState } from 'react';
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
  const open = useRunStreams(id && live ? [id] : []);
  return !!id && open.has(id);
}

/**
 * The same for several runs at once (compare): one stream per listed run, opened when a run joins
 * the list and closed when it leaves it (its run ended), so one run ending does not reopen the
 * others. Answers the runs whose stream is open now.
 */
export function useRunStreams(ids: readonly number[]): ReadonlySet<number> {
  const qc = useQueryClient();
  const [open, setOpen] = useState<ReadonlySet<number>>(() => new Set());
  const [failed, setFailed] = useState<ReadonlySet<number>>(() => new Set());
  const streams = useRef(new Map<number, () => void>());
  const wanted = [...new Set(ids)].filter((id) => !failed.has(id)).sort((a, b) => a - b);
  const key = wanted.join(',');
  useEffect(() => {
    const want = new Set(key ? key.split(',').map(Number) : []);
    const mark = (id: number, isOpen: boolean) =>
      setOpen((s) => {
        if (s.has(id) === isOpen) return s;
        const next = new Set(s);
        if (isOpen) next.add(id);
        else next.delete(id);
        return next;
      });
    const fail = (id: number) => setFailed((s) => new Set(s).add(id));
    for (const [id, close] of streams.current) if (!want.has(id)) {
      close();
      streams.current.delete(id);
    }
    for (const id of want) if (!streams.current.has(id)) {
      const close = follow(qc, id, { open: () => mark(id, true), closed: () => mark(id, false), fail: () => fail(id) });
      if (close) streams.current.set(id, close);
    }
  }, [qc, key]);
  // Leaving the screen closes every stream.
  useEffect(() => {
    const all = streams.current;
    return () => {
      for (const close of all.values()) close();
      all.clear();
    };
  }, []);
  return open.size && failed.size ? new Set([...open].filter((id) => !failed.has(id))) : open;
}

/** Open one run's stream and apply its events to the cache; null when there is no EventSource (fail() was called). */
function follow(qc: QueryClient, id: number, on: { open: () => void; closed: () => void; fail: () => void }): (() => void) | null {
  const source = openEventStream(`/runs/${id}/events`);
  if (!source) {
    on.fail();
    return null;
  }
  let closed = false;
  const close = () => {
    if (closed) return;
    closed = true;
    source.close();
    on.closed();
  };
  source.onopen = () => {
    if (!closed) on.open();
  };
  // EventSource would reconnect by itself; a stream that breaks hands over to polling instead.
  source.onerror = () => {
    if (closed) return;
    close();
    on.fail();
  };
  for (const name of EVENTS) source.addEventListener(name, (e) => {
    if (!closed && handle(qc, id, name, (e as MessageEvent<string>).data)) close();
  });
  return close;
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
