import { useEffect, useMemo, useState } from 'react';
import { StyleSheet, View, useWindowDimensions } from 'react-native';
import { useRouter } from 'expo-router';
import { can, type Role } from '../../shared/permissions';
import { formatMoney } from '../../shared/plans';
import { OPTIMIZER_LABELS, OPTIMIZER_NAMES, type OptimizerName } from '../../shared/engine/variational/optimize';
import { useRunCreateMutation, useRunPreviewQuery, useRunVersionQuery, useSolverDefaultsQuery, useSolversQuery } from '../queries/runs';
import { colors, space, WIDE_BREAKPOINT } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { EmptyState } from '../ui/EmptyState';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Body, Heading, Small } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { CheckRow, ChoiceCard, ChoiceGroup, Segmented } from './controls';
import { EncodingSummary } from './EncodingSummary';
import { KIND_HINTS, KIND_LABELS } from './format';
import { PinPicker } from './PinPicker';
import { LargeProposal } from './LargeProposal';
import { largeProposal } from './large-solvers';
import { createBody, DEFAULT_ADVANCED, initialSetup, partsOf, problemOf, refusedChosen, startBlockers, type SetupState } from './setup';
import { fieldProblems, solverLine, typedProblems, type AdvancedField } from './setup-words';
import { REGION_CHOICES } from '../../shared/engine/problem/limits';
import type { ProblemKind } from '../../shared/engine/problem/types';

const KINDS: ProblemKind[] = ['maxcut', 'bisection', 'kway'];
const FAMILY_WORDS = { exact: 'Exact', bound: 'Bound', heuristic: 'Heuristic', variational: 'Quantum (simulated)' } as const;

