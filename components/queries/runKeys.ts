import type { PreviewBody, RunProblem } from '../runs/types';

/** Query keys of the runs resource (runs.ts's hooks and the progress stream, useRunStream.ts). */
export const runKeys = {
  root: ['runs'] as const,
  lists: () => [...runKeys.root, 'list'] as const,
  list: (filters: { networkId?: number; status?: string }) => [...runKeys.lists(), filters] as const,
  detail: (id: number) => [...runKeys.root, 'detail', id] as const,
  solvers: () => [...runKeys.root, 'solvers'] as const,
  defaults: (versionId: number, problem: RunProblem) => [...runKeys.root, 'defaults', versionId, problem] as const,
  preview: (body: PreviewBody) => [...runKeys.root, 'preview', body] as const,
  version: (networkId: number, versionId: number) => [...runKeys.root, 'version', networkId, versionId] as const,
};
