import { StyleSheet, View } from 'react-native';
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
 * The cost operator a run will use, before it starts: qubits, Pauli terms, offset, penalty
 * weights and the rule that set them, measurement groups, the shots for the chosen precision,
 * the time estimate, refusals — and the price only when the preview returns one.
 */
export function EncodingSummary(props: { preview: RunPreview; solvers?: SolverOption[]; title?: string; children?: React.ReactNode }) {
  const { preview } = props;
  const enc = preview.encoding;
  const label = (name: string) => props.solvers?.find((s) => s.name === name)?.label ?? name;
  const refusals = preview.solvers.filter((s) => s.refusal);
  const notAllowed = preview.solvers.filter((s) => s.allowed === false);
  const estimate = estimatedSeconds(preview);
  return (
    <Card testID="encoding-summary">
      <Heading>{props.title ?? 'Before you start'}</Heading>
      {enc ? (
        <>
          <View style={styles.grid}>
            <Figure label="Qubits" value={formatCount(enc.qubits)} testID="enc-qubits" />
            <Figure label="Pauli terms" value={formatCount(enc.pauliTerms)} testID="enc-terms" />
            <Figure label="Offset" value={formatValue(enc.offset)} testID="enc-offset" />
            <Figure label="Commuting groups" value={formatCount(enc.commutingGroups)} testID="enc-groups" />
            <Figure label={`Shots for ± ${formatValue(enc.precision)}`} value={formatCount(enc.shots)} testID="enc-shots" />
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
        </>
      ) : (
        <Small>{preview.encodingNote ?? 'This question is too large for a direct quantum encoding; classical solvers and decomposition still apply.'}</Small>
      )}
      {enc === null && estimate !== null ? <Small testID="enc-time">Estimated time: at most {formatSeconds(estimate)} per solver.</Small> : null}
      {preview.price?.lines?.length ? (
        <View style={styles.list} testID="enc-price-lines">
          <Label>This is a paid run: it starts once paid</Label>
          {preview.price.lines.map((l) => (
            <Small key={l.label}>
              {l.label}: {formatMoney({ amount: l.amount, currency: preview.price!.currency })}
            </Small>
          ))}
          {preview.quote?.note ? <Small testID="enc-price-note">{preview.quote.note}</Small> : null}
        </View>
      ) : null}
      {preview.solvers.some((s) => typeof s.qubits === 'number' && s.qubits > 0) ? (
        <View style={styles.list} testID="enc-solver-qubits">
          <Label>Qubits each solver will simulate</Label>
          {preview.solvers.filter((s) => typeof s.qubits === 'number' && s.qubits > 0).map((s) => (
            <Small key={s.solver}>{label(s.solver)}: {formatCount(s.qubits as number)}</Small>
          ))}
        </View>
      ) : null}
      {preview.quote?.ceiling && preview.price ? (
        <Small testID="enc-price-ceiling">No run on the {preview.plan?.label ?? 'current'} plan costs more than {formatMoney(preview.quote.ceiling)}; larger runs are refused before they start.</Small>
      ) : null}
      {preview.limitProblem ? <Notice tone="error">{preview.limitProblem}</Notice> : null}
      {preview.forbidden ? <Notice tone="error">{preview.forbidden}</Notice> : null}
      {notAllowed.length > 0 ? <Notice tone="caution">Changed settings need the analyst role: {notAllowed.map((s) => label(s.solver)).join(', ')}.</Notice> : null}
      {preview.fields && Object.keys(preview.fields).length > 0 ? (
        <Notice tone="error">
          <View style={styles.list}>
            {Object.entries(preview.fields).map(([k, msgs]) => (
              <Small key={k}>{k}: {msgs.join('; ')}</Small>
            ))}
          </View>
        </Notice>
      ) : null}
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
