/** The comparison rule (shared/engine/problem/compare.ts): feasibility first, then the value in the problem's sense. */
import { better, bestOf, contradicts, gap, meets } from '../../../shared/engine/problem/compare';

describe('better', () => {
  test('a feasible answer beats an infeasible one whatever the values', () => {
    expect(better('min', { value: 852, feasible: true }, { value: 851, feasible: false })).toBe(true);
    expect(better('min', { value: 851, feasible: false }, { value: 852, feasible: true })).toBe(false);
    expect(better('max', { value: 3, feasible: true }, { value: 9, feasible: false })).toBe(true);
  });
  test('then the larger cut (max) or the smaller crossing weight (min); equal values are not better', () => {
    expect(better('max', { value: 5, feasible: true }, { value: 4, feasible: true })).toBe(true);
    expect(better('min', { value: 5, feasible: true }, { value: 4, feasible: true })).toBe(false);
    expect(better('max', { value: 0.1 + 0.2, feasible: true }, { value: 0.3, feasible: true })).toBe(false); // float sums of lane weights tie
  });
  test('bestOf keeps the earliest of equals', () => {
    const items = [{ id: 'a', value: 4, feasible: true }, { id: 'b', value: 4, feasible: true }, { id: 'c', value: 2, feasible: false }];
    expect(bestOf('max', items, (x) => x)!.id).toBe('a');
    expect(bestOf('max', [], (x: { value: number; feasible: boolean }) => x)).toBeNull();
  });
});

describe('meets and gap', () => {
  test('a value meets its bound at equality (within 1e-9 relative) or beyond it', () => {
    expect(meets('max', 12, 12)).toBe(true);
    expect(meets('max', 11, 12)).toBe(false);
    expect(meets('min', 12 + 1e-12, 12)).toBe(true);
    expect(meets('min', 13, 12)).toBe(false);
    expect(meets('max', 12, null)).toBe(false);
  });
  test('gap is (bound − value)/bound for max and (value − bound)/value for min', () => {
    expect(gap('max', 9, 12)).toBeCloseTo(0.25, 12);
    expect(gap('min', 16, 12)).toBeCloseTo(0.25, 12);
    expect(gap('max', 12, 12)).toBe(0);
    expect(gap('min', 5, null)).toBeNull();
  });
  test('a bound the value contradicts gives no gap (it was no bound) instead of a clamped 0', () => {
    expect(contradicts('max', 13, 12)).toBe(true);
    expect(gap('max', 13, 12)).toBeNull();
    expect(gap('min', 11, 12)).toBeNull();
  });
});
