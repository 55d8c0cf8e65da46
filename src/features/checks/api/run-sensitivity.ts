// POST /api/checks/sensitivity: the verdict across cell sizes and area bases. Nothing is stored, so
// nothing is invalidated; a mutation because the server runs a fresh computation each time.
import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { CheckRequestInput, SensitivityResponse } from '@shared/schemas/checks.ts';

export const runSensitivity = (request: CheckRequestInput) => api<SensitivityResponse>('/api/checks/sensitivity', { method: 'POST', body: request });

export const useRunSensitivity = () => useMutation({ mutationFn: runSensitivity });
