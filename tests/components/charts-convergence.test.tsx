import { render, screen } from '@testing-library/react';
import { ConvergenceChart } from '../../components/charts/ConvergenceChart';
import { convergenceGeometry, DEFAULT_MARGIN } from '../../components/charts/convergence';
import { histogramBars } from '../../components/charts/histogram';

/** The numbers of an SVG path, as [x, y] pairs (M/L commands only, which d3's linear curve emits). */
function pathPoints(d: string): Array<[number, number]> {
  const nums = (d.match(/-?\d+(?:\.\d+)?(?:e-?\d+)?/g) ?? []).map(Number);
  const pts: Array<[number, number]> = [];
  for (let i = 0; i + 1 < nums.length; i += 2) pts.push([nums[i], nums[i + 1]]);
  return pts;
}

// A shot-based trace: energy falls toward −4 (K4's max cut is 4, so the ground energy of
// H = Σ s_u s_v… reads −cut here), with standard errors shrinking as shots add up.
const trace = [
  { iteration: 0, energy: -3.0, stdError: 0.30 },
  { iteration: 5, energy: -3.4, stdError: 0.20 },
  { iteration: 10, energy: -3.8, stdError: 0.10 },
  { iteration: 20, energy: -3.9, stdError: 0.05 },
];
const frame = { width: 320, height: 180 };

describe('convergenceGeometry', () => {
  // Pixel positions worked by hand (not with a scale library): the plot spans
  // x 52…308 (320 − 52 − 12 = 256 px for iterations 0…20, 12.8 px each) and y 152…10 (142 px for
  // energies −3.95…−2.7, i.e. energy ± standard error over the trace; 113.6 px per unit, SVG y
  // grows downwards).
  const X = { 0: 52, 5: 116, 10: 180, 20: 308 } as Record<number, number>;
  test('the line goes through every trace point at its hand-worked pixel position', () => {
    const g = convergenceGeometry(trace, frame);
    expect(DEFAULT_MARGIN).toEqual({ left: 52, right: 12, top: 10, bottom: 28 }); // the margins the numbers assume
    const pts = pathPoints(g.line as string);
    const expected: Array<[number, number]> = [[X[0], 44.08], [X[5], 89.52], [X[10], 134.96], [X[20], 146.32]];
    expect(pts).toHaveLength(expected.length);
    expected.forEach(([x, y], i) => {
      expect(pts[i][0]).toBeCloseTo(x, 6);
      expect(pts[i][1]).toBeCloseTo(y, 6);
    });
  });

  test('the band is energy + standard error forward, then energy − standard error backward', () => {
    const g = convergenceGeometry(trace, frame);
    const pts = pathPoints(g.band as string);
    // d3.area draws the y1 (upper) edge left to right, then the y0 edge right to left.
    const upper: Array<[number, number]> = [[X[0], 10], [X[5], 66.8], [X[10], 123.6], [X[20], 140.64]]; // −2.7, −3.2, −3.7, −3.85
    const lower: Array<[number, number]> = [[X[20], 152], [X[10], 146.32], [X[5], 112.24], [X[0], 78.16]]; // −3.95, −3.9, −3.6, −3.3
    const expected = [...upper, ...lower];
    expect(pts).toHaveLength(expected.length);
    expected.forEach(([x, y], i) => {
      expect(pts[i][0]).toBeCloseTo(x, 6);
      expect(pts[i][1]).toBeCloseTo(y, 6);
    });
  });

  test('exact expectations (no standard error) give no band; a flat single point still has a domain', () => {
    const g = convergenceGeometry([{ iteration: 3, energy: -2 }], frame);
    expect(g.band).toBeNull();
    expect(g.x.domain()).toEqual([3, 4]);
    expect(g.y.domain()).toEqual([-3, -1]);
    expect(pathPoints(g.line as string)).toHaveLength(1);
    expect(convergenceGeometry([], frame).line).toBeNull();
  });
});

describe('<ConvergenceChart>', () => {
  test('a near-flat trace around −1,760 gets y tick labels that differ, and whole-iteration x ticks', () => {
    // Seen on a live QAOA run: four y ticks all read "-1.8k" and the x axis read 1, 1.5, 2, 2.5, 3.
    const flat = [1, 2, 3].map((iteration, i) => ({ iteration, energy: -1760.03 - i * 0.004 }));
    render(<ConvergenceChart trace={flat} width={frame.width} height={frame.height} />);
    const texts = Array.from(screen.getByTestId('convergence-chart').querySelectorAll('text')).map((t) => t.textContent ?? '');
    const g = convergenceGeometry(flat, frame);
    const yLabels = texts.slice(0, g.yTicks.length);
    expect(yLabels.length).toBeGreaterThanOrEqual(3);
    expect(new Set(yLabels).size).toBe(yLabels.length);
    expect(g.xTicks.every(Number.isInteger)).toBe(true);
    expect(texts.slice(g.yTicks.length)).toEqual(['1', '2', '3']);
  });

  test('draws the line and band paths it computed', () => {
    render(<ConvergenceChart trace={trace} width={frame.width} height={frame.height} />);
    const g = convergenceGeometry(trace, frame);
    const chart = screen.getByTestId('convergence-chart');
    const ds = Array.from(chart.querySelectorAll('path')).map((p) => p.getAttribute('d'));
    expect(ds).toContain(g.line);
    expect(ds).toContain(g.band);
    expect(screen.getByLabelText(/from -3 to -3.9 over 4 points, with a standard-error band/)).toBeTruthy();
  });
});

describe('histogramBars', () => {
  test('bars are sorted by count, heights proportional to counts, shares sum to the shown part', () => {
    // Samples of a 4-depot max-cut (K4): 0011 and 0101 cut 4 lanes (optimal), 0001 cuts 3.
    const samples = [
      { assignment: [0, 0, 0, 1], count: 100, value: 3 },
      { assignment: [0, 0, 1, 1], count: 300, value: 4 },
      { assignment: [0, 1, 0, 1], count: 200, value: 4 },
    ];
    const bars = histogramBars(samples, { width: 300, height: 120, top: 0, bottom: 20 }, { sense: 'max' });
    expect(bars.map((b) => b.key)).toEqual(['0011', '0101', '0001']);
    expect(bars[0].height).toBeCloseTo(100, 9);
    expect(bars[1].height / bars[0].height).toBeCloseTo(2 / 3, 9);
    expect(bars.map((b) => b.best)).toEqual([true, true, false]);
    expect(bars.reduce((s, b) => s + b.share, 0)).toBeCloseTo(1, 12);
  });
});

describe('restart marks', () => {
  test('the first point of each later start, at its iteration; a return to start 0 (a new k-way split) is no restart', () => {
    const g = convergenceGeometry([
      { iteration: 0, energy: -3, start: 0 },
      { iteration: 5, energy: -3.5, start: 0 },
      { iteration: 10, energy: -3.1, start: 1 },
      { iteration: 20, energy: -3.9, start: 1 },
      { iteration: 21, energy: -2, start: 0 },
    ], frame);
    // x of iteration 10 on 0…21 over 52…308 (worked by hand): 52 + 256 · 10/21 = 173.90…
    expect(g.restarts).toEqual([{ iteration: 10, start: 2, x: expect.closeTo(173.90476, 4) }]);
    expect(convergenceGeometry(trace, frame).restarts).toEqual([]);
  });
});
