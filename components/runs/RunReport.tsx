import { useEffect, useMemo, useState } from 'react';
import { ScrollView, StyleSheet, View, useWindowDimensions } from 'react-native';
import * as Print from 'expo-print';
import { useRouter } from 'expo-router';
import { useRunQuery, useRunVersionQuery, useSolverLabels } from '../queries/runs';
import { colors, fonts, space } from '../theme';
import { Button } from '../ui/Button';
import { DecisionSupportNote, Notice } from '../ui/Notice';
import { Body, Heading, Label, Small, Title } from '../ui/Text';
import { formatValue, questionLabel, solverLabelOf } from './format';
import { PartitionView, regionName } from './PartitionView';
import { Scorecard } from './Scorecard';
import { buildScorecard } from './scorecard';
import { STATUS_TEXT } from './progress';
import { formatDateTime } from '../ui/dates';
import { partWord } from '../../shared/runs/regions';

/**
 * The printable report: plain page without the app's navigation, the scorecard as a table, the
 * best answer on the network with totals, and every depot's side — then the caution.
 */
export function RunReport(props: { id: number }) {
  const router = useRouter();
  const { width } = useWindowDimensions();
  const run = useRunQuery(props.id);
  const version = useRunVersionQuery(run.data?.networkId, run.data?.versionId);
  const labels = useSolverLabels();
  const [printing, setPrinting] = useState(false);
  useEffect(() => {
    if (!printing) return;
    // One frame for the buttons to leave, then the print dialog; they come back after it.
    const t = setTimeout(() => void Print.printAsync({}).finally(() => setPrinting(false)), 50);
    return () => clearTimeout(t);
  }, [printing]);
  const card = useMemo(() => (run.data ? buildScorecard(run.data, labels) : null), [run.data, labels]);
  if (run.isPending) return <View style={styles.page}><Body>Loading the report…</Body></View>;
  if (run.isError || !card) return <View style={styles.page}><Notice tone="error">This run was not found in your organisation.</Notice></View>;
  const r = run.data;
  const best = r.jobs.find((j) => j.id === card.bestJobId);
  const doc = version.data?.document;
  return (
    <ScrollView contentContainerStyle={styles.page} testID="run-report">
      <View style={styles.head}>
        <View style={styles.titles}>
          <Title>Spinyard run {r.id}</Title>
          <Small>
            {questionLabel(r.problem)}
            {r.problem.tolerance !== undefined && r.problem.kind !== 'maxcut' ? ` · tolerance ${Math.round(r.problem.tolerance * 1000) / 10} %` : ''} · {r.networkName ?? `network ${r.networkId}`}{version.data ? ` · version ${version.data.number}` : ''} · {formatDateTime(r.createdAt)} · {STATUS_TEXT[r.status] ?? r.status}
          </Small>
        </View>
        {/* The page's own buttons leave the page while it prints. */}
        {!printing ? (
          <View style={styles.actions}>
            <Button label="Print" onPress={() => setPrinting(true)} testID="print-report" />
            <Button label="Back to run" tone="secondary" onPress={() => router.push(`/runs/${r.id}`)} />
          </View>
        ) : null}
      </View>
      <DecisionSupportNote />
      <Heading>Scorecard</Heading>
      <Scorecard card={card} valueName={r.problem.kind === 'maxcut' ? 'Cut weight' : 'Crossing weight'} wide={width >= 760} />
      {best?.result && doc ? (
        <>
          <PartitionView document={doc} problem={r.problem} assignment={best.result.assignment} title={`Best answer: ${solverLabelOf(labels, best)}`} height={420} still />
          <Heading>Depot assignment</Heading>
          <View testID="report-assignment">
            <View style={[styles.tr, styles.thead]}>
              <Label style={styles.cellId}>Depot id</Label>
              <Label style={styles.cellName}>Name</Label>
              <Label style={styles.cellSide}>{partWord(r.problem.kind) === 'region' ? 'Region' : 'Side'}</Label>
            </View>
            {doc.depots.map((d, i) => (
              <View key={d.id} style={styles.tr}>
                <Body style={styles.cellId}>{d.id}</Body>
                <Body style={styles.cellName}>{d.name ?? ''}</Body>
                <Body style={styles.cellSide}>{regionName(r.problem.kind, best.result!.assignment[i])}</Body>
              </View>
            ))}
          </View>
          <Small>Value of this answer: {formatValue(best.result.value)}. Downloaded CSV files carry the same assignment.</Small>
        </>
      ) : null}
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  page: { padding: space.xl, gap: space.lg, backgroundColor: colors.surface, maxWidth: 1100, width: '100%', alignSelf: 'center' },
  head: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between', gap: space.md },
  titles: { gap: space.xs, flexShrink: 1 },
  actions: { flexDirection: 'row', gap: space.sm },
  tr: { flexDirection: 'row', borderBottomWidth: 1, borderColor: colors.line, paddingVertical: 4 },
  thead: { borderColor: colors.ink },
  cellId: { width: 120, fontFamily: fonts.medium },
  cellName: { flex: 1 },
  cellSide: { width: 120 },
});
