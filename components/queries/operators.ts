import { useMutation } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '../api/client';
import type { OperatorInspectBody, OperatorInspectionSchema, OperatorSolveAnswerSchema, OperatorSolveBody } from '../../shared/schemas/operators';

export type OperatorInspection = z.infer<typeof OperatorInspectionSchema>;
export type OperatorSolveAnswer = z.infer<typeof OperatorSolveAnswerSchema>;

/** Custom operators are computations, not stored resources: mutations with nothing to invalidate. */
export function useOperatorInspectMutation() {
  return useMutation({ mutationFn: (body: OperatorInspectBody) => api.post<OperatorInspection>('/operators/inspect', body) });
}

export function useOperatorSolveMutation() {
  return useMutation({ mutationFn: (body: Partial<OperatorSolveBody> & { text: string }) => api.post<OperatorSolveAnswer>('/operators/solve', body) });
}
