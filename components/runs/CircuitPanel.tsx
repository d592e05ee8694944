import { useState } from 'react';
import { Platform, StyleSheet, Text, View } from 'react-native';
import { DEVICE_DEFAULTS, type DeviceAssumptions } from '../../shared/engine/circuits/device';
import { can, type Role } from '../../shared/permissions';
import { useDeviceRecomputeMutation } from '../queries/circuits';
import { colors, space, TOUCH } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { TextField } from '../ui/TextField';
import { Body, Heading, Label, Small } from '../ui/Text';
import { assumedDuration, deviceTimeRows, deviceTimeRule, LAYOUT_LABEL, noiseRows, qasmLinks, type LayoutKey } from './circuit-view';
import { ResourceTable, Row } from './ResourceTable';
import { Segmented } from './controls';
import type { RunJob } from './types';

type Result = NonNullable<RunJob['result']>;

function DownloadLink(props: { href: string; fileName: string; label: string; testID?: string }) {
  const linkProps = Platform.OS === 'web' ? { href: props.href, hrefAttrs: { download: props.fileName, rel: 'noopener' } } : {};
  return <Text accessibilityRole="link" style={styles.link} testID={props.testID} {...(linkProps as object)}>{props.label}</Text>;
}

const FIELDS = Object.keys(DEVICE_DEFAULTS) as (keyof DeviceAssumptions)[];
const shown = (key: keyof DeviceAssumptions, v: number) => (DEVICE_DEFAULTS[key].unit === 's' ? String(v * 1e9) : String(v));
const parsed = (key: keyof DeviceAssumptions, text: string) => (DEVICE_DEFAULTS[key].unit === 's' ? Number(text) * 1e-9 : Number(text));

/**
 * "On a real device": circuit resources per qubit layout, time on a device, the noise comparison
 * and the OpenQASM downloads of one variational job; analysts may replace the device assumptions.
 */
