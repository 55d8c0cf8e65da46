// Zones proposed by the engine from a finished check. A POST that changes nothing, so it is read as a query:
// each threshold/margin pair is cached, and the previous proposal stays on screen while the next one loads.
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import { checkQueryKey } from '../../../lib/api/get-check.ts';
import type { ZoneProposalRequest, ZoneProposalResponse } from '@shared/schemas/zones.ts';

export type ZoneProposal = ZoneProposalResponse['zones'];

export const proposeZones = (checkId: string, request: ZoneProposalRequest) =>
  api<ZoneProposalResponse>(`/api/checks/${checkId}/zone-proposal`, { method: 'POST', body: request }).then((r) => r.zones);
export const zoneProposalQueryOptions = (checkId: string, request: ZoneProposalRequest) =>
  queryOptions({ queryKey: [...checkQueryKey(checkId), 'zone-proposal', request], queryFn: () => proposeZones(checkId, request), staleTime: Infinity });
export const useZoneProposal = (checkId: string | null, request: ZoneProposalRequest) =>
  useQuery({ ...zoneProposalQueryOptions(checkId ?? '', request), enabled: Boolean(checkId), placeholderData: keepPreviousData });
