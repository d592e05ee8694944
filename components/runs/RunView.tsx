import { useEffect, useMemo, useState } from 'react';
import { StyleSheet, View, useWindowDimensions, type LayoutChangeEvent } from 'react-native';
import { useRouter } from 'expo-router';
import { senseOf } from '../../shared/engine/problem/types';
import { can, type Role } from '../../shared/permissions';
import { ConvergenceChart } from '../charts/ConvergenceChart';
import { SampleHistogram } from '../charts/SampleHistogram';
import { isLive, useRunCancelMutation, useRunQuery, useRunRetryMutation, useRunVersionQuery, useSolverLabels } from '../queries/runs';
import { colors, space, WIDE_BREAKPOINT } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { EmptyState } from '../ui/EmptyState';
import { DecisionSupportNote, Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Body, Heading, Label, Small } from '../ui/Text';
import { ProgressBar, Segmented } from './controls';
import { CircuitPanel } from './CircuitPanel';
import { ExportBar } from './ExportBar';
import { formatPercent, formatSeconds, formatValue, parameterNames, questionLabel, solverLabelOf } from './format';
import { OperatorInspector } from './OperatorInspector';
import { PartitionView } from './PartitionView';
import { Scorecard } from './Scorecard';
import { LargeComparison } from './LargeComparison';
import { LargeSolverPanels } from './LargeSolverPanels';
import { largeComparison } from './large-solvers';
import { buildScorecard } from './scorecard';
import type { RunDetail, RunJob } from './types';
import { useLiveTraces } from './useLiveTraces';
import { jobStatusLine, runClock, STATUS_TEXT } from './progress';
import { RunPaymentPanel } from '../billing/RunPaymentPanel';

/** A clock that ticks each second while `on` (elapsed times between polls). */
function useNow(on: boolean) {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    if (!on) return;
    const t = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(t);
  }, [on]);
  return now;
}

function JobProgressRow(props: { job: RunJob; runStatus: RunDetail['status']; label: string; now: number }) {
  const { job } = props;
  const tone = job.status === 'succeeded' ? 'success' : job.status === 'failed' ? 'danger' : job.status === 'cancelled' ? 'muted' : 'ink';
  const fraction = job.status === 'succeeded' ? 1 : job.progress;
  return (
    <View style={styles.job} testID={`progress-${job.solver}`}>
      <View style={styles.jobHead}>
        <Body style={styles.jobLabel}>{props.label}</Body>
        {/* The figure never wraps ("100" over "%"): the label beside it gives way instead. */}
        <Small style={styles.figure} numberOfLines={1} testID={`percent-${job.solver}`}>{formatPercent(fraction)}</Small>
      </View>
      <ProgressBar fraction={fraction} label={`${props.label}: ${formatPercent(fraction)}`} tone={tone} />
      <Small testID={`status-${job.solver}`}>{jobStatusLine(job, props.runStatus, props.now)}</Small>
      {job.error ? <Small style={styles.error}>{job.error}</Small> : null}
    </View>
  );
}

/** Measures its width so SVG charts fill the column they sit in. */
function Measured(props: { children: (width: number) => React.ReactNode }) {
  const [w, setW] = useState(0);
  return <View onLayout={(e: LayoutChangeEvent) => setW(Math.round(e.nativeEvent.layout.width))}>{w > 0 ? props.children(w) : null}</View>;
}

/**
 * One run, live then finished: progress per solver, elapsed time, best value so far, the energy
 * chart, cancel; then the scorecard, the chosen answer on the network with region totals, the
 * variational samples and parameters, the cost operator on request, exports and the caution.
 */
