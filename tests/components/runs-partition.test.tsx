import { emptyRegionNote, summarisePartition } from '../../components/runs/partition';
import { operatorTerms } from '../../components/runs/OperatorInspector';
import { boundProblem } from '../../components/runs/partition';
import { describeEncoding } from '../../shared/engine/solvers/orchestrate';

// Cycle C6 with unit lanes and unit demand: minimum bisection 2 (textbook, common practice).
const c6 = {
  depots: Array.from({ length: 6 }, (_, i) => ({ id: `C${i}` })),
  lanes: Array.from({ length: 6 }, (_, i) => ({ from: `C${i}`, to: `C${(i + 1) % 6}`, weight: 1 })),
};

describe('summarisePartition (the engine rules, as the partition view shows them)', () => {
  test('C6 split into two arcs: crossing 2, balanced 3/3, the two crossing lanes emphasised', () => {
    const s = summarisePartition(c6, { kind: 'bisection', tolerance: 0 }, [0, 0, 0, 1, 1, 1]);
    expect(s.crossing).toBe(2);
    expect(s.balanced).toBe(true);
    expect(s.regions.map((r) => r.depots)).toEqual([3, 3]);
    expect(s.regions.map((r) => r.internalLaneWeight)).toEqual([2, 2]);
    // Lanes C2–C3 (index 2) and C5–C0 (index 5) cross.
    expect([...s.crossingLanes].sort()).toEqual([2, 5]);
    // Balance rule for k = 2: the heavier side may weigh W/2 + d_max/2 = 3.5 at tolerance 0.
    expect(s.limit).toBeCloseTo(3.5, 6);
  });

  test('5 against 1 breaks the balance rule at tolerance 0; max-cut has no balance limit', () => {
    const bad = summarisePartition(c6, { kind: 'bisection', tolerance: 0 }, [0, 0, 0, 0, 0, 1]);
    expect(bad.balanced).toBe(false);
    expect(bad.crossing).toBe(2);
    // Alternating sides cut every lane of an even cycle: max cut of C6 = 6 (textbook).
    const cut = summarisePartition(c6, { kind: 'maxcut' }, [0, 1, 0, 1, 0, 1]);
    expect(cut.crossing).toBe(6);
    expect(cut.limit).toBeNull();
    expect(cut.balanced).toBe(true);
  });

  test('three regions of two depots on C6: three crossing lanes, each region 2 depots', () => {
    const s = summarisePartition(c6, { kind: 'kway', k: 3, tolerance: 0 }, [0, 0, 1, 1, 2, 2]);
    expect(s.crossing).toBe(3);
    expect(s.regions.map((r) => r.depots)).toEqual([2, 2, 2]);
    expect(s.balanced).toBe(true);
    expect(s.emptyRegions).toEqual([]);
    expect(emptyRegionNote('kway', s.emptyRegions)).toBeNull();
  });

  test('an empty region is named with why it may be empty: four regions of C6 at a loose tolerance', () => {
    // Limit (1 + 0.5)·6/4 + 1·3/4 = 3, so three regions of two take all six depots and region 3 stays empty.
    const s = summarisePartition(c6, { kind: 'kway', k: 4, tolerance: 0.5 }, [0, 0, 1, 1, 2, 2]);
    expect(s.balanced).toBe(true);
    expect(s.emptyRegions).toEqual([3]);
    const note = emptyRegionNote('kway', s.emptyRegions)!;
    expect(note).toMatch(/^Region \d+ has no depots: the balance rule caps each region's demand but sets no minimum/);
    expect(emptyRegionNote('kway', [1, 3])).toMatch(/^Region \d+ and Region \d+ have no depots/i);
    // Max-cut's sides are not regions to fill: all on one side is just a cut of 0.
    expect(summarisePartition(c6, { kind: 'maxcut' }, [0, 0, 0, 0, 0, 0]).emptyRegions).toEqual([]);
  });
});

describe('operatorTerms (the inspector list)', () => {
  test('max-cut on C6: one Z·Z term per lane, constant −W/2 = −3 under energy = −cut', () => {
    const t = operatorTerms(c6, describeEncoding(boundProblem(c6, { kind: 'maxcut' })));
    expect(t.qubits).toBe(6);
    expect(t.terms).toHaveLength(6);
    expect(t.terms.every((x) => x.text.includes('·'))).toBe(true);
    expect(t.offset).toBeCloseTo(-3, 12);
    // Each lane of weight 1 contributes +½ Z_uZ_v (cut = Σ w(1 − Z_uZ_v)/2, energy = −cut).
    for (const x of t.terms) expect(x.coeff).toBeCloseTo(0.5, 12);
  });
});
