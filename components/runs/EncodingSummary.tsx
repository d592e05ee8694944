import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Button } from '../ui/Button';
import { aboutSeconds, circuitLine, costLine } from './setup-words';
import { ResourceTable } from './ResourceTable';
import { space } from '../theme';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { Body, Heading, Label, Small } from '../ui/Text';
import { formatMoney } from '../../shared/plans';
import { formatCount, formatSeconds, formatValue } from './format';
import type { RunPreview, SolverOption } from './types';

function Figure(props: { label: string; value: string; testID?: string }) {
  return (
    <View style={styles.figure}>
      <Label>{props.label}</Label>
      <Body testID={props.testID}>{props.value}</Body>
    </View>
  );
}

/** The longest per-solver budget (jobs of a run run side by side on the workers), or the preview's own figure. */
export function estimatedSeconds(preview: RunPreview): number | null {
  if (typeof preview.estimatedSeconds === 'number') return preview.estimatedSeconds;
  let most: number | null = null;
  for (const s of preview.solvers) {
    const e = s.estimatedSeconds;
    const v = typeof e === 'number' ? e : e && typeof e.atMost === 'number' ? e.atMost : null;
    if (v !== null) most = Math.max(most ?? 0, v);
  }
  return most;
}

const money = (p: NonNullable<RunPreview['price']>) => p.label ?? formatMoney(p);

/**
 * Before a run starts: first, in plain words, what it costs and about how long it takes (each
 * solver's own line sits by its tick box); then, behind a details control for analysts, the cost
 * operator — qubits, Pauli terms, offset, penalty weights and their rule, measurement groups, the
 * shots for the chosen precision and the price's make-up. Refusals of the chosen solvers last.
 */
