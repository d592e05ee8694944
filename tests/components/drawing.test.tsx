import { fireEvent, render, screen, act } from '@testing-library/react';
import { fitProjection, layoutNetwork, project, unproject, LANE_LENGTH } from '../../components/drawing/layout';
import { fitTransform, pinchTransform, toScreen, toWorld, zoomAt } from '../../components/drawing/viewport';
import { depotAt, laneAt, segmentDistance2 } from '../../components/drawing/hit';
import { record, redo, startHistory, undo } from '../../components/drawing/history';
import { addDepot, addLane, laneEnds, moveDepot, nextDepotId, removeSelected, type Draft } from '../../components/drawing/draft';
import { NetworkDrawing } from '../../components/drawing/NetworkDrawing';
import { NetworkWorkspace } from '../../components/networks/NetworkWorkspace';
import { colors, regionColors } from '../../components/theme';

/** Great-circle distance (haversine formula; textbook spherical trigonometry, common practice), km. */
function haversineKm(a: { lat: number; lon: number }, b: { lat: number; lon: number }) {
  const R = 6371.0088; // mean Earth radius (IUGG) [memory]
  const rad = Math.PI / 180;
  const dLat = (b.lat - a.lat) * rad, dLon = (b.lon - a.lon) * rad;
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(a.lat * rad) * Math.cos(b.lat * rad) * Math.sin(dLon / 2) ** 2;
  return 2 * R * Math.asin(Math.sqrt(h));
}

describe('layout', () => {
  test('the lat/lon projection keeps distance ratios within 1 % of great-circle distances over a region 50 km wide', () => {
    // Equirectangular projection scaled by cos(lat0) (Snyder, Map Projections: A Working Manual, USGS 1987 [memory]):
    // over a small region its distances match the sphere closely.
    const depots = [
      { id: 'a', lat: 47.0, lon: -31.2 }, { id: 'b', lat: 47.3, lon: -31.0 }, { id: 'c', lat: 47.1, lon: -30.6 }, { id: 'd', lat: 47.4, lon: -30.7 },
    ];
    const p = fitProjection(depots);
    const xy = depots.map((d) => project(p, d.lat, d.lon));
    const ratios: number[] = [];
    for (let i = 0; i < 4; i++) for (let j = i + 1; j < 4; j++) ratios.push(Math.hypot(xy[i][0] - xy[j][0], xy[i][1] - xy[j][1]) / haversineKm(depots[i], depots[j]));
    const mean = ratios.reduce((s, r) => s + r, 0) / ratios.length;
    for (const r of ratios) expect(Math.abs(r / mean - 1)).toBeLessThan(0.01);
    // North is up: a depot further north has a smaller y.
    expect(xy[1][1]).toBeLessThan(xy[0][1]);
    const back = unproject(p, xy[2][0], xy[2][1]);
    expect(back.lat).toBeCloseTo(47.1, 5);
    expect(back.lon).toBeCloseTo(-30.6, 5);
  });

  test('force layout of a path: neighbours about one lane length apart, the ends far apart, the same every time', () => {
    const depots = Array.from({ length: 10 }, (_, i) => ({ id: `p${i}` }));
    const lanes = depots.slice(1).map((d, i) => ({ from: depots[i].id, to: d.id }));
    const { xy, projection } = layoutNetwork(depots, lanes);
    expect(projection).toBeNull();
    const dist = (a: number, b: number) => Math.hypot(xy[2 * a] - xy[2 * b], xy[2 * a + 1] - xy[2 * b + 1]);
    for (let i = 0; i < 9; i++) {
      expect(dist(i, i + 1)).toBeGreaterThan(LANE_LENGTH * 0.6);
      expect(dist(i, i + 1)).toBeLessThan(LANE_LENGTH * 1.6);
    }
    expect(dist(0, 9)).toBeGreaterThan(LANE_LENGTH * 3);
    expect(Array.from(layoutNetwork(depots, lanes).xy)).toEqual(Array.from(xy));
  });
});

