/**
 * The run screen's "on a real device" panel as pure functions (the component only draws):
 * resources table rows, device-time lines, the noise comparison and the download links.
 */
import type { JobResultView } from '../../shared/schemas/runs';

export type LayoutKey = 'all' | 'line' | 'grid';
export const LAYOUT_LABEL: Record<LayoutKey, string> = { all: 'All-to-all', line: 'Line', grid: 'Square grid' };
const LAYOUTS: LayoutKey[] = ['all', 'line', 'grid'];

export interface ResourceRow {
  layout: LayoutKey;
  label: string;
  oneQubitGates: number;
  twoQubitGates: number;
  twoQubitDepth: number;
  depth: number;
  swaps: number;
}

/** Column names of the resources table (first: the layout). */
export const RESOURCE_COLUMNS = ['Layout', 'One-qubit gates', 'Two-qubit gates', 'Two-qubit depth', 'Depth', 'Swaps'];

export function resourceRows(result: Pick<JobResultView, 'circuit'>): ResourceRow[] {
  const c = result.circuit;
  if (!c) return [];
  return LAYOUTS.map((l) => ({ layout: l, label: LAYOUT_LABEL[l], ...c.layouts[l] }));
}

/** Seconds in a readable unit (µs … days). */
export function formatDuration(s: number): string {
  if (!Number.isFinite(s)) return '—';
  if (s < 1e-6) return `${(s * 1e9).toPrecision(3)} ns`;
  if (s < 1e-3) return `${(s * 1e6).toPrecision(3)} µs`;
  if (s < 1) return `${(s * 1e3).toPrecision(3)} ms`;
  if (s < 120) return `${s.toPrecision(3)} s`;
  if (s < 7200) return `${(s / 60).toPrecision(3)} min`;
  if (s < 172800) return `${(s / 3600).toPrecision(3)} h`;
  return `${(s / 86400).toPrecision(3)} days`;
}

/** An assumed duration in the unit it is usually quoted in, without padding zeros: 25 ns, 1 µs, 100 µs. */
export function assumedDuration(s: number): string {
  const [scale, unit] = s < 1e-6 ? [1e9, 'ns'] : s < 1e-3 ? [1e6, 'µs'] : s < 1 ? [1e3, 'ms'] : [1, 's'];
  return `${Number((s * scale).toPrecision(4))} ${unit}`;
}

export interface DeviceTimeRow {
  layout: LayoutKey;
  label: string;
  circuit: string;
  estimate: string;
  run: string;
}

export function deviceTimeRows(deviceTime: NonNullable<JobResultView['deviceTime']>): DeviceTimeRow[] {
  return LAYOUTS.map((l) => {
    const t = deviceTime.layouts[l];
    return { layout: l, label: LAYOUT_LABEL[l], circuit: formatDuration(t.circuitSeconds), estimate: formatDuration(t.estimateSeconds), run: formatDuration(t.runSeconds) };
  });
}

/** One sentence on how the device time was counted, in plain words. */
export function deviceTimeRule(d: NonNullable<JobResultView['deviceTime']>): string {
  return `${d.settings} measurement setting × ${d.shotsPerSetting.toLocaleString('en-US')} shots per energy estimate, ${d.estimates.toLocaleString('en-US')} estimates and ${d.readoutShots.toLocaleString('en-US')} final read-out shots; each shot is the circuit plus read-out and reset.`;
}

export interface NoiseRow {
  key: 'noiseless' | 'depolarizing' | 'trajectories';
  label: string;
  expectation: string;
  ratio: string;
}

const fmt = (x: number) => (Number.isInteger(x) ? String(x) : x.toFixed(3));
const fmtRatio = (r: number | null) => (r === null ? '—' : r.toFixed(3));

export function noiseRows(noise: NonNullable<JobResultView['noise']>): NoiseRow[] {
  const rows: NoiseRow[] = [
    { key: 'noiseless', label: 'Noiseless (simulated)', expectation: fmt(noise.noiseless.expectation), ratio: fmtRatio(noise.noiseless.ratio) },
    { key: 'depolarizing', label: `Depolarizing estimate (fidelity ${(100 * noise.depolarizing.fidelity).toFixed(1)} %)`, expectation: fmt(noise.depolarizing.expectation), ratio: fmtRatio(noise.depolarizing.ratio) },
  ];
  const t = noise.trajectories;
  if (t) rows.push({ key: 'trajectories', label: `Noisy simulation (${t.count} trajectories)`, expectation: `${fmt(t.expectation)} ± ${t.expectationStdError.toPrecision(2)}`, ratio: fmtRatio(t.ratio) });
  return rows;
}

export interface QasmLink {
  href: string;
  fileName: string;
  label: string;
}

/** The downloads: OpenQASM 3 and 2.0, bound and parameterised, on the chosen layout. */
export function qasmLinks(runId: number, jobId: number, solver: string, layout: LayoutKey): QasmLink[] {
  const out: QasmLink[] = [];
  for (const version of ['3', '2'] as const) {
    for (const form of ['bound', 'parameterised'] as const) {
      const q = new URLSearchParams({ job: String(jobId), version, layout, form });
      out.push({
        href: `/api/runs/${runId}/circuit.qasm?${q.toString()}`,
        fileName: `run-${runId}-${solver}-${layout}-${form}-openqasm${version}.qasm`,
        label: `OpenQASM ${version === '3' ? '3' : '2.0'}, ${form === 'bound' ? 'optimised values' : 'parameterised'}`,
      });
    }
  }
  return out;
}
