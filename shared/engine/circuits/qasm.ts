import { angleValue, type Angle, type Gate, type PhysicalCircuit } from './types';

export type QasmVersion = 2 | 3;

export interface QasmOptions {
  version: QasmVersion;
  /** Parameter values (the optimised ones). Bound: written as numbers into every gate. */
  params: ArrayLike<number>;
  /**
   * 'bound': a flat gate list with numbers. 'parameterised': the circuit with named angles —
   * OpenQASM 3 `input float[64]` parameters; OpenQASM 2.0 (no free parameters at top level) a
   * `gate` definition with the parameters as arguments, applied once with `params`.
   */
  form: 'bound' | 'parameterised';
  /** End with a read-out of every qubit into c (default true). */
  measure?: boolean;
  /** Extra comment lines for the header (what the run was). */
  notes?: string[];
}

/** OpenQASM identifier for a parameter name: γ1 → gamma_1, θ0.3 → theta_0_3. */
export function qasmParamName(name: string): string {
  const greek: Record<string, string> = { 'γ': 'gamma_', 'β': 'beta_', 'θ': 'theta_', 'φ': 'phi_' };
  const out = name.replace(/[γβθφ]/g, (ch) => greek[ch]).replace(/[^A-Za-z0-9_]/g, '_');
  return /^[A-Za-z]/.test(out) ? out : `p_${out}`;
}

/** A real literal both versions accept (OpenQASM 2.0 wants a decimal point before an exponent). */
export function qasmNumber(x: number): string {
  if (!Number.isFinite(x)) throw new RangeError(`cannot write ${x} as an angle`);
  const s = String(x);
  return s.includes('e') && !s.includes('.') ? s.replace('e', '.0e') : s;
}

/**
 * The circuit as OpenQASM 3 or 2.0 text with the standard gate library (stdgates.inc /
 * qelib1.inc). Physical qubit p is q[p]; the read-out writes logical qubit j into c[j], from the
 * physical qubit routing left it on (stated in a comment). Global phase is not written (2.0 has
 * no way to; qelib1's rz differs from e^{−iθZ/2} by one).
 */
export function toQasm(c: PhysicalCircuit, opts: QasmOptions): string {
  const n = c.numQubits;
  const v3 = opts.version === 3;
  const names = c.paramNames.map(qasmParamName);
  const symbolic = opts.form === 'parameterised';
  const lines: string[] = [v3 ? 'OPENQASM 3.0;' : 'OPENQASM 2.0;', v3 ? 'include "stdgates.inc";' : 'include "qelib1.inc";'];
  lines.push(`// Spinyard ${c.name} circuit, ${n} qubits, layout "${c.layout}"${symbolic ? ', parameterised' : ', parameters bound'}.`);
  for (const note of opts.notes ?? []) lines.push(`// ${note}`);
  lines.push(`// Initial qubit order (logical->physical): ${placementText(c.initialPlacement)}`);
  lines.push(`// Final qubit order (logical->physical): ${placementText(c.finalPlacement)}; c[j] reads logical qubit j.`);
  if (symbolic) lines.push(`// Parameters (optimised values): ${names.map((nm, i) => `${nm} = ${qasmNumber(opts.params[i])}`).join(', ')}`);
  const angle = (a: Angle): string => (symbolic && a.param >= 0 ? scaled(a.scale, names[a.param]) : qasmNumber(angleValue(a, opts.params)));
  const body = (q: (p: number) => string) => c.gates.map((g) => `${gateText(g, angle, q)};`);

  if (v3) {
    if (symbolic) names.forEach((nm) => lines.push(`input float[64] ${nm};`));
    lines.push(`qubit[${n}] q;`, `bit[${n}] c;`, ...body((p) => `q[${p}]`));
    if (opts.measure ?? true) for (let j = 0; j < n; j++) lines.push(`c[${j}] = measure q[${c.finalPlacement[j]}];`);
    return `${lines.join('\n')}\n`;
  }
  lines.push(`qreg q[${n}];`, `creg c[${n}];`);
  if (symbolic && c.gates.length > 0) {
    const args = Array.from({ length: n }, (_, p) => `q${p}`);
    lines.push(`gate ${c.name}(${names.join(', ')}) ${args.join(', ')} {`, ...body((p) => `q${p}`).map((l) => `  ${l}`), '}');
    lines.push(`${c.name}(${Array.from(opts.params, qasmNumber).join(', ')}) ${args.map((_, p) => `q[${p}]`).join(', ')};`);
  } else lines.push(...body((p) => `q[${p}]`));
  if (opts.measure ?? true) for (let j = 0; j < n; j++) lines.push(`measure q[${c.finalPlacement[j]}] -> c[${j}];`);
  return `${lines.join('\n')}\n`;
}

function placementText(p: Int32Array): string {
  return Array.from(p, (phys, j) => `${j}->q[${phys}]`).join(' ');
}

function scaled(scale: number, name: string): string {
  if (scale === 1) return name;
  if (scale === -1) return `-${name}`;
  return `${qasmNumber(scale)}*${name}`;
}

function gateText(g: Gate, angle: (a: Angle) => string, q: (p: number) => string): string {
  const wires = g.qubits.map(q).join(', ');
  return 'angle' in g && g.angle ? `${g.name}(${angle(g.angle)}) ${wires}` : `${g.name} ${wires}`;
}
