import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { encodeProblem } from '../../shared/engine/encodings';
import type { NetworkDocument } from '../../shared/engine/network/types';
import { useRunPreviewQuery } from '../queries/runs';
import { space } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { Body, Heading, Small } from '../ui/Text';
import { EncodingSummary } from './EncodingSummary';
import { boundProblem } from './partition';
import type { RunDetail } from './types';

const SHOWN_TERMS = 40;

/** Terms of the cost operator, largest |coefficient| first, qubits named by depot where they are depots. */
export function operatorTerms(doc: Pick<NetworkDocument, 'depots' | 'lanes'>, problem: RunDetail['problem']) {
  const enc = encodeProblem(boundProblem(doc, problem));
  const op = enc.operator;
  const name = (q: number) => (enc.kind !== 'kway' && q < doc.depots.length ? `Z${q} (${doc.depots[q].id})` : `Z${q}`);
  const terms: { text: string; coeff: number }[] = [];
  for (let q = 0; q < op.numQubits; q++) if (op.linear[q] !== 0) terms.push({ text: name(q), coeff: op.linear[q] });
  for (let t = 0; t < op.quadCoeff.length; t++) if (op.quadCoeff[t] !== 0) terms.push({ text: `${name(op.quadI[t])} · ${name(op.quadJ[t])}`, coeff: op.quadCoeff[t] });
  terms.sort((a, b) => Math.abs(b.coeff) - Math.abs(a.coeff));
  return { terms, offset: op.offset, qubits: op.numQubits };
}

/** The run's cost operator on request: the encoding summary and its largest terms (one Z-basis measurement group). */
export function OperatorInspector(props: { run: RunDetail; document: Pick<NetworkDocument, 'depots' | 'lanes'> }) {
  const [open, setOpen] = useState(false);
  const body = open ? { versionId: props.run.versionId, problem: props.run.problem, solvers: props.run.jobs.map((j) => ({ solver: j.solver })) } : null;
  const preview = useRunPreviewQuery(body);
  const listing = useMemo(() => {
    if (!open) return null;
    try {
      return operatorTerms(props.document, props.run.problem);
    } catch (err) {
      return { error: (err as Error).message };
    }
  }, [open, props.document, props.run.problem]);
  if (!open) return <Button label="Inspect the cost operator" tone="secondary" onPress={() => setOpen(true)} testID="inspect-operator" />;
  return (
    <View style={styles.wrap} testID="operator-inspector">
      {preview.data ? <EncodingSummary preview={preview.data} title="Cost operator" analyst /> : preview.isError ? <Notice tone="error">{preview.error.message}</Notice> : <Small>Loading the encoding summary…</Small>}
      <Card>
        <Heading>Terms</Heading>
        {listing && 'error' in listing ? (
          <Small>{listing.error}</Small>
        ) : listing ? (
          <>
            <Small>
              {listing.terms.length} terms on {listing.qubits} qubits plus the constant {Number(listing.offset.toPrecision(6))}. All are products of Z, so one measurement group reads them all.
              {listing.terms.length > SHOWN_TERMS ? ` The ${SHOWN_TERMS} largest are shown.` : ''}
            </Small>
            {listing.terms.slice(0, SHOWN_TERMS).map((t, i) => (
              <Body key={i} style={styles.term}>
                {t.coeff >= 0 ? '+' : '−'} {Number(Math.abs(t.coeff).toPrecision(6))} · {t.text}
              </Body>
            ))}
          </>
        ) : null}
      </Card>
      <Button label="Hide the cost operator" tone="quiet" onPress={() => setOpen(false)} />
    </View>
  );
}

const styles = StyleSheet.create({ wrap: { gap: space.sm }, term: { fontFamily: 'monospace', fontSize: 13 } });
