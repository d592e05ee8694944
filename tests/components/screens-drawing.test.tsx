import { render } from '@testing-library/react';
import { placeLabels, shorten, textWidth, type Box } from '../../components/drawing/labels';
import { fitTransform } from '../../components/drawing/viewport';
import { markRadius, NetworkDrawing } from '../../components/drawing/NetworkDrawing';
import { describeAudit } from '../../components/team/format';
import type { AuditEvent } from '../../shared/schemas/auth';

/**
 * Drawings that read well: names never overlap each other, a mark or a control, and stay inside
 * the canvas; a fit keeps every depot clear of the floating controls; a 260-depot network draws
 * smaller marks with names only where they fit. Audit entries say who and what in words.
 */

/** A small deterministic generator (mulberry32, public-domain; values from memory of its constants). */
function rng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const overlaps = (a: Box, b: Box) => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

function checkLayout(labels: ReturnType<typeof placeLabels>, xy: Float64Array, r: number, width: number, height: number, reserved: Box[]) {
  for (let i = 0; i < labels.length; i++) {
    const b = labels[i].box;
    expect(b.x).toBeGreaterThanOrEqual(0);
    expect(b.y).toBeGreaterThanOrEqual(0);
    expect(b.x + b.w).toBeLessThanOrEqual(width);
    expect(b.y + b.h).toBeLessThanOrEqual(height);
    for (const z of reserved) expect(overlaps(b, z)).toBe(false);
    for (let j = i + 1; j < labels.length; j++) expect(overlaps(b, labels[j].box)).toBe(false);
    for (let d = 0; d < xy.length / 2; d++) expect(overlaps(b, { x: xy[2 * d] - r, y: xy[2 * d + 1] - r, w: 2 * r, h: 2 * r })).toBe(false);
  }
}

test('crowded names: none overlap, none leave the canvas or cover a control; crowded ones shortened or left out; the chosen one in full', () => {
  const names = ['Harrowfen Yard North Gate', 'Ossel Bridge', 'Tarnwyth Hub', 'Lintmouth Quay', 'Quillmere Central Depot', 'Brackley Sidings'];
  // All six within a few pixels of each other, one near the right edge.
  const xy = new Float64Array([100, 100, 112, 104, 104, 116, 96, 92, 120, 96, 380, 200]);
  const reserved = [{ x: 0, y: 0, w: 120, h: 60 }];
  const labels = placeLabels(xy, names, { width: 390, height: 300, fontSize: 11, radius: 8, order: [0, 1, 2, 3, 4, 5], always: new Set([4]), reserved });
  checkLayout(labels, xy, 8, 390, 300, reserved);
  // Not all six full names fit around one spot: some are shortened ("Harrowfen…") or left out.
  expect(labels.filter((l) => l.full).length).toBeLessThan(names.length);
  for (const l of labels.filter((x) => !x.full)) expect(l.text).toMatch(/…$/);
  const chosen = labels.find((l) => l.index === 4)!;
  expect(chosen.text).toBe('Quillmere Central Depot');
  const edge = labels.find((l) => l.index === 5)!;
  expect(edge.anchor).toBe('end'); // turned inward at the right edge
  expect(shorten('Harrowfen Yard North Gate', 10)).toBe('Harrowfen…');
  expect(textWidth('abcd', 10)).toBeCloseTo(23.2);
});

test('a fit keeps every depot in the band between the top and bottom controls', () => {
  const xy = new Float64Array([0, 0, 100, 0, 100, 100, 0, 100, 50, 200]);
  const insets = { top: 60, right: 0, bottom: 60, left: 0 };
  const t = fitTransform(xy, 390, 440, 32, insets);
  for (let i = 0; i < 5; i++) {
    const sy = t.y + t.k * xy[2 * i + 1];
    expect(sy).toBeGreaterThanOrEqual(60 + 32 - 1e-9);
    expect(sy).toBeLessThanOrEqual(440 - 60 - 32 + 1e-9);
  }
  // Without insets the same network reaches into those bands.
  const plain = fitTransform(xy, 390, 440, 32);
  expect(plain.y + plain.k * 200).toBeGreaterThan(440 - 60);
});