/** Set up a run on one network version: the question in plain words, pins, solvers, then the encoding summary and launch. */
export function RunSetup(props: { networkId: number; versionId: number; role: Role | null }) {
  const router = useRouter();
  const { width } = useWindowDimensions();
  const wide = width >= WIDE_BREAKPOINT;
  const [s, setS] = useState<SetupState>(initialSetup);
  const [allSolvers, setAllSolvers] = useState(false);
  const set = (patch: Partial<SetupState>) => setS((prev) => ({ ...prev, ...patch }));
  const version = useRunVersionQuery(props.networkId, props.versionId);
  const solvers = useSolversQuery();
  const problem = useMemo(() => problemOf(s), [s]);
  const defaults = useSolverDefaultsQuery(props.versionId, problem);
  const create = useRunCreateMutation();
  const advancedAllowed = can(props.role, 'runs:advanced');
  const mayStart = can(props.role, 'runs:start');

  const offered = useMemo(() => (solvers.data ?? []).filter((x) => x.kinds.includes(s.kind)), [solvers.data, s.kind]);
  const families = useMemo(() => Object.fromEntries((solvers.data ?? []).map((x) => [x.name, x.family])), [solvers.data]);
  const chosen = useMemo(() => (s.solvers ?? defaults.data?.defaults ?? []).filter((n) => offered.some((o) => o.name === n)), [s.solvers, defaults.data, offered]);
  const body = useMemo(() => createBody(props.versionId, s, chosen, families), [props.versionId, s, chosen, families]);
  const precision = Number(s.precision);
  const preview = useRunPreviewQuery(chosen.length ? { ...body, ...(s.precision.trim() && precision > 0 ? { precision } : {}) } : null);

  // A new question starts from its own size-based defaults again.
  useEffect(() => set({ solvers: null }), [s.kind]);

  if (version.isPending || solvers.isPending) return <Screen title="New run"><Body>Loading the network…</Body></Screen>;
  if (version.isError) return <Screen title="New run"><EmptyState title="Network version not found" message={version.error.message}><Button label="Back to networks" onPress={() => router.push('/networks')} /></EmptyState></Screen>;
  const doc = version.data.document;
  const toggle = (name: string) => {
    const now = new Set(chosen);
    if (now.has(name)) now.delete(name);
    else now.add(name);
    set({ solvers: offered.map((o) => o.name).filter((n) => now.has(n)) });
  };
  // The API refuses the whole run when one chosen solver cannot take the problem: say which before the tap, and no price for a run that cannot start.
  const refused = refusedChosen(preview.data?.solvers ?? [], chosen);
  // Start follows the server's preview of exactly this body: any blocker (refusal, rights, plan size) keeps it disabled.
  const gate = startBlockers(preview.data, chosen, !!preview.data && !preview.isPlaceholderData && !preview.isFetching);
  const launch = () =>
    create.mutate(body, { onSuccess: (r) => router.push(`/runs/${r.id}`) });
  // What each solver said about this question (the API asked it), in one plain line: qubits it
  // would simulate, about how long, what it costs — or why it will not run.
  const answerOf = (name: string) => preview.data?.solvers.find((x) => x.solver === name);
  const solverHint = (name: string, guarantee: string) => {
    const position = chosen.indexOf(name);
    const line = chosen.includes(name) ? solverLine(answerOf(name), preview.data?.price, position >= 0 ? position + 1 : null) : null;
    const refusal = !line ? defaults.data?.solvers?.find((x) => x.name === name)?.refusal : null;
    return line ?? (refusal ? `Will not run here: ${refusal}` : guarantee);
  };
  // Settings problems as sentences on their fields: typed text that is no number (caught here),
  // then what the server's check of exactly this body found.
  const labelOf = (name: string) => offered.find((o) => o.name === name)?.label ?? name;
  const large = largeProposal(defaults.data?.solvers, defaults.data?.defaults, preview.data?.plan?.limits?.maxQubits);
  const problems = [...typedProblems(s.advanced), ...fieldProblems(preview.data?.fields, (i) => (body.solvers[i] ? labelOf(body.solvers[i].solver) : undefined))];
  const fieldError = (f: AdvancedField) => problems.find((p) => p.field === f)?.text;
  const rawFieldMessages = new Set(Object.values(preview.data?.fields ?? {}).flat());
  const reasons = [...problems.map((p) => p.text), ...gate.reasons.filter((r) => !rawFieldMessages.has(r))];
  const adv = s.advanced ?? DEFAULT_ADVANCED;
  const setAdv = (patch: Partial<typeof adv>) => set({ advanced: { ...adv, ...patch } });

  const question = (
    <Card>
      <Heading>What should the split do?</Heading>
      <ChoiceGroup style={styles.stack} label="Question">
        {KINDS.map((k) => (
          <ChoiceCard key={k} title={k === 'kway' ? `${KIND_LABELS.kway} (several regions)` : KIND_LABELS[k]} hint={KIND_HINTS[k]} selected={s.kind === k} onPress={() => set({ kind: k })} testID={`kind-${k}`} />
        ))}
      </ChoiceGroup>
      {s.kind === 'kway' ? <Segmented label="Number of regions k" options={REGION_CHOICES} value={s.k} onChange={(k) => set({ k })} testID="k-choice" /> : null}
      {s.kind !== 'maxcut' ? (
        <TextField label="Balance tolerance (% of total demand)" value={s.tolerancePercent} onChangeText={(t) => set({ tolerancePercent: t })} keyboardType="numeric" hint="0 = as even as possible; 5 = regions may differ by about 5 % of total demand." testID="tolerance" />
      ) : null}
    </Card>
  );

  const pins = (
    <Card>
      <Heading>Pinned depots (optional)</Heading>
      <PinPicker document={doc} kind={s.kind} parts={partsOf(s.kind, s.k)} pins={s.pins} onChange={(p) => set({ pins: p })} />
    </Card>
  );

  const solverCard = (
    <Card>
      <Heading>Solvers</Heading>
      <Small>
        {defaults.data
          ? `Chosen for ${defaults.data.depots} depots: exact when small enough, the strongest classical heuristic, and quantum solvers when the qubits each would simulate fit your plan.`
          : 'Choosing defaults for this size…'}
      </Small>
      {large ? <LargeProposal proposal={large} chosen={chosen} labelOf={labelOf} lineOf={(name) => solverLine(answerOf(name), preview.data?.price, chosen.indexOf(name) >= 0 ? chosen.indexOf(name) + 1 : null)} /> : null}
      {offered
        .filter((o) => allSolvers || chosen.includes(o.name) || defaults.data?.defaults.includes(o.name))
        .map((o) => (
          <CheckRow key={o.name} title={`${o.label} · ${FAMILY_WORDS[o.family]}`} hint={solverHint(o.name, o.guarantee)} checked={chosen.includes(o.name)} onPress={() => toggle(o.name)} testID={`solver-${o.name}`} />
        ))}
      <Button
        label={allSolvers ? 'Show only the suggested solvers' : `Show all ${offered.length} solvers`}
        tone="quiet"
        onPress={() => setAllSolvers((a) => !a)}
        testID="all-solvers"
      />
      {advancedAllowed ? (
        <Button label={s.advanced ? 'Hide advanced settings (back to defaults)' : 'Advanced settings'} tone="secondary" onPress={() => set({ advanced: s.advanced ? null : { ...DEFAULT_ADVANCED } })} testID="advanced-toggle" />
      ) : (
        <Small>Advanced solver settings are for analysts; defaults are used.</Small>
      )}
      {s.advanced ? (
        <View style={styles.stack} testID="advanced-panel">
          <TextField label="Circuit layers (QAOA p, VQE depth)" value={adv.layers} onChangeText={(t) => setAdv({ layers: t })} keyboardType="numeric" error={fieldError('layers')} testID="adv-layers" />
          <Segmented label="VQE ansatz" options={['ladder', 'alternating'] as const} value={adv.ansatz} onChange={(a) => setAdv({ ansatz: a })} />
          {fieldError('ansatz') ? <Small style={styles.error}>{fieldError('ansatz')}</Small> : null}
          <Segmented label="Optimizer" options={['auto', ...OPTIMIZER_NAMES] as string[]} value={adv.optimizer} onChange={(o) => setAdv({ optimizer: o })} />
          {fieldError('optimizer') ? <Small style={styles.error}>{fieldError('optimizer')}</Small> : null}
          <Small testID="optimizer-label">{adv.optimizer === 'auto' ? 'auto: SPSA with shots, else the Nelder–Mead simplex' : OPTIMIZER_LABELS[adv.optimizer as OptimizerName]}</Small>
          <TextField label="Shots per energy estimate (0 = exact expectation)" value={adv.shots} onChangeText={(t) => setAdv({ shots: t })} keyboardType="numeric" error={fieldError('shots')} testID="adv-shots" />
          <TextField label="Seed (blank = random)" value={adv.seed} onChangeText={(t) => setAdv({ seed: t })} keyboardType="numeric" error={fieldError('seed')} testID="adv-seed" />
          <TextField label="Time limit per solver (seconds)" value={adv.timeLimitSeconds} onChangeText={(t) => setAdv({ timeLimitSeconds: t })} keyboardType="numeric" error={fieldError('timeLimitSeconds')} testID="adv-time" />
          <CheckRow title="Noise comparison (QAOA, VQE)" hint="Adds the expected value under device noise on a line of qubits: a quick depolarizing estimate and, up to 20 qubits, a noisy simulation within the time limit again" checked={adv.noise} onPress={() => setAdv({ noise: !adv.noise })} testID="adv-noise" />
          {fieldError('noise') ? <Small style={styles.error}>{fieldError('noise')}</Small> : null}
        </View>
      ) : null}
    </Card>
  );

  const summary = (
    <View style={styles.stack}>
      {preview.data ? (
        <EncodingSummary preview={preview.data} solvers={solvers.data} chosen={chosen} wide={wide}>
          {preview.data.encoding ? (
            <TextField label="Precision for the shot estimate (standard error of the energy)" value={s.precision} onChangeText={(t) => set({ precision: t })} keyboardType="numeric" hint={`Blank = 1 % of total lane weight (${preview.data.encoding.precision}).`} testID="precision" />
          ) : null}
        </EncodingSummary>
      ) : null}
      {preview.isError ? <Notice tone="error">{preview.error.message}</Notice> : null}
      {!gate.pending && reasons.length > 0 ? (
        <Notice tone="error">
          <View style={styles.stack} testID="start-blockers">
            {reasons.map((r) => <Small key={r}>{r}</Small>)}
          </View>
        </Notice>
      ) : null}
      {preview.isFetching && !preview.data ? <Small>Building the encoding summary…</Small> : null}
      {create.isError ? <Notice tone="error">{create.error.message}</Notice> : null}
      {mayStart ? (
        <Button
          label={
            !chosen.length
              ? 'Choose at least one solver'
              : refused.length
                ? `Untick ${refused.join(' and ')} to start: ${refused.length > 1 ? 'they cannot' : 'it cannot'} take this problem`
                : reasons.length
                  ? `Cannot start: ${reasons[0].replace(/\.$/, '')}${reasons.length > 1 ? ` (and ${reasons.length - 1} more, above)` : ''}`
                  : gate.pending
                    ? 'Checking the run with the server…'
                    : `Start run with ${chosen.length} solver${chosen.length > 1 ? 's' : ''}${preview.data?.price ? ` · ${preview.data.price.label ?? formatMoney(preview.data.price)}, pay next` : ''}`
          }
          onPress={launch} busy={create.isPending} disabled={chosen.length === 0 || refused.length > 0 || gate.pending || reasons.length > 0} testID="start-run" />
      ) : (
        <Notice>Your role can read runs but not start them. Ask a dispatcher or analyst.</Notice>
      )}
    </View>
  );

  return (
    <Screen title="New run" subtitle={`${version.data.document.name ?? 'Network'} · version ${version.data.number} · ${doc.depots.length} depots, ${doc.lanes.length} lanes`}>
      {wide ? (
        <View style={styles.columns}>
          <View style={styles.col}>{question}{pins}</View>
          <View style={styles.col}>{solverCard}{summary}</View>
        </View>
      ) : (
        <>
          {mayStart ? (
            <Small testID="setup-hint">Suggested settings are filled in: check the question, then scroll to “Start run” at the bottom.</Small>
          ) : null}
          {question}
          {pins}
          {solverCard}
          {summary}
        </>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  stack: { gap: space.sm },
  columns: { flexDirection: 'row', gap: space.lg, alignItems: 'flex-start' },
  col: { flex: 1, gap: space.lg },
  error: { color: colors.danger },
});
