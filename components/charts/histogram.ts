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

/** The drawing area: `left` leaves room for the count scale. */
export interface HistogramFrame {
  width: number;
  height: number;
  top?: number;
  bottom?: number;
  left?: number;
}

const countScale = (maxCount: number, frame: HistogramFrame) => scaleLinear().domain([0, maxCount]).range([frame.height - (frame.bottom ?? 24), frame.top ?? 8]);

/** The count scale's ticks (whole counts only) at their y, from the same scale as the bars. */
export function countTicks(bars: readonly HistogramBar[], frame: HistogramFrame): { count: number; y: number }[] {
  if (bars.length === 0) return [];
  const y = countScale(Math.max(...bars.map((b) => b.count)), frame);
  return y.ticks(4).filter((t) => Number.isInteger(t)).map((count) => ({ count, y: y(count) }));
}

export function histogramBars(
  samples: readonly HistogramSample[],
  frame: HistogramFrame,
  opts: { limit?: number; sense: 'max' | 'min' },
): HistogramBar[] {
  const left = frame.left ?? 0;
  const total = samples.reduce((s, x) => s + x.count, 0);
  const shown = [...samples].sort((a, b) => b.count - a.count || (opts.sense === 'max' ? b.value - a.value : a.value - b.value)).slice(0, opts.limit ?? 12);
  if (shown.length === 0 || total === 0) return [];
  // Unknown feasibility counts as feasible only where there is no balance rule to break (max-cut).
  const rank = (s: HistogramSample): Ranked => ({ value: s.value, feasible: s.feasible ?? opts.sense === 'max' });
  const bestSample = bestOf(opts.sense, samples.filter((s) => rank(s).feasible), rank);
  const isBest = (s: HistogramSample) => bestSample !== null && rank(s).feasible && !better(opts.sense, rank(bestSample), rank(s));
  const x = scaleBand<string>().domain(shown.map((s, i) => `${i}`)).range([left, frame.width]).padding(0.2);
  const y = countScale(Math.max(...shown.map((s) => s.count)), frame);
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
