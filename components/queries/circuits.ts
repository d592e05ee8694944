import { useMutation } from '@tanstack/react-query';
import type { z } from 'zod';
import { api } from '../api/client';
import type { DeviceAnswerSchema, DeviceBody } from '../../shared/schemas/circuits';

export type DeviceAnswer = z.infer<typeof DeviceAnswerSchema>;

/**
 * Device time and the depolarizing estimate of one variational job under an analyst's assumptions
 * (POST /api/runs/:id/device). A computation, not a stored resource: nothing to invalidate.
 */
export function useDeviceRecomputeMutation(runId: number) {
  return useMutation({
    mutationFn: (body: Partial<DeviceBody>) => api.post<DeviceAnswer>(`/runs/${runId}/device`, body),
  });
}
