/**
 * How many regions a k-way question may ask for — the one rule the engine (bind.ts), the API
 * schema (shared/schemas/runs.ts), the CLI and the app's region choice all ask. 32 covers the
 * service-region counts planners use; the refinement keeps a gain per neighbouring region, so
 * the cost grows with k.
 */
export const MIN_REGIONS = 3;
export const MAX_REGIONS = 32;

/** Region counts the app offers as quick choices (every k in range works through the API and CLI). */
export const REGION_CHOICES: readonly number[] = [3, 4, 5, 6, 7, 8, 10, 12, 16, 20, 24, 32].filter((k) => k >= MIN_REGIONS && k <= MAX_REGIONS);

/** Whether `k` is a region count a k-way question may use. */
export const isRegionCount = (k: number): boolean => Number.isInteger(k) && k >= MIN_REGIONS && k <= MAX_REGIONS;
