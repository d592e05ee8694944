import { z } from 'zod';

/**
 * Circuit resources, device time and noise of variational jobs (docs/runs.md): the shapes the API
 * returns (OpenAPI responses) and the analyst's request to recompute them with other assumptions.
 * The engine's types (shared/engine/circuits) are checked against these in tests.
 */
export const LayoutSchema = z.enum(['all', 'line', 'grid']);

export const LayoutResourcesSchema = z.object({
  oneQubitGates: z.number().int(),
  twoQubitGates: z.number().int(),
  twoQubitDepth: z.number().int().describe('steps when only two-qubit gates take a step'),
  depth: z.number().int().describe('steps of the as-soon-as-possible schedule, every gate one step'),
  swaps: z.number().int().describe('swaps routing inserted (merged with an interaction or alone)'),
});

export const CircuitSummarySchema = z.object({
  qubits: z.number().int(),
  layouts: z.object({ all: LayoutResourcesSchema, line: LayoutResourcesSchema, grid: LayoutResourcesSchema }),
}).describe('Gate counts of the circuit on an all-to-all device, a line and a square grid (swap-network routing)');

const seconds = z.number().min(0).max(3600);
const probability = z.number().min(0).max(1);
export const DeviceAssumptionsSchema = z.object({
  oneQubitGateSeconds: seconds,
  twoQubitGateSeconds: seconds,
  readoutSeconds: seconds,
  shotOverheadSeconds: seconds.describe('reset and control latency per shot'),
  oneQubitError: probability.describe('depolarizing parameter per one-qubit gate'),
  twoQubitError: probability.describe('depolarizing parameter per two-qubit gate'),
  readoutError: probability.describe('probability that a read-out bit is flipped'),
}).strict();

const LayoutTimeSchema = z.object({ circuitSeconds: z.number(), shotSeconds: z.number(), estimateSeconds: z.number(), runSeconds: z.number() });
export const DeviceTimeSchema = z.object({
  shotsPerSetting: z.number().int(),
  settings: z.number().int().describe('measurement settings per estimate (qubit-wise commuting groups)'),
  estimates: z.number().int(),
  readoutShots: z.number().int(),
  assumptions: DeviceAssumptionsSchema,
  layouts: z.object({ all: LayoutTimeSchema, line: LayoutTimeSchema, grid: LayoutTimeSchema }),
});

const ratio = z.number().nullable().describe('expected value / bound (max-cut) or bound / expected value (splits)');
export const NoiseReportSchema = z.object({
  layout: LayoutSchema,
  assumptions: DeviceAssumptionsSchema,
  noiseless: z.object({ energy: z.number(), expectation: z.number(), ratio }),
  depolarizing: z.object({ fidelity: z.number().describe('∏(1 − ε) over the routed gates'), energy: z.number(), expectation: z.number(), ratio }),
  trajectories: z.object({
    count: z.number().int(), shots: z.number().int(),
    energy: z.number(), energyStdError: z.number(),
    expectation: z.number(), expectationStdError: z.number(), ratio,
    best: z.object({ assignment: z.array(z.number().int()), value: z.number(), feasible: z.boolean() }).nullable().describe('best sampled answer under noise'),
  }).nullable(),
  reference: z.object({ value: z.number(), what: z.string() }).nullable(),
});

export const CircuitJobQuerySchema = z.object({ job: z.coerce.number().int().positive().optional().describe('job id (default: the first variational job with a result)') });

export const QasmQuerySchema = CircuitJobQuerySchema.extend({
  version: z.enum(['2', '3']).default('3').describe('OpenQASM version'),
  layout: LayoutSchema.default('all'),
  form: z.enum(['bound', 'parameterised']).default('bound'),
});

export const DeviceBodySchema = z.object({
  job: z.number().int().positive().optional(),
  assumptions: DeviceAssumptionsSchema.partial().default({}).describe('figures replacing the published defaults'),
  noiseLayout: LayoutSchema.default('line'),
}).strict();
export type DeviceBody = z.infer<typeof DeviceBodySchema>;

export const DeviceAnswerSchema = z.object({
  job: z.number().int(),
  solver: z.string(),
  circuit: CircuitSummarySchema,
  deviceTime: DeviceTimeSchema,
  noise: NoiseReportSchema.describe('depolarizing estimate under these assumptions (trajectories only in runs started with noise: true)'),
  defaults: z.record(z.string(), z.object({ value: z.number(), unit: z.string(), label: z.string(), source: z.string() })).describe('the default assumptions and their sources'),
});
