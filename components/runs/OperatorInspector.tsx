import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { NetworkDocument } from '../../shared/engine/network/types';
import { useRunPreviewQuery } from '../queries/runs';
import { space } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { Body, Heading, Small } from '../ui/Text';
import { EncodingSummary } from './EncodingSummary';
import type { EncodingView, RunDetail } from './types';

/**
 * Terms of the operator the preview summarises, named by depot where a qubit is a depot. The
 * server picks the operator (for k regions, the first split a chosen solver simulates), so the
 * list and the summary above it always count the same qubits.
 */
export function operatorTerms(doc: Pick<NetworkDocument, 'depots'>, enc: EncodingView) {
  const depotNamed = enc.method !== 'kway-onehot';
  const name = (q: number) => (depotNamed && q < doc.depots.length ? `Z${q} (${doc.depots[q].id})` : `Z${q}`);
  const terms = (enc.largestTerms ?? []).map((t) => ({ text: t.qubits.map(name).join(' · '), coeff: t.coeff }));
  return { terms, offset: enc.offset, qubits: enc.qubits, total: enc.pauliTerms };
}

/** The run's cost operator on request: the encoding summary and its largest terms (one Z-basis measurement group). */
export function OperatorInspector(props: { run: RunDetail; document: Pick<NetworkDocument, 'depots' | 'lanes'> }) {
  const [open, setOpen] = useState(false);
  const body = open ? { versionId: props.run.versionId, problem: props.run.problem, solvers: props.run.jobs.map((j) => ({ solver: j.solver })) } : null;
  const preview = useRunPreviewQuery(body);
  if (!open) return <Button label="Inspect the cost operator" tone="secondary" onPress={() => setOpen(true)} testID="inspect-operator" />;
  const enc = preview.data?.encoding ?? null;
  const listing = enc ? operatorTerms(props.document, enc) : null;
  return (
    <View style={styles.wrap} testID="operator-inspector">
      {preview.data ? <EncodingSummary preview={preview.data} title="Cost operator" analyst /> : preview.isError ? <Notice tone="error">{preview.error.message}</Notice> : <Small>Loading the encoding summary…</Small>}
      <Card>
        <Heading>Terms</Heading>
        {preview.data && !enc ? (
          <Small>{preview.data.encodingNote ?? 'No operator to list.'}</Small>
        ) : listing ? (
          <>
            <Small>
              {listing.total.toLocaleString('en')} terms on {listing.qubits.toLocaleString('en')} qubits plus the constant {Number(listing.offset.toPrecision(6))}. All are products of Z, so one measurement group reads them all.
              {listing.total > listing.terms.length ? ` The ${listing.terms.length} largest are shown.` : ''}
            </Small>
            {listing.terms.map((t, i) => (
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
