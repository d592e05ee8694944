/**
 * Geometry of the energy convergence chart, as a pure function of the trace: scales from
 * d3-scale, the energy line and the ± standard-error band from d3-shape. The component only
 * draws these strings, so tests can check the geometry without rendering.
 */
import { scaleLinear, type ScaleLinear } from 'd3-scale';
import { area, line } from 'd3-shape';

/** One point of a solver's trace (the service's TracePoint). */
export interface ConvergencePoint {
  iteration: number;
  energy: number;
  /** Standard error of the energy estimate (shot-based runs); absent for exact expectations. */
  stdError?: number;
  /** Which optimizer start (restart) the point belongs to, 0 for the first; absent when unknown. */
  start?: number;
}

/** Where the optimizer began a new start: the first point of each start after the first. */
export interface RestartMark {
  iteration: number;
  /** 1-based number of the start, as the chart's label says it ("start 2"). */
  start: number;
  x: number;
}

export interface ChartFrame {
  width: number;
  height: number;
  /** Room for the axis labels: left, right, top, bottom (px). */
  margin?: { left: number; right: number; top: number; bottom: number };
}

export interface ConvergenceGeometry {
  x: ScaleLinear<number, number>;
  y: ScaleLinear<number, number>;
  /** SVG path of the energy line, or null without points. */
  line: string | null;
  /** SVG path of energy ± standard error, or null when no point carries one. */
  band: string | null;
  /** The first point of every later start (a new start may jump upward); none when unknown. */
  restarts: RestartMark[];
  /** Whole iterations only (a tick at iteration 1.5 names nothing). */
  xTicks: number[];
  yTicks: number[];
  /** Text of each y tick, apart from its neighbours (`tickLabels`). */
  yTickLabels: string[];
  margin: { left: number; right: number; top: number; bottom: number };
}

/** A number for a chart: "1.8k" from a thousand up, else at most two decimals. */
export const shortNumber = (v: number) => (Math.abs(v) >= 1000 ? `${Math.round(v / 100) / 10}k` : `${Math.round(v * 100) / 100}`);

/**
 * Axis labels that tell the ticks apart: the short form when every tick reads differently,
 * else the full number with as many decimals as the tick step needs (a near-flat trace
 * of about −1,760 once labelled all four ticks "-1.8k").
 */
export function tickLabels(ticks: readonly number[]): string[] {
  const short = ticks.map(shortNumber);
  if (new Set(short).size === short.length) return short;
  const step = ticks.length > 1 ? Math.abs(ticks[1] - ticks[0]) : 1;
  const decimals = Math.max(0, Math.min(6, -Math.floor(Math.log10(step) + 1e-9)));
  return ticks.map((t) => t.toLocaleString('en-GB', { minimumFractionDigits: decimals, maximumFractionDigits: decimals }));
}

export const DEFAULT_MARGIN = { left: 52, right: 12, top: 10, bottom: 28 } as const;

const finitePoints = (trace: readonly ConvergencePoint[]) => trace.filter((p) => Number.isFinite(p.iteration) && Number.isFinite(p.energy));

export function convergenceGeometry(trace: readonly ConvergencePoint[], frame: ChartFrame): ConvergenceGeometry {
  const margin = frame.margin ?? DEFAULT_MARGIN;
  const points = finitePoints(trace);
  const se = (p: ConvergencePoint) => (p.stdError !== undefined && Number.isFinite(p.stdError) ? Math.abs(p.stdError) : 0);
  let x0 = Infinity, x1 = -Infinity, y0 = Infinity, y1 = -Infinity;
  for (const p of points) {
    x0 = Math.min(x0, p.iteration);
    x1 = Math.max(x1, p.iteration);
    y0 = Math.min(y0, p.energy - se(p));
    y1 = Math.max(y1, p.energy + se(p));
  }
  if (points.length === 0) { x0 = 0; x1 = 1; y0 = 0; y1 = 1; }
  // A single point or a flat trace still needs a non-empty domain to draw.
  if (x0 === x1) x1 = x0 + 1;
  if (y0 === y1) { y0 -= 1; y1 += 1; }
  const x = scaleLinear().domain([x0, x1]).range([margin.left, frame.width - margin.right]);
  const y = scaleLinear().domain([y0, y1]).range([frame.height - margin.bottom, margin.top]);
  const linePath = points.length ? line<ConvergencePoint>().x((p) => x(p.iteration)).y((p) => y(p.energy))(points) : null;
  const withError = points.some((p) => p.stdError !== undefined && Number.isFinite(p.stdError));
  const bandPath = withError
    ? area<ConvergencePoint>()
        .x((p) => x(p.iteration))
        .y0((p) => y(p.energy - se(p)))
        .y1((p) => y(p.energy + se(p)))(points)
    : null;
  const restarts: RestartMark[] = [];
  for (let i = 1; i < points.length; i++) {
    const s = points[i].start, before = points[i - 1].start;
    // A later start than the point before (k-way splits begin again at start 0: not a restart).
    if (s !== undefined && before !== undefined && s > before) restarts.push({ iteration: points[i].iteration, start: s + 1, x: x(points[i].iteration) });
  }
  const yTicks = y.ticks(4);
  return { x, y, line: linePath, band: bandPath, restarts, xTicks: x.ticks(4).filter(Number.isInteger), yTicks, yTickLabels: tickLabels(yTicks), margin };
}