export function EncodingSummary(props: { preview: RunPreview; solvers?: SolverOption[]; title?: string; children?: React.ReactNode; /** Only these solvers' refusals are shown (the rest are not in the run). */ chosen?: readonly string[]; /** An analyst's view of an existing run: the details shown, no cost lines. */ analyst?: boolean; /** Tables as rows from 1024 px; label-value lines on phones. */ wide?: boolean }) {
  const { preview } = props;
  const enc = preview.encoding;
  const [open, setDetails] = useState(false);
  const details = open || !!props.analyst;
  const label = (name: string) => props.solvers?.find((s) => s.name === name)?.label ?? name;
  const inRun = (name: string) => !props.chosen || props.chosen.includes(name);
  const refusals = preview.solvers.filter((s) => s.refusal && inRun(s.solver));
  const notAllowed = preview.solvers.filter((s) => s.allowed === false && inRun(s.solver));
  const estimate = estimatedSeconds(preview);
  // "QAOA (simulated quantum circuit)" → "QAOA": the circuit lines name the method only.
  const short = (name: string) => label(name).replace(/\s*\(.*\)$/, '');
  const circuits = preview.solvers.filter((s) => s.circuit && !s.refusal && inRun(s.solver));
  return (
    <Card testID="encoding-summary">
      <Heading>{props.title ?? 'Before you start'}</Heading>
      {!props.analyst ? (
        <>
          <Body testID="run-cost" numberOfLines={2}>{costLine(preview.price)}</Body>
          {estimate !== null ? <Small testID="run-time">Each solver takes {aboutSeconds(estimate)} at most; they run side by side.</Small> : null}
          {preview.quote?.note && preview.price ? <Small testID="enc-price-note">{preview.quote.note}</Small> : null}
          {circuits.map((c) => <Small key={c.solver} testID={`circuit-line-${c.solver}`}>{circuitLine(short(c.solver), c.circuit!)}</Small>)}
        </>
      ) : null}
      {!props.analyst ? <Button
        label={details ? 'Hide the encoding details' : 'Encoding details (for analysts)'}
        tone="quiet"
        onPress={() => setDetails((d) => !d)}
        accessibilityHint="Qubits, Pauli terms, penalty weights, shots, gate counts per qubit layout and how the price is made up"
        testID="encoding-details-toggle"
      /> : null}
      {!details ? null : enc ? (
        <View style={styles.list} testID="encoding-details">
          <View style={styles.grid}>
            <Figure label="Qubits" value={formatCount(enc.qubits)} testID="enc-qubits" />
            <Figure label="Pauli terms" value={formatCount(enc.pauliTerms)} testID="enc-terms" />
            <Figure label="Offset" value={formatValue(enc.offset)} testID="enc-offset" />
            <Figure label="Commuting groups" value={formatCount(enc.commutingGroups)} testID="enc-groups" />
            <Figure label={`Shots for an energy within ± ${formatValue(enc.precision)}`} value={formatCount(enc.shots)} testID="enc-shots" />
            {estimate !== null ? <Figure label="Estimated time" value={`at most ${formatSeconds(estimate)}`} testID="enc-time" /> : null}
            {preview.price ? <Figure label="Price" value={money(preview.price)} testID="enc-price" /> : null}
          </View>
          <Small>Encoding: {enc.method}{enc.slackQubits ? ` (${enc.depotQubits} depot qubits + ${enc.slackQubits} slack qubits)` : ''}. {enc.rule}</Small>
          {preview.circuit ? <Small testID="enc-circuit">Summarised: {preview.circuit}.</Small> : null}
          {enc.penalties.length > 0 ? (
            <View style={styles.list} testID="enc-penalties">
              <Label>Penalty weights</Label>
              {enc.penalties.map((p) => (
                <Small key={p.name}>
                  {p.name}: {formatValue(p.weight)} — {p.rule}
                </Small>
              ))}
            </View>
          ) : (
            <Small>No penalty terms: every assignment is a valid answer to this question.</Small>
          )}
          {enc.shotRule ? <Small>{enc.shotRule}</Small> : null}
          {props.children}
        </View>
      ) : (
        <Small>{preview.encodingNote ?? 'This question is too large for a direct quantum encoding; classical solvers and decomposition still apply.'}</Small>
      )}
      {details && preview.price?.lines?.length ? (
        <View style={styles.list} testID="enc-price-lines">
          <Label>This is a paid run: it starts once paid</Label>
          {preview.price.lines.map((l) => (
            <Small key={l.label}>
              {l.label}: {formatMoney({ amount: l.amount, currency: preview.price!.currency })}
            </Small>
          ))}
        </View>
      ) : null}
      {details && preview.solvers.some((s) => typeof s.qubits === 'number' && s.qubits > 0) ? (
        <View style={styles.list} testID="enc-solver-qubits">
          <Label>Qubits each solver will simulate</Label>
          {preview.solvers.filter((s) => typeof s.qubits === 'number' && s.qubits > 0).map((s) => (
            <Small key={s.solver}>{label(s.solver)}: {formatCount(s.qubits as number)}</Small>
          ))}
        </View>
      ) : null}
      {details && circuits.length > 0 ? (
        <View style={styles.list} testID="enc-resources">
          <Label>Circuit resources per qubit layout</Label>
          {circuits.map((c) => (
            <View key={c.solver} style={styles.list} testID={`enc-resources-${c.solver}`}>
              <Small>{short(c.solver)} · {formatCount(c.circuit!.qubits)} qubits</Small>
              <ResourceTable circuit={c.circuit!} wide={!!props.wide} rowID={(l) => `enc-${c.solver}-${l}`} />
            </View>
          ))}
          <Small>The same counts the finished run reports. A line or grid of qubits needs swaps to bring interacting qubits together; counting rules in the docs (runs, “Circuit resources”).</Small>
        </View>
      ) : null}
      {preview.quote?.ceiling && preview.price ? (
        <Small testID="enc-price-ceiling">No run on the {preview.plan?.label ?? 'current'} plan costs more than {formatMoney(preview.quote.ceiling)}; larger runs are refused before they start.</Small>
      ) : null}
      {preview.limitProblem ? <Notice tone="error">{preview.limitProblem}</Notice> : null}
      {preview.forbidden ? <Notice tone="error">{preview.forbidden}</Notice> : null}
      {notAllowed.length > 0 ? <Notice tone="caution">Changed settings need the analyst role: {notAllowed.map((s) => label(s.solver)).join(', ')}.</Notice> : null}
      {refusals.length > 0 ? (
        <Notice tone="caution">
          <View style={styles.list}>
            {refusals.map((r) => (
              <Small key={r.solver} testID={`refusal-${r.solver}`}>
                {label(r.solver)} will not run: {r.refusal}
              </Small>
            ))}
          </View>
        </Notice>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', rowGap: space.md },
  figure: { minWidth: 120, width: '33%', gap: 2 },
  list: { gap: space.xs },
});
