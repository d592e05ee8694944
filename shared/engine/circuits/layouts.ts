import type { LayoutName } from './types';

/**
 * Qubit layouts (coupling graphs). Physical qubits are numbered along a path that the layout
 * contains — the line itself, or the snake through the grid (row 0 left to right, row 1 right
 * to left, …) — so physical qubits i and i+1 are always coupled and a swap network can run
 * along the numbering.
 */
export interface Layout {
  name: LayoutName;
  numQubits: number;
  /** Grid shape (rows × cols, the last row possibly partial); 1 × n for the line. */
  rows: number;
  cols: number;
  /** True when a two-qubit gate may act on physical qubits p and q directly. */
  coupled(p: number, q: number): boolean;
}

/** The square grid for n qubits: cols = ⌈√n⌉, rows = ⌈n / cols⌉. */
export function gridShape(n: number): { rows: number; cols: number } {
  const cols = Math.max(1, Math.ceil(Math.sqrt(n)));
  return { rows: Math.max(1, Math.ceil(n / cols)), cols };
}

/** Row and column of snake position i on a grid with `cols` columns. */
export function snakeCell(i: number, cols: number): [number, number] {
  const r = Math.floor(i / cols), k = i % cols;
  return [r, r % 2 === 0 ? k : cols - 1 - k];
}

export function createLayout(name: LayoutName, n: number): Layout {
  if (name === 'all') return { name, numQubits: n, rows: 1, cols: n, coupled: (p, q) => p !== q };
  if (name === 'line') return { name, numQubits: n, rows: 1, cols: n, coupled: (p, q) => Math.abs(p - q) === 1 };
  const { rows, cols } = gridShape(n);
  return {
    name, numQubits: n, rows, cols,
    coupled(p, q) {
      const [rp, cp] = snakeCell(p, cols), [rq, cq] = snakeCell(q, cols);
      return Math.abs(rp - rq) + Math.abs(cp - cq) === 1;
    },
  };
}
