import { z } from 'zod';
import { CircuitSummarySchema, DeviceTimeSchema, NoiseReportSchema } from './circuits';

/**
 * The answer of GET /api/runs/:id for the OpenAPI document: the main fields, every job's result
 * with its circuit, device time and noise blocks; other fields are allowed (loose objects).
 * The TypeScript types are RunView / JobView / JobResultView in ./runs.ts.
 */
export const JobResultViewSchema = z.looseObject({
  value: z.number(),
  assignment: z.array(z.number().int()),
  bound: z.number().nullable(),
  gap: z.number().nullable(),
  energy: z.number().nullable(),
  expectation: z.number().nullable(),
  params: z.array(z.number()).nullable(),
  seconds: z.number(),
  evaluations: z.number().int(),
  shots: z.number().int(),
  provenOptimal: z.boolean(),
  infeasible: z.boolean().optional(),
  circuit: CircuitSummarySchema.optional().describe('variational jobs: qubits and gate counts per layout'),
  deviceTime: DeviceTimeSchema.optional().describe('variational jobs: time on a device under the default assumptions'),
  noise: NoiseReportSchema.optional().describe('variational jobs started with the setting noise: true'),
});

export const RunViewSchema = z.looseObject({
  id: z.number().int(),
  status: z.string(),
  jobs: z.array(z.looseObject({
    id: z.number().int(),
    solver: z.string(),
    status: z.string(),
    settings: z.record(z.string(), z.unknown()),
    result: JobResultViewSchema.nullable(),
    error: z.string().nullable(),
  })),
});

/**
 * The answer of POST /api/runs/preview for the OpenAPI document (server/services/runs/preview.ts;
 * the app's type is RunPreview in components/runs/types.ts). Loose: other fields are allowed.
 */
export const RunPreviewSchema = z.looseObject({
  depots: z.number().int(),
  lanes: z.number().int(),
  encoding: z.looseObject({
    qubits: z.number().int(), pauliTerms: z.number().int(), commutingGroups: z.number().int(), shots: z.number().int(),
    largestTerms: z.array(z.object({ qubits: z.array(z.number().int()), coeff: z.number() })).describe('the largest terms by |coefficient| (at most 40): a product of Z on the listed qubits'),
  }).nullable()
    .describe('the cost operator of the widest circuit a chosen solver simulates'),
  circuit: z.string().describe('which circuit the encoding summary describes, in words'),
  encodingNote: z.string().nullable(),
  blockers: z.array(z.string()).describe('every reason the run would not start; empty = startable'),
  startable: z.boolean(),
  solvers: z.array(z.looseObject({
    solver: z.string(),
    refusal: z.string().nullable(),
    allowed: z.boolean(),
    qubits: z.number().int(),
    circuit: CircuitSummarySchema.nullable().describe('QAOA/VQE: the circuit this entry will run, counted as its finished run reports it (null: classical, several circuits, or refused)'),
    circuitNote: z.string().nullable().describe('why no circuit is counted, when so'),
  })),
});
