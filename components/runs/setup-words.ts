/**
 * What run setup says to a dispatcher, as pure functions of the preview: one plain line per
 * solver ("needs 15 qubits · about 12 s · free"), the run's cost in one line, and each settings
 * problem as a sentence tied to its field — never a path like "solvers.2.settings.layers".
 */
import { formatMoney } from '../../shared/plans';
import type { AdvancedSettings } from './setup';
import type { PreviewSolver, Price } from './types';

export type AdvancedField = Exclude<keyof AdvancedSettings, 'ansatz'> | 'ansatz';

export const FIELD_LABELS: Record<AdvancedField, string> = {
  layers: 'Circuit layers',
  ansatz: 'VQE ansatz',
  optimizer: 'Optimizer',
  shots: 'Shots per energy estimate',
  seed: 'Seed',
  timeLimitSeconds: 'Time limit per solver',
  noise: 'Noise comparison',
};

const perSeconds = (e: PreviewSolver['estimatedSeconds']): number | null => (typeof e === 'number' ? e : e && typeof e.atMost === 'number' ? e.atMost : null);

/** "about 12 s", "about 2 min" (whole units: this is a promise of scale, not a measurement). */
export function aboutSeconds(seconds: number): string {
  return seconds < 90 ? `about ${Math.max(1, Math.round(seconds))} s` : `about ${Math.round(seconds / 60)} min`;
}

/**
 * One solver in plain words. `position` is the solver's place among the chosen ones (1-based),
 * which is how the price names a solver's extra qubits ("Solver 2: …").
 */
export function solverLine(answer: PreviewSolver | undefined, price: Price | null | undefined, position: number | null): string | null {
  if (!answer) return null;
  if (answer.refusal) return `Will not run here: ${answer.refusal}`;
  const parts: string[] = [];
  if (typeof answer.qubits === 'number' && answer.qubits > 0) parts.push(`needs ${answer.qubits} qubits`);
  const s = perSeconds(answer.estimatedSeconds);
  if (s !== null) parts.push(aboutSeconds(s));
  if (!price) parts.push('free');
  else {
    const own = position !== null ? price.lines?.find((l) => l.label.startsWith(`Solver ${position}:`)) : undefined;
    parts.push(own ? `${formatMoney({ amount: own.amount, currency: price.currency })} for its qubits` : 'in the run price');
  }
  return parts.join(' · ');
}

const count = (n: number) => n.toLocaleString('en-US');

/**
 * What a circuit would need on real hardware, in one plain line for dispatchers: qubits and the
 * two-qubit gates (the noisy ones) when the qubits sit in a line — the layout most devices can
 * offer — and when every pair is connected. The table per layout is for analysts.
 */
export function circuitLine(label: string, circuit: NonNullable<PreviewSolver['circuit']>): string {
  const line = circuit.layouts.line.twoQubitGates, all = circuit.layouts.all.twoQubitGates;
  return `${label} on a real device: ${count(circuit.qubits)} qubits and ${count(line)} two-qubit gates with the qubits in a line${line === all ? '' : ` (${count(all)} if every pair were connected)`}.`;
}

/** The run's cost in one line. */
export function costLine(price: Price | null | undefined): string {
  return price ? `This run costs ${price.label ?? formatMoney(price)}; it starts once it is paid.` : 'This run is free on your plan.';
}

/** 'solvers.2.settings.layers' → { field: 'layers', solver: 2 }; 'timeLimitSeconds' → { field }. */
export function fieldOf(key: string): { field: AdvancedField | null; solver: number | null } {
  const m = /^solvers\.(\d+)\.settings\.(\w+)$/.exec(key);
  const name = m ? m[2] : key.split('.').pop() ?? key;
  return { field: name in FIELD_LABELS ? (name as AdvancedField) : null, solver: m ? Number(m[1]) : null };
}

const sentence = (text: string) => {
  const t = text.trim().replace(/\(got ([^)]*)\)/, '(you entered $1)');
  return /[.!?]$/.test(t) ? t : `${t}.`;
};

/**
 * Each settings problem the preview found, as a sentence naming the field (and the solver, when
 * the field belongs to one), and which advanced field to mark.
 */
export function fieldProblems(fields: Record<string, string[]> | null | undefined, solverLabelAt: (index: number) => string | undefined): { field: AdvancedField | null; text: string }[] {
  const out: { field: AdvancedField | null; text: string }[] = [];
  for (const [key, messages] of Object.entries(fields ?? {})) {
    const { field, solver } = fieldOf(key);
    const who = solver !== null ? solverLabelAt(solver) : undefined;
    const name = field ? FIELD_LABELS[field] : 'A setting';
    for (const m of messages) out.push({ field, text: sentence(`${name}${who ? ` (${who})` : ''}: ${m}`) });
  }
  return out;
}

/** Numbers typed in the advanced panel that are not numbers at all (caught before asking the server). */
export function typedProblems(adv: AdvancedSettings | null): { field: AdvancedField; text: string }[] {
  if (!adv) return [];
  const out: { field: AdvancedField; text: string }[] = [];
  const check = (field: 'layers' | 'shots' | 'seed' | 'timeLimitSeconds', whole: boolean) => {
    const t = adv[field].trim();
    if (t === '') return;
    const v = Number(t);
    if (!Number.isFinite(v) || (whole && !Number.isInteger(v))) out.push({ field, text: `${FIELD_LABELS[field]}: enter ${whole ? 'a whole number' : 'a number'} (you entered “${t}”).` });
  };
  check('layers', true);
  check('shots', true);
  check('seed', true);
  check('timeLimitSeconds', false);
  return out;
}