describe('viewport and hit testing', () => {
  const xy = new Float64Array([0, 0, 100, 0, 100, 50, -20, 80]);

  test('fit puts every depot inside the canvas with the padding to spare', () => {
    const t = fitTransform(xy, 390, 440, 36);
    for (let i = 0; i < 4; i++) {
      const [sx, sy] = toScreen(t, xy[2 * i], xy[2 * i + 1]);
      expect(sx).toBeGreaterThanOrEqual(36 - 1e-9);
      expect(sx).toBeLessThanOrEqual(390 - 36 + 1e-9);
      expect(sy).toBeGreaterThanOrEqual(36 - 1e-9);
      expect(sy).toBeLessThanOrEqual(440 - 36 + 1e-9);
    }
  });

  test('zooming keeps the world point under the pointer fixed', () => {
    const t = { k: 1.3, x: 20, y: -7 };
    const before = toWorld(t, 150, 90);
    const after = toWorld(zoomAt(t, 1.8, 150, 90), 150, 90);
    expect(after[0]).toBeCloseTo(before[0], 10);
    expect(after[1]).toBeCloseTo(before[1], 10);
  });

  test('pinch: the world point under the starting midpoint stays under the fingers, zoom follows the spread', () => {
    const t0 = { k: 0.8, x: 40, y: 12 };
    const anchor = toWorld(t0, 100, 200);
    const t = pinchTransform(t0, [100, 200], [130, 170], 50, 125);
    expect(t.k).toBeCloseTo(0.8 * 2.5, 12);
    const [sx, sy] = toScreen(t, anchor[0], anchor[1]);
    expect(sx).toBeCloseTo(130, 9);
    expect(sy).toBeCloseTo(170, 9);
  });

  test('point–segment distance (textbook): perpendicular inside the segment, to the nearer end outside it', () => {
    expect(segmentDistance2(5, 3, 0, 0, 10, 0)).toBeCloseTo(9, 12);
    expect(segmentDistance2(13, 4, 0, 0, 10, 0)).toBeCloseTo(25, 12); // 3-4-5 triangle to (10, 0)
    expect(segmentDistance2(2, 2, 1, 1, 1, 1)).toBeCloseTo(2, 12); // a zero-length segment is a point
  });

  test('depotAt picks the nearest depot within the radius; laneAt the nearest lane', () => {
    expect(depotAt(xy, 97, 3, 10)).toBe(1);
    expect(depotAt(xy, 50, 30, 10)).toBe(-1);
    const ends = new Int32Array([0, 1, 1, 2, 0, 3]);
    expect(laneAt(xy, ends, 50, 4, 6)).toBe(0);
    expect(laneAt(xy, ends, 104, 25, 6)).toBe(1);
    expect(laneAt(xy, ends, 50, 30, 6)).toBe(-1);
  });
});

describe('draft edits and undo', () => {
  const base: Draft = { depots: [{ id: 'D1' }, { id: 'D2' }], lanes: [], xy: new Float64Array([0, 0, 10, 0]) };

  test('lanes: no self-loops and one lane per depot pair (checkNetwork rules; volumes add on import instead)', () => {
    const one = addLane(base, 0, 1, 4) as Draft;
    expect(one.lanes).toEqual([{ from: 'D1', to: 'D2', weight: 4 }]);
    expect(addLane(base, 1, 1, 1)).toEqual({ problem: 'a lane needs two different depots' });
    expect(addLane(one, 1, 0, 2)).toEqual({ problem: expect.stringMatching(/already joined/) });
    expect(Array.from(laneEnds(one))).toEqual([0, 1]);
  });

  test('new ids skip taken ones; deleting a depot removes its lanes; moving with a projection updates lat/lon', () => {
    const three = addDepot(base, { id: nextDepotId(base), name: 'Caddle End' }, 5, 5, null);
    expect(three.depots[2]).toEqual({ id: 'D3', name: 'Caddle End' });
    expect(nextDepotId({ depots: [{ id: 'D2' }, { id: 'D3' }] })).toBe('D4');
    const joined = addLane(addLane(three, 0, 2, 1) as Draft, 1, 2, 1) as Draft;
    const cut = removeSelected(joined, { depots: new Set([2]), lanes: new Set() });
    expect(cut.depots.map((d) => d.id)).toEqual(['D1', 'D2']);
    expect(cut.lanes).toEqual([]);
    expect(Array.from(cut.xy)).toEqual([0, 0, 10, 0]);
    const projection = { lat0: 47, lon0: -31, scale: 1000 };
    const moved = moveDepot(base, 1, 0, -100, projection);
    expect(moved.depots[1].lat).toBeCloseTo(47.1, 9);
    expect(moved.depots[1].lon).toBeCloseTo(-31, 9);
    expect(base.depots[1].lat).toBeUndefined(); // the old draft is untouched (undo keeps it)
  });

  test('undo and redo walk the snapshots; a new edit after undo drops the redo branch', () => {
    let h = startHistory('a');
    h = record(h, 'b');
    h = record(h, 'c');
    h = undo(h);
    expect(h.present).toBe('b');
    h = redo(h);
    expect(h.present).toBe('c');
    h = record(undo(h), 'x');
    expect(h.present).toBe('x');
    expect(redo(h).present).toBe('x');
    expect(undo(undo(h)).present).toBe('a');
  });
});

