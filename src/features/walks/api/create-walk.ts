import { api } from '../../../lib/api-client.ts';
import type { WalkCreateInput, WalkView } from '@shared/schemas/walks.ts';

export const createWalk = (input: WalkCreateInput, signal?: AbortSignal) => api<{ walk: WalkView }>('/api/walks', { method: 'POST', body: input, signal });
