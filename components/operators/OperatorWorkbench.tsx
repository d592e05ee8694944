import { useState } from 'react';
import { Platform, StyleSheet, View } from 'react-native';
import * as DocumentPicker from 'expo-document-picker';
import { ApiError } from '../api/client';
import { useOperatorInspectMutation, useOperatorSolveMutation } from '../queries/operators';
import { resourceRows } from '../runs/circuit-view';
import { Segmented } from '../runs/controls';
import { space } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { DecisionSupportNote, Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { TextField } from '../ui/TextField';
import { Body, Heading, Label, Small } from '../ui/Text';

const EXAMPLE = `spinyard-operator 1
# transverse-field Ising chain of 4 spins (J = 1, h = 1), periodic
qubits 4
-1 Z0 Z1
-1 Z1 Z2
-1 Z2 Z3
-1 Z3 Z0
-1 X0
-1 X1
-1 X2
-1 X3
`;

type Kind = 'auto' | 'operator' | 'qubo-csv';
const KIND_LABEL: Record<Kind, string> = { auto: 'Recognise', operator: 'Spinyard operator', 'qubo-csv': 'QUBO matrix (CSV)' };
const num = (x: number) => (Number.isInteger(x) ? String(x) : String(Number(x.toPrecision(8))));

/** The problems an API error names (one per line of the operator), or its message. */
function problemsOf(error: Error | null): string[] {
  if (!error) return [];
  const fields = error instanceof ApiError ? error.fields : undefined;
  const lines = fields ? Object.values(fields).flat() : [];
  return lines.length > 0 ? lines : [error.message];
}

/**
 * /runs/operator — operators of your own (analysts): paste or open a file in our operator format
 * or a QUBO matrix as CSV, inspect it, and run VQE (or QAOA when it is diagonal) next to the exact
 * ground energy, with the circuit's resources per qubit layout.
 */
export function OperatorWorkbench(props: { wide: boolean }) {
  const [text, setText] = useState(EXAMPLE);
  const [kind, setKind] = useState<Kind>('auto');
  const [solver, setSolver] = useState<'vqe' | 'qaoa'>('vqe');
  const [ansatz, setAnsatz] = useState<'alternating' | 'ladder'>('alternating');
  const [layers, setLayers] = useState('2');
  const inspect = useOperatorInspectMutation();
  const solve = useOperatorSolveMutation();
  const k = kind === 'auto' ? {} : { kind };
  const open = async () => {
    const r = await DocumentPicker.getDocumentAsync({ multiple: false, copyToCacheDirectory: true });
    const a = r.canceled ? null : r.assets?.[0];
    if (!a) return;
    const body = Platform.OS === 'web' && a.file ? await a.file.text() : await (await fetch(a.uri)).text();
    setText(body);
    if (/\.csv$/i.test(a.name)) setKind('qubo-csv');
  };
  const run = () => solve.mutate({ text, ...k, solver, settings: { layers: Number(layers) || 1, ...(solver === 'vqe' ? { ansatz } : {}) } });
  const problems = [...problemsOf(inspect.error), ...problemsOf(solve.error)];
  const r = solve.data;
  return (
    <Screen title="Operator of your own" subtitle="Spin models and QUBO matrices next to their exact ground energy">
      <DecisionSupportNote />
      <Card>
        <Heading>Operator</Heading>
        <Small>Our text format ("spinyard-operator 1", one term per line: coefficient then factors like Z0 Z3 X5), its JSON form, or a QUBO matrix as CSV (n rows of n numbers; E(x) = Σ Q_ij x_i x_j).</Small>
        <TextField label="Operator text" value={text} onChangeText={setText} multiline numberOfLines={12} style={styles.text} testID="operator-text" autoCapitalize="none" autoCorrect={false} />
        <View style={styles.row}>
          <Button label="Open a file…" tone="secondary" onPress={() => void open()} testID="operator-open" />
          <Segmented label="Read as" options={['auto', 'operator', 'qubo-csv'] as const} value={kind} onChange={setKind} format={(v) => KIND_LABEL[v]} />
        </View>
        <Button label={inspect.isPending ? 'Inspecting…' : 'Inspect'} tone="secondary" onPress={() => inspect.mutate({ text, ...k })} disabled={inspect.isPending} testID="operator-inspect" />
        {problems.length > 0 ? (
          <Notice tone="error" testID="operator-problems">{problems.join('\n')}</Notice>
        ) : null}
      </Card>
      {inspect.data ? (
        <Card testID="operator-inspection">
          <Heading>Inspector</Heading>
          <Body>{inspect.data.qubits} qubits · {inspect.data.terms} Pauli terms + constant {num(inspect.data.offset)}{inspect.data.diagonal ? ' · Z terms only (QAOA applies)' : ''}</Body>
          <Body>{inspect.data.groups.length} qubit-wise commuting group(s), one measurement setting each: {inspect.data.groups.map((g) => `${g.basis} (${g.terms})`).join(', ')}</Body>
          <Body>Shots for standard error {num(inspect.data.precision)}: {inspect.data.shots.uniformTotal.toLocaleString('en-US')} spread evenly, {inspect.data.shots.weightedTotal.toLocaleString('en-US')} weighted by group.</Body>
          <Label>Largest terms</Label>
          {inspect.data.largest.slice(0, 12).map((t, i) => <Small key={i}>{t.coeff >= 0 ? '+' : '−'} {num(Math.abs(t.coeff))} · {t.factors}</Small>)}
        </Card>
      ) : null}
      <Card>
        <Heading>Run</Heading>
        <Segmented label="Solver" options={['vqe', 'qaoa'] as const} value={solver} onChange={setSolver} format={(v) => (v === 'vqe' ? 'VQE' : 'QAOA (Z terms only)')} />
        {solver === 'vqe' ? <Segmented label="Ansatz" options={['alternating', 'ladder'] as const} value={ansatz} onChange={setAnsatz} format={(v) => (v === 'ladder' ? 'Ladder' : 'Alternating')} /> : null}
        <TextField label="Layers" value={layers} onChangeText={setLayers} keyboardType="numeric" testID="operator-layers" />
        <Button label={solve.isPending ? 'Running…' : 'Run'} onPress={run} disabled={solve.isPending} testID="operator-run" />
        <Small>Runs on this server for at most 10 s; larger operators: the command line, spinyard solve --operator FILE.</Small>
      </Card>
      {r ? (
        <Card testID="operator-result">
          <Heading>{r.solver === 'vqe' ? 'VQE' : 'QAOA'} next to the exact ground energy</Heading>
          <Body>Energy at the optimised parameters: {num(r.energy)}</Body>
          <Body>Exact ground energy: {r.exact ? `${num(r.exact.energy)} (${r.exact.method})` : 'too many qubits to diagonalise'}</Body>
          <Body testID="operator-gap">Gap: {r.gap === null ? '—' : `${num(r.gap)}${r.relativeGap !== null ? ` (${(100 * r.relativeGap).toFixed(2)} % of |exact|)` : ''}`}</Body>
          <Small>{r.evaluations} evaluations in {r.seconds.toFixed(1)} s{r.stopped ? ', stopped at the time limit' : ''}. The energy can never lie below the exact value; the gap is what the circuit missed.</Small>
          {r.circuit ? (
            <View testID="operator-circuit">
              <Label>Circuit resources · {r.circuit.qubits} qubits</Label>
              {resourceRows({ circuit: r.circuit }).map((row) => <Small key={row.layout}>{row.label}: {row.oneQubitGates} one-qubit and {row.twoQubitGates} two-qubit gates, two-qubit depth {row.twoQubitDepth}, depth {row.depth}{row.swaps ? `, ${row.swaps} swaps` : ''}</Small>)}
            </View>
          ) : r.circuitNote ? <Small>{r.circuitNote}</Small> : null}
        </Card>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  text: { minHeight: 200, fontFamily: 'monospace', fontSize: 13, textAlignVertical: 'top' },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
});
