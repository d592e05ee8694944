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
