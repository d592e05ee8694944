/**
 * The solve service's API for routes, tests and benchmarks (docs/runs-service.md). One concern per
 * module under runs/:
 * - planning.ts — checks, qubits, price and refusals, shared by create and preview;
 * - preview.ts  — what a run would be, nothing written;
 * - start.ts    — create a run, release a paid one to the queue;
 * - control.ts  — cancel, retry, delete;
 * - read.ts     — one run, the run list;
 * - export.ts   — assignment CSV, JSON report.
 * Billing is reached only through deps.runHooks (run-hooks.ts); billing itself imports runs/start.
 */
export type { RunActor } from './runs/planning';
export type { RunServiceDeps } from './runs/read';
export { getRun, listRuns } from './runs/read';
export { previewRun } from './runs/preview';
export { createRun, releaseRun } from './runs/start';
export { cancelRun, deleteRun, retryRun } from './runs/control';
export { assignmentCsv, runReport } from './runs/export';
