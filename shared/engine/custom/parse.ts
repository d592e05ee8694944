import { parseOperator, type OperatorParse } from '../operators/format';
import { parseQuboCsv } from '../operators/qubo-csv';

/**
 * An uploaded or pasted operator: our "spinyard-operator 1" text or JSON, or a QUBO matrix as CSV
 * (chosen by `kind`, or guessed: a first line of numbers separated by commas or semicolons is CSV).
 */
export function readCustomOperator(text: string, kind?: 'operator' | 'qubo-csv'): OperatorParse {
  const first = text.split(/\r?\n/).map((l) => l.trim()).find((l) => l !== '' && !l.startsWith('#')) ?? '';
  const csv = kind === 'qubo-csv' || (kind === undefined && /^[+-]?[\d.]/.test(first) && /[,;]/.test(first));
  return csv ? parseQuboCsv(text) : parseOperator(text);
}
