import type { Store } from 'express-session';

/**
 * express-session touches the store on every request of an unmodified session; with the MariaDB
 * store that is one UPDATE per API call. Touch each session at most once per `minIntervalMs`
 * (its 14-day expiry then trails the cookie's by at most that much). Remembers at most
 * `maxTracked` session ids per process, forgetting all when full (a few extra touches, no harm).
 */
export function throttleTouch(store: Store, minIntervalMs = 60_000, maxTracked = 50_000): void {
  const touch = store.touch?.bind(store);
  if (!touch) return;
  const last = new Map<string, number>();
  store.touch = (sid, session, callback) => {
    const now = Date.now();
    const before = last.get(sid);
    if (before !== undefined && now - before < minIntervalMs) return callback?.();
    if (last.size >= maxTracked) last.clear();
    last.set(sid, now);
    touch(sid, session, callback);
  };
}