describe('NetworkDrawing', () => {
  const depots = [{ id: 'a', name: 'Alder' }, { id: 'b' }, { id: 'c' }];
  const lanes = [{ from: 'a', to: 'b', weight: 2 }, { from: 'b', to: 'c', weight: 8 }];
  const xy = new Float64Array([0, 0, 50, 0, 50, 50]);

  test('per-depot colours, emphasised lanes and a selection are drawn (the partition screens rely on them)', () => {
    const { container } = render(
      <NetworkDrawing depots={depots} lanes={lanes} xy={xy} width={300} height={200} transform={{ k: 1, x: 10, y: 10 }} depotColors={[regionColors[0], regionColors[1], undefined]} emphasisedLanes={new Set([1])} selection={{ depots: new Set([2]), lanes: new Set() }} />,
    );
    const circles = Array.from(container.querySelectorAll('circle'));
    const fills = circles.map((c) => c.getAttribute('fill'));
    expect(fills).toEqual(expect.arrayContaining([regionColors[0], regionColors[1], colors.surface]));
    expect(fills.filter((f) => f === colors.signal)).toHaveLength(1); // the selection ring
    const strokes = Array.from(container.querySelectorAll('line')).map((l) => l.getAttribute('stroke'));
    expect(strokes).toEqual([colors.inkSoft, colors.signalDeep]);
    expect(container.textContent).toContain('Alder');
    expect(screen.getByLabelText('Drawing of 3 depots and 2 lanes')).toBeTruthy();
  });
});

describe('drawing on the canvas', () => {
  test('a tap on empty space asks for a name in an in-app prompt and adds the depot', async () => {
    render(<NetworkWorkspace document={{ depots: [], lanes: [] }} readOnly={false} onSave={async () => {}} />);
    const canvas = screen.getByTestId('drawing-canvas');
    await act(async () => {
      fireEvent.mouseDown(canvas, { clientX: 40, clientY: 40, button: 0, buttons: 1 });
      fireEvent.mouseUp(canvas, { clientX: 40, clientY: 40, button: 0 });
    });
    const field = await screen.findByLabelText('Depot name');
    fireEvent.change(field, { target: { value: 'Harrowfen Yard' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add depot' }));
    expect(screen.getByRole('tab', { name: /^Depots\s*\(1\)$/ })).toBeTruthy();
    expect(screen.getByTestId('save-state').textContent).toBe('Unsaved changes');
    fireEvent.click(screen.getByRole('tab', { name: /^Depots\s*\(1\)$/ }));
    expect(screen.getByRole('button', { name: /Harrowfen Yard/ })).toBeTruthy();
    fireEvent.click(screen.getByRole('tab', { name: 'Drawing' }));
    fireEvent.click(screen.getByRole('button', { name: 'Undo' }));
    expect(screen.getByRole('tab', { name: /^Depots\s*\(0\)$/ })).toBeTruthy();
  });
});
