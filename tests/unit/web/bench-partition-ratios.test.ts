import { ratiosOf } from '../../bench/all';

describe('npm run bench: partitioning ratios against METIS', () => {
  test('each k gives ours / METIS at 1 s and at the full budget, four decimals, lower is better', () => {
    const out = [
      '## Partitioning vs METIS',
      '',
      '### G22 (2000 depots, 19990 lanes, unit weights), 10 CPU s for ours',
      '',
      '| k | METIS best of 50 | METIS CPU s per run of 10 (all 50) | METIS heaviest part | ours at 1 s | ours at 10 s | ours CPU s to reach METIS best | ours heaviest part | limit | ratio at 1 s | ratio at 10 s | beats METIS at 1 s / 10 s? |',
      '|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---|',
      '| 2 (bisection) | 6893 | 0.11 (0.54) | 1030 | 6806 | 6761 | 0.40 | 1030 | 1030.00 | 0.9874 | 0.9809 | yes / yes |',
      '| 8 | 13180 | 0.30 (1.51) | 255 | 13190 | 13174 | 1.42 | 257 | 257.50 | 1.0008 | 0.9995 | no / yes |',
    ].join('\n');
    const rows = ratiosOf('partition', out);
    expect(rows.map((r) => [r.metric, r.measured, r.target, r.better, r.digits])).toEqual([
      ['G22: fm / METIS cut, k = 2 (bisection), at 1 CPU s', 0.9874, 1, 'lower', 4],
      ['G22: fm / METIS cut, k = 2 (bisection), at 10 CPU s', 0.9809, 1, 'lower', 4],
      ['G22: fm / METIS cut, k = 8, at 1 CPU s', 1.0008, 1, 'lower', 4],
      ['G22: fm / METIS cut, k = 8, at 10 CPU s', 0.9995, 1, 'lower', 4],
    ]);
  });
  test('no METIS (no table): no ratios', () => {
    expect(ratiosOf('partition', '## Partitioning vs METIS\n\nMETIS could not be run: missing. No ratios this time.')).toEqual([]);
  });
});