test('260 depots: smaller marks, names only where they fit (no overlaps), lanes inside regions recede', () => {
  const n = 260;
  const next = rng(260);
  const depots = Array.from({ length: n }, (_, i) => ({ id: `D${i + 1}`, name: `Quillmere depot ${i + 1}` }));
  const xy = new Float64Array(2 * n);
  for (let i = 0; i < 2 * n; i++) xy[i] = next() * 1000;
  const lanes = Array.from({ length: 3 * n }, (_, e) => ({ from: `D${1 + Math.floor(next() * n)}`, to: `D${1 + Math.floor(next() * n)}`, weight: 1 + Math.floor(next() * 9) })).filter((l) => l.from !== l.to);
  const width = 1000, height = 600;
  const t = fitTransform(xy, width, height, 32);
  expect(markRadius(n)).toBeLessThan(8);
  expect(markRadius(n)).toBeGreaterThanOrEqual(3);
  const { container } = render(
    <NetworkDrawing depots={depots} lanes={lanes} xy={xy} width={width} height={height} transform={t} markScale={1 / t.k} showLabels depotColors={depots.map((_, i) => (i % 2 ? '#123' : '#abc'))} emphasisedLanes={new Set([0, 1, 2])} />,
  );
  const shown = container.querySelectorAll('[data-testid="depot-label"]');
  expect(shown.length).toBeGreaterThan(5);
  expect(shown.length).toBeLessThan(n);
  // The same placement the drawing used, checked for overlaps in screen space.
  const screen = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) { screen[2 * i] = t.x + t.k * xy[2 * i]; screen[2 * i + 1] = t.y + t.k * xy[2 * i + 1]; }
  const order = Array.from({ length: n }, (_, i) => i);
  const labels = placeLabels(screen, depots.map((d) => d.name), { width, height, fontSize: 11, radius: markRadius(n), order });
  checkLayout(labels, screen, markRadius(n), width, height, []);
  // Lanes that do not cross are drawn faint next to the emphasised crossing lanes.
  const opacities = Array.from(container.querySelectorAll('line')).map((l) => l.getAttribute('opacity') ?? l.getAttribute('stroke-opacity') ?? '1');
  expect(opacities.filter((o) => o === '0.3').length).toBeGreaterThan(lanes.length / 2);
});

const event = (action: string, detail: Record<string, unknown>, extra: Partial<AuditEvent> = {}): AuditEvent => ({
  id: 1, action, actor: { id: 1, name: 'Ivo Marsh', email: 'ivo@quillmere.example' }, targetType: null, targetId: null, detail, ip: null, createdAt: '2026-12-01T10:00:00.000Z', ...extra,
});

test('audit entries say who and what, in words', () => {
  const removed = event('member.removed', { role: 'viewer' }, { targetType: 'user', targetId: '9', target: { id: 9, name: 'Ada Fenn', email: 'ada@quillmere.example' } });
  expect(describeAudit(removed)).toBe('Ivo Marsh removed Ada Fenn (ada@quillmere.example) (Viewer)');
  expect(describeAudit(event('billing.payment_succeeded', { purpose: 'credits', amount: 2500 }, { actor: null }))).toBe('Card payment of €25.00 for credits went through');
  expect(describeAudit(event('billing.run_paid', { amount: 575, with: 'credits' }, { targetType: 'run', targetId: '12' }))).toBe('Ivo Marsh paid run #12 (€5.75) from the credits');
  expect(describeAudit(event('billing.run_refunded', { amount: 250, to: 'card' }, { actor: null, targetType: 'run', targetId: '3' }))).toBe('Run #3 failed, so its price (€2.50) went back to the card');
  for (const action of ['billing.checkout_started', 'billing.payment_failed', 'something.new_kind']) expect(describeAudit(event(action, {}))).not.toMatch(/[a-z]\.[a-z]|_/);
});

test('a tapped or hovered depot shows its full name even where every spot touches another mark', () => {
  // A 7×7 block of marks 12 px apart: no name fits anywhere without touching a mark.
  const xy = new Float64Array(2 * 49);
  for (let i = 0; i < 49; i++) { xy[2 * i] = 150 + 12 * (i % 7); xy[2 * i + 1] = 100 + 12 * Math.floor(i / 7); }
  const names = Array.from({ length: 49 }, (_, i) => `Quillmere stop ${i + 1}`);
  const plain = placeLabels(xy, names, { width: 400, height: 300, fontSize: 11, radius: 4, order: [] });
  expect(plain).toEqual([]);
  const chosen = placeLabels(xy, names, { width: 400, height: 300, fontSize: 11, radius: 4, order: [24], always: new Set([24]) });
  expect(chosen.map((l) => l.text)).toEqual(['Quillmere stop 25']);
  expect(chosen[0].box.x).toBeGreaterThanOrEqual(0);
  expect(chosen[0].box.x + chosen[0].box.w).toBeLessThanOrEqual(400);
});
