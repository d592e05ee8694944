/**
 * Geometry of the sampled-assignments histogram: the most frequent assignments as bars (count
 * on the y axis), each labelled with its business value. Pure, like convergence.ts.
 */
import { scaleBand, scaleLinear } from 'd3-scale';
import { better, bestOf, type Ranked } from '../../shared/engine/problem/compare';

export interface HistogramSample {
  assignment: readonly number[];
  count: number;
  value: number;
  /** Pins kept and balance met (results stored before samples carried it: unknown). */
  feasible?: boolean;
}

export interface HistogramBar {
  key: string;
  x: number;
  y: number;
  width: number;
  height: number;
  count: number;
  value: number;
  /** Share of all shots that gave this assignment. */
  share: number;
  /** True for the best sample by problem/compare.ts (feasible first, then value) and its equals. */
  best: boolean;
  feasible: boolean;
}

/** The assignment written as a bit/region string, depot 0 first ("0110…"). */
export const assignmentKey = (a: readonly number[]) => a.join('');

export function histogramBars(
  samples: readonly HistogramSample[],
  frame: { width: number; height: number; top?: number; bottom?: number },
  opts: { limit?: number; sense: 'max' | 'min' },
): HistogramBar[] {
  const top = frame.top ?? 8;
  const bottom = frame.bottom ?? 24;
  const total = samples.reduce((s, x) => s + x.count, 0);
  const shown = [...samples].sort((a, b) => b.count - a.count || (opts.sense === 'max' ? b.value - a.value : a.value - b.value)).slice(0, opts.limit ?? 12);
  if (shown.length === 0 || total === 0) return [];
  // Unknown feasibility counts as feasible only where there is no balance rule to break (max-cut).
  const rank = (s: HistogramSample): Ranked => ({ value: s.value, feasible: s.feasible ?? opts.sense === 'max' });
  const bestSample = bestOf(opts.sense, samples.filter((s) => rank(s).feasible), rank);
  const isBest = (s: HistogramSample) => bestSample !== null && rank(s).feasible && !better(opts.sense, rank(bestSample), rank(s));
  const x = scaleBand<string>().domain(shown.map((s, i) => `${i}`)).range([0, frame.width]).padding(0.2);
  const y = scaleLinear().domain([0, Math.max(...shown.map((s) => s.count))]).range([frame.height - bottom, top]);
  return shown.map((s, i) => ({
    key: assignmentKey(s.assignment),
    x: x(`${i}`) ?? 0,
    y: y(s.count),
    width: x.bandwidth(),
    height: y(0) - y(s.count),
    count: s.count,
    value: s.value,
    share: s.count / total,
    best: isBest(s),
    feasible: rank(s).feasible,
  }));
}
