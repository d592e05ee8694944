import { createLayout, type Layout } from './layouts';
import { initialPlacement } from './placement';
import { circuitResources } from './resources';
import type { Gate, Interaction, LayoutName, LogicalCircuit, PhysicalCircuit } from './types';

/**
 * Routes a logical circuit onto a layout with swap networks (Kivlichan et al., "Quantum
 * simulation of electronic structure with linear depth and connectivity", PRL 120, 110501
 * (2018); O'Gorman, Huggins, Rieffel & Whaley, "Generalized swap networks for near-term quantum
 * computing", arXiv:1905.05118 (2019)). Rules (docs/runs.md, "Circuit resources"):
 * - 'all': every interaction directly (zz = cx·rz·cx, cz native), in rounds of disjoint pairs.
 * - line/grid, per diagonal stage: while interactions remain — if all of them act on coupled
 *   qubits (grid: any grid neighbours), apply them directly (in rounds) and stop; otherwise one
 *   step of the odd-even swap network along the numbering (the line, or the grid's snake) (pairs (i, i+1) with i ≡ step mod 2): a pair that still
 *   has its interaction gets it merged with the swap (zz·swap = 3 cx, cz·swap = 2 cx), other
 *   pairs are swapped (3 cx) unless neither qubit has anything left to meet.
 *   n steps of the full network reverse the order, so every pair meets within n steps
 *   whatever the starting order; the order reached carries over to the next stage.
 * - grid: the better of that rule and the same with interactions across snake rows applied as
 *   soon as their qubits are grid neighbours (see routeCircuit). This is the line's network laid
 *   on the grid, not a two-dimensional swap network: its counts are an upper bound for a grid.
 */
export function routeCircuit(circuit: LogicalCircuit, layoutName: LayoutName): PhysicalCircuit {
  if (layoutName !== 'grid') return route(circuit, layoutName, false);
  // Grid: also try applying interactions between grid neighbours that are not next to each other
  // in the numbering (the links across snake rows) as soon as they are free, and keep the
  // cheaper circuit (fewer two-qubit gates, then smaller depth). Without that step the grid is
  // never worse than the line; with it, sparse networks often need far fewer swaps.
  const plain = route(circuit, 'grid', false), across = route(circuit, 'grid', true);
  const a = circuitResources(plain), b = circuitResources(across);
  return b.twoQubitGates < a.twoQubitGates || (b.twoQubitGates === a.twoQubitGates && b.depth < a.depth) ? across : plain;
}

function route(circuit: LogicalCircuit, layoutName: LayoutName, acrossFirst: boolean): PhysicalCircuit {
  const n = circuit.numQubits;
  const layout = createLayout(layoutName, n);
  const where = layoutName === 'all' ? Int32Array.from({ length: n }, (_, q) => q) : initialPlacement(circuit);
  const initial = where.slice();
  const at = new Int32Array(n);
  where.forEach((p, q) => (at[p] = q));
  const gates: Gate[] = [];
  let swaps = 0;
  const place = (g: Gate): Gate => ({ ...g, qubits: g.qubits.map((q) => where[q]) } as Gate);

  for (const stage of circuit.stages) {
    if (stage.type === 'gates') { for (const g of stage.gates) gates.push(place(g)); continue; }
    for (const g of stage.singles) gates.push(place(g));
    const pending = new Map<number, Interaction>();
    const key = (a: number, b: number) => Math.min(a, b) * n + Math.max(a, b);
    const left = new Int32Array(n); // interactions still to meet, per logical qubit
    for (const it of stage.interactions) { pending.set(key(it.a, it.b), it); left[it.a]++; left[it.b]++; }
    const apply = (it: Interaction) => {
      pending.delete(key(it.a, it.b));
      left[it.a]--; left[it.b]--;
      direct(gates, it, where[it.a], where[it.b]);
    };
    for (let step = 0; pending.size > 0; step++) {
      if (step > 2 * n + 2) throw new Error('swap network did not meet every pair (routing fault)');
      const ready = [...pending.values()];
      if (ready.every((it) => layout.coupled(where[it.a], where[it.b]))) { inRounds(ready).forEach(apply); break; }
      if (acrossFirst) inRounds(ready.filter((it) => layout.coupled(where[it.a], where[it.b]) && Math.abs(where[it.a] - where[it.b]) !== 1)).forEach(apply);
      for (let p = step % 2; p + 1 < n; p += 2) {
        const la = at[p], lb = at[p + 1];
        const it = pending.get(key(la, lb));
        if (it) {
          pending.delete(key(la, lb));
          left[la]--; left[lb]--;
          mergedSwap(gates, it, p, p + 1);
        } else if (left[la] > 0 || left[lb] > 0) {
          gates.push({ name: 'cx', qubits: [p, p + 1] }, { name: 'cx', qubits: [p + 1, p] }, { name: 'cx', qubits: [p, p + 1] });
        } else continue;
        swaps++;
        at[p] = lb; at[p + 1] = la; where[lb] = p; where[la] = p + 1;
      }
    }
  }
  return { name: circuit.name, layout: layoutName, numQubits: n, paramNames: circuit.paramNames, gates, initialPlacement: initial, finalPlacement: where.slice(), swaps };
}

/**
 * Commuting interactions reordered into rounds of disjoint pairs (greedy, in the given order),
 * so the as-soon-as-possible schedule runs each round in parallel.
 */
export function inRounds(list: Interaction[]): Interaction[] {
  const out: Interaction[] = [];
  let rest = list;
  while (rest.length > 0) {
    const busy = new Set<number>();
    const later: Interaction[] = [];
    for (const it of rest) {
      if (busy.has(it.a) || busy.has(it.b)) later.push(it);
      else { busy.add(it.a); busy.add(it.b); out.push(it); }
    }
    rest = later;
  }
  return out;
}

/** An interaction on physical qubits p, q as it stands. */
function direct(gates: Gate[], it: Interaction, p: number, q: number): void {
  if (it.kind === 'cz') { gates.push({ name: 'cz', qubits: [p, q] }); return; }
  gates.push({ name: 'cx', qubits: [p, q] }, { name: 'rz', qubits: [q], angle: it.angle }, { name: 'cx', qubits: [p, q] });
}

/**
 * The interaction followed by a swap of p, q: zz·swap = cx(p,q) rz(q) cx(q,p) cx(p,q) (the swap's
 * first cx cancels the interaction's last); cz·swap = h(q) cx(q,p) cx(p,q) h(p).
 */
function mergedSwap(gates: Gate[], it: Interaction, p: number, q: number): void {
  if (it.kind === 'cz') {
    gates.push({ name: 'h', qubits: [q] }, { name: 'cx', qubits: [q, p] }, { name: 'cx', qubits: [p, q] }, { name: 'h', qubits: [p] });
    return;
  }
  gates.push({ name: 'cx', qubits: [p, q] }, { name: 'rz', qubits: [q], angle: it.angle }, { name: 'cx', qubits: [q, p] }, { name: 'cx', qubits: [p, q] });
}

export type { Layout };