export function RunView(props: { id: number; role: Role | null }) {
  const router = useRouter();
  const { width } = useWindowDimensions();
  const wide = width >= WIDE_BREAKPOINT;
  const run = useRunQuery(props.id);
  const version = useRunVersionQuery(run.data?.networkId, run.data?.versionId);
  const cancel = useRunCancelMutation();
  const retry = useRunRetryMutation();
  const live = isLive(run.data);
  const now = useNow(live);
  const traces = useLiveTraces(run.data);
  const [picked, setPicked] = useState<number | null>(null);
  const [chartJob, setChartJob] = useState<number | null>(null);
  const labels = useSolverLabels();
  const card = useMemo(() => (run.data ? buildScorecard(run.data, labels) : null), [run.data, labels]);
  const large = useMemo(() => (run.data && card ? largeComparison(run.data, card.bound, labels) : null), [run.data, card, labels]);

  if (run.isPending) return <Screen title={`Run ${props.id}`}><Body>Loading the run…</Body></Screen>;
  if (run.isError) {
    return (
      <Screen title={`Run ${props.id}`}>
        <EmptyState title="Run not found" message="This run does not exist in your current organisation, or it was deleted. Links to runs open only for members of the organisation that made them.">
          <Button label="All runs" onPress={() => router.push('/runs')} />
        </EmptyState>
      </Screen>
    );
  }
  const r: RunDetail = run.data;
  const label = (job: RunJob) => solverLabelOf(labels, job);
  const sense = senseOf(r.problem.kind);
  const valueName = r.problem.kind === 'maxcut' ? 'Cut weight' : 'Crossing weight';
  const finishedAny = r.jobs.some((j) => j.status === 'succeeded');
  const selectedId = picked ?? card?.bestJobId ?? null;
  const selected = r.jobs.find((j) => j.id === selectedId && j.result);
  const variational = r.jobs.filter((j) => (j.family === 'variational' || j.solver === 'qaoa' || j.solver === 'vqe') && (traces[j.id]?.length ?? 0) > 0);
  const chartFor = variational.find((j) => j.id === chartJob) ?? variational[0];
  const mayCancel = can(props.role, 'runs:cancel') && live;
  const mayRetry = can(props.role, 'runs:start') && !live && r.jobs.some((j) => j.status === 'failed' || j.status === 'cancelled');

  const progress = (
    <Card testID="run-progress">
      <View style={styles.jobHead}>
        <Heading>{live ? 'Progress' : 'Solvers'}</Heading>
        <Small testID="run-elapsed">{runClock(r, live, now)}</Small>
      </View>
      {r.jobs.map((j) => (
        <JobProgressRow key={j.id} job={j} runStatus={r.status} label={label(j)} now={now} />
      ))}
      {mayCancel ? <Button label="Cancel run" tone="danger" onPress={() => cancel.mutate(r.id)} busy={cancel.isPending} testID="cancel-run" /> : null}
      {mayRetry ? <Button label="Retry failed or cancelled solvers" tone="secondary" onPress={() => retry.mutate(r.id)} busy={retry.isPending} /> : null}
      {live ? <Small>You can leave this page; the run continues and this view catches up when you come back.</Small> : null}
    </Card>
  );

  const chart = chartFor ? (
    <Card testID="convergence-card">
      <Heading>Energy convergence</Heading>
      {variational.length > 1 ? <Segmented label="Solver" options={variational.map((j) => j.id)} value={chartFor.id} onChange={setChartJob} format={(id) => label(r.jobs.find((j) => j.id === id)!)} /> : null}
      <Measured>{(w) => <ConvergenceChart trace={traces[chartFor.id]} width={w} title={label(chartFor)} restarts={typeof chartFor.settings?.restarts === 'number' ? chartFor.settings.restarts : undefined} />}</Measured>
    </Card>
  ) : null;

  const variationalDetail = selected?.result && (selected.result.samples?.length || selected.result.params?.length) ? (
    <Card testID="variational-detail">
      <Heading>{label(selected)}: samples and parameters</Heading>
      {selected.result.samples?.length ? <Measured>{(w) => <SampleHistogram samples={selected.result!.samples!} sense={sense} width={w} />}</Measured> : null}
      {selected.result.params?.length ? (
        <View testID="final-params">
          <Label>Final parameters</Label>
          {/* Each name stays with its value: the list wraps between pairs, never inside one. */}
          <View style={styles.params}>
            {parameterNames(selected.solver, selected.result.params.length).map((name, i) => (
              <Body key={name} style={[styles.mono, styles.param]} numberOfLines={1} testID="param">{`${name}\u00a0=\u00a0${selected.result!.params![i].toFixed(4)}`}</Body>
            ))}
          </View>
          {selected.result.expectation !== null ? <Small>Expected {valueName.toLowerCase()} at these parameters: {formatValue(selected.result.expectation)}.</Small> : null}
        </View>
      ) : null}
    </Card>
  ) : null;

  const partition = selected?.result && version.data ? (
    <Card>
      <PartitionView document={version.data.document} problem={r.problem} assignment={selected.result.assignment} title={`Answer of ${label(selected)}${selected.id === card?.bestJobId ? ' (best)' : ''}`} />
    </Card>
  ) : null;

  return (
    <Screen
      title={`Run ${r.id}`}
      subtitle={`${questionLabel(r.problem)} · ${r.networkName ?? `network ${r.networkId}`}${version.data ? ` · version ${version.data.number}` : ''} · ${STATUS_TEXT[r.status] ?? r.status}`}
      actions={can(props.role, 'runs:compare') && !live ? <Button label="Compare with…" tone="secondary" onPress={() => router.push(`/runs?compare=${r.id}`)} testID="compare-from-run" /> : null}
    >
      <RunPaymentPanel runId={r.id} role={props.role} awaiting={r.status === 'awaiting_payment'} />
      {finishedAny ? <DecisionSupportNote /> : null}
      {finishedAny && card ? (
        <Card>
          <Heading>Scorecard</Heading>
          <Scorecard card={card} valueName={valueName} wide={wide} selectedJobId={selectedId} onSelect={setPicked} />
          <Small>Tap a solver to draw its answer on the network.</Small>
        </Card>
      ) : null}
      {finishedAny && large ? <Card><LargeComparison comparison={large} valueName={valueName} wide={wide} runId={r.id} /></Card> : null}
      {finishedAny ? <LargeSolverPanels run={r} document={version.data?.document} labelOf={label} wide={wide} /> : null}
      {wide && (partition || variationalDetail) ? (
        <View style={styles.columns}>
          <View style={styles.colWide}>{partition}{variationalDetail}</View>
          <View style={styles.col}>{progress}{chart}</View>
        </View>
      ) : wide ? (
        <View style={styles.columns}>
          <View style={styles.col}>{progress}</View>
          <View style={styles.col}>{chart}</View>
        </View>
      ) : live || !finishedAny ? (
        <>
          {progress}
          {chart}
          {partition}
          {variationalDetail}
        </>
      ) : (
        // Finished, on a phone: the answer first, how it was reached after.
        <>
          {partition}
          {variationalDetail}
          {chart}
          {progress}
        </>
      )}
      {selected?.result?.circuit ? <CircuitPanel runId={r.id} job={selected} result={selected.result} role={props.role} wide={wide} valueName={valueName} /> : null}
      {finishedAny && version.data ? <OperatorInspector run={r} document={version.data.document} /> : null}
      <ExportBar runId={r.id} finished={finishedAny} />
    </Screen>
  );
}

const styles = StyleSheet.create({
  job: { gap: space.xs, paddingVertical: space.xs },
  jobHead: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline', gap: space.sm },
  jobLabel: { flexShrink: 1 },
  figure: { flexShrink: 0 },
  error: { color: colors.danger },
  columns: { flexDirection: 'row', gap: space.lg, alignItems: 'flex-start' },
  colWide: { flex: 3, gap: space.lg },
  col: { flex: 2, gap: space.lg },
  mono: { fontFamily: 'monospace', fontSize: 13 },
  params: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg, rowGap: space.xs },
  param: { flexShrink: 0 },
});
