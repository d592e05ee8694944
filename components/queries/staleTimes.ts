/** Stale times for every query, in one table (ms). */
export const STALE = {
  me: 60_000,
  list: 15_000,
  detail: 15_000,
  live: 0,
  static: 5 * 60_000,
} as const;