export function CircuitPanel(props: { runId: number; job: RunJob; result: Result; role: Role | null; wide: boolean; valueName: string }) {
  const [layout, setLayout] = useState<LayoutKey>('line');
  const [editing, setEditing] = useState(false);
  const [draft, setDraft] = useState<Record<string, string>>({});
  const recompute = useDeviceRecomputeMutation(props.runId);
  const mine = recompute.data && recompute.data.job === props.job.id ? recompute.data : null;
  const deviceTime = mine?.deviceTime ?? props.result.deviceTime;
  const noise = props.result.noise ?? mine?.noise;
  const assumptions = deviceTime?.assumptions;
  const analyst = can(props.role, 'runs:advanced');
  const submit = () => {
    const changed: Partial<DeviceAssumptions> = {};
    for (const k of FIELDS) if (draft[k] !== undefined && draft[k] !== '') changed[k] = parsed(k, draft[k]);
    recompute.mutate({ job: props.job.id, assumptions: changed, noiseLayout: noise?.layout ?? 'line' });
  };
  const timeNames = ['Layout', 'Circuit', 'One energy estimate', 'Whole run'];
  const noiseNames = ['', `Expected ${props.valueName.toLowerCase()}`, 'Approximation ratio'];
  return (
    <Card testID="circuit-panel">
      <Heading>On a real device</Heading>
      <Small>What this circuit would need on quantum hardware, counted by stated rules (docs: runs, "Circuit resources"). Estimates for planning, not quotes: decision support.</Small>
      <Label>Circuit resources · {props.result.circuit!.qubits} qubits</Label>
      <ResourceTable circuit={props.result.circuit!} wide={props.wide} testID="circuit-resources" rowID={(l) => `resources-${l}`} />
      {deviceTime ? (
        <View testID="device-time">
          <Label>Time on a device{mine ? ' (your assumptions)' : ''}</Label>
          <Row head wide={props.wide} names={timeNames} cells={timeNames} />
          {deviceTimeRows(deviceTime).map((r) => <Row key={r.layout} wide={props.wide} names={timeNames} testID={`time-${r.layout}`} cells={[r.label, r.circuit, r.estimate, r.run]} />)}
          <Small>{deviceTimeRule(deviceTime)}</Small>
          {assumptions ? (
            <Small testID="assumptions">
              Assumed: {FIELDS.map((k) => `${DEVICE_DEFAULTS[k].label} ${DEVICE_DEFAULTS[k].unit === 's' ? assumedDuration(assumptions[k]) : `${Number((100 * assumptions[k]).toPrecision(3))} %`}`).join('; ')}. Defaults: {DEVICE_DEFAULTS.twoQubitError.source.replace(/^Pauli error [^,]+, /, '')}; read-out and reset times are assumptions.
            </Small>
          ) : null}
        </View>
      ) : null}
      {noise ? (
        <View testID="noise-comparison">
          <Label>Noise · {LAYOUT_LABEL[noise.layout]} layout{props.result.noise ? '' : ' (your assumptions)'}</Label>
          <Row head wide={props.wide} names={noiseNames} cells={noiseNames} />
          {noiseRows(noise).map((r) => <Row key={r.key} wide={props.wide} names={noiseNames} testID={`noise-${r.key}`} cells={[r.label, r.expectation, r.ratio]} />)}
          {noise.trajectories?.best ? (
            <Small testID="noisy-best">Best answer sampled under noise: {props.valueName.toLowerCase()} {noise.trajectories.best.value}{noise.trajectories.best.feasible ? '' : ' (breaks the balance rule)'}.</Small>
          ) : null}
          {noise.reference ? <Small>Ratios against {noise.reference.what} ({noise.reference.value}).</Small> : null}
        </View>
      ) : (
        <Small>No noise comparison: start the run with the advanced setting "noise" (analysts), or recompute below.</Small>
      )}
      {analyst ? (
        editing ? (
          <View style={styles.form} testID="assumptions-form">
            {FIELDS.map((k) => (
              <TextField key={k} label={`${DEVICE_DEFAULTS[k].label} (${DEVICE_DEFAULTS[k].unit === 's' ? 'ns' : 'probability'})`} hint={DEVICE_DEFAULTS[k].source}
                value={draft[k] ?? shown(k, assumptions?.[k] ?? DEVICE_DEFAULTS[k].value)} onChangeText={(v) => setDraft({ ...draft, [k]: v })} keyboardType="numeric" testID={`assume-${k}`} />
            ))}
            <View style={styles.buttons}>
              <Button label={recompute.isPending ? 'Recomputing…' : 'Recompute'} onPress={submit} disabled={recompute.isPending} testID="recompute-device" />
              <Button label="Close" tone="secondary" onPress={() => setEditing(false)} />
            </View>
            {recompute.isError ? <Notice tone="error">{recompute.error.message}</Notice> : null}
          </View>
        ) : <Button label="Change device assumptions" tone="secondary" onPress={() => setEditing(true)} testID="edit-assumptions" />
      ) : null}
      <View testID="qasm-downloads">
        <Label>OpenQASM</Label>
        <Segmented label="Qubit layout" options={['all', 'line', 'grid'] as const} value={layout} onChange={setLayout} format={(l) => LAYOUT_LABEL[l]} />
        <View style={styles.links}>
          {qasmLinks(props.runId, props.job.id, props.job.solver, layout).map((l, i) => <DownloadLink key={l.href} {...l} testID={`qasm-${i}`} />)}
        </View>
        <Body style={styles.note}>Routed files state the final qubit order in a comment; the read-out writes qubit j of the operator into bit j.</Body>
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  form: { gap: space.sm },
  buttons: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' },
  links: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  link: { minHeight: TOUCH, paddingVertical: space.sm, color: colors.ink, textDecorationLine: 'underline' },
  note: { fontSize: 13 },
});
