// The adviser's zone editor: the engine's proposal from a check, tuned by threshold and margin, edited or
// drawn by hand on the map, then accepted as the field's next stored version.
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { Link, useBlocker, useParams, useSearchParams } from 'react-router';
import { useQueryClient } from '@tanstack/react-query';
import { CircleMarker } from 'react-leaflet';
import type { ZoneProposalRequest } from '@shared/schemas/zones.ts';
import { PageFrame, Panel } from '../../../components/page-frame.tsx';
import { MapFrame } from '../../../components/map-frame.tsx';
import { AreaText } from '../../../components/area-text.tsx';
import { Button, ButtonLink } from '../../../components/button.tsx';
import { FormMessage, SelectField } from '../../../components/form-field.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import { useField } from '../../../lib/api/get-field.ts';
import { useCheck } from '../../../lib/api/get-check.ts';
import { useCheckSightingIds } from '../../../lib/api/get-check-parts.ts';
import { useZoneSet, zoneSetQueryOptions } from '../../../lib/api/get-zone-set.ts';
import { usePests } from '../../../lib/api/get-pests.ts';
import { useSightings } from '../../../lib/api/get-sightings.ts';
import { useZoneProposal, type ZoneProposal } from '../api/propose-zones.ts';
import { useCreateZoneSet } from '../api/create-zone-set.ts';
import { ProposalControls } from './proposal-controls.tsx';
import { NewProposalChoice } from './new-proposal-choice.tsx';
import { ZoneEditLayer, type ZoneEditHandlers } from './zone-edit-layer.tsx';
import { ZoneTable } from './zone-table.tsx';
import { ZoneVersionsPanel } from './zone-versions-panel.tsx';
import { LeaveWithoutAccepting, useWarnBeforeUnload } from './leave-without-accepting.tsx';
import {
  addDrawnZone,
  countedStops,
  foundSightingPoints,
  removeZone,
  reshapeZone,
  treatedAreaM2,
  zoneFigures,
  zonesForAcceptance,
  zonesFromProposal,
  zonesFromStored,
  zoneStanding,
  type WorkingZone,
} from '../working-zones.ts';

const percent = new Intl.NumberFormat('en', { style: 'percent', maximumFractionDigits: 1 });

export function ZoneEditorPage() {
  const { fieldId = '' } = useParams();
  const [search] = useSearchParams();
  const checkId = search.get('checkId');
  const openedSetId = search.get('zoneSet');
  const openedSet = useZoneSet(openedSetId);
  const queryClient = useQueryClient();
  const field = useField(fieldId);
  const check = useCheck(checkId);
  const checkSightingIds = useCheckSightingIds(checkId);
  const pests = usePests(false);
  const [chosenPestId, setChosenPestId] = useState('');
  const pestId = check.data?.pestId ?? openedSet.data?.pestId ?? (checkId ? null : chosenPestId || null);
  const pest = pests.data?.find((p) => p.id === pestId) ?? null;
  const sightings = useSightings({ fieldId, pestId: pestId ?? undefined, status: 'placed' }, Boolean(pestId));

  const [request, setRequest] = useState<ZoneProposalRequest>({ source: 'density' });
  const onRequest = useCallback((next: ZoneProposalRequest) => setRequest(next), []);
  const checkDone = check.data?.status === 'done';
  const proposal = useZoneProposal(checkDone ? checkId : null, request);

  const [zones, setZones] = useState<WorkingZone[]>([]);
  const [revision, setRevision] = useState(0);
  // The map's handlers are made once; they read the zones of the latest render through this ref.
  const zonesNow = useRef(zones);
  zonesNow.current = zones;
  const replaceZones = useCallback((next: WorkingZone[]) => {
    setZones(next);
    setRevision((r) => r + 1);
  }, []);
  // A new proposal replaces the zones while they are the engine's own; after a hand edit it waits for the
  // adviser's choice, so a threshold nudge never throws away their work.
  const handEdited = useRef(false);
  const [waitingProposal, setWaitingProposal] = useState<ZoneProposal | null>(null);
  // Edits on the map or in the table that no Accept has stored yet: leaving asks first.
  const [unaccepted, setUnaccepted] = useState(false);
  const markHandEdited = () => {
    handEdited.current = true;
    setUnaccepted(true);
  };
  const blocker = useBlocker(({ currentLocation, nextLocation }) => unaccepted && currentLocation.pathname !== nextLocation.pathname);
  useWarnBeforeUnload(unaccepted);
  // A stored version opened by its link shows as stored; a proposal then waits for the adviser's choice.
  const shownSetId = useRef<string | null>(null);
  const showStored = useCallback(
    (set: { id: string; zones: Parameters<typeof zonesFromStored>[0]['zones'] }) => {
      shownSetId.current = set.id;
      handEdited.current = true;
      setUnaccepted(false);
      setWaitingProposal(null);
      replaceZones(zonesFromStored(set));
    },
    [replaceZones],
  );
  useEffect(() => {
    if (openedSet.data && shownSetId.current !== openedSet.data.id) showStored(openedSet.data);
  }, [openedSet.data, showStored]);
  const takeProposal = useCallback(
    (next: ZoneProposal) => {
      handEdited.current = false;
      setWaitingProposal(null);
      replaceZones(zonesFromProposal(next));
    },
    [replaceZones],
  );
  useEffect(() => {
    if (!proposal.data || proposal.isPlaceholderData) return;
    if (handEdited.current) setWaitingProposal(proposal.data);
    else takeProposal(proposal.data);
  }, [proposal.data, proposal.isPlaceholderData, takeProposal]);

  const handlers = useMemo<ZoneEditHandlers>(
    () => ({
      onReshape: (key, geometry) => {
        handEdited.current = true;
        setUnaccepted(true);
        setZones((all) => reshapeZone(all, key, geometry));
      },
      onRemove: (key) => {
        handEdited.current = true;
        setUnaccepted(true);
        setZones((all) => removeZone(all, key));
      },
      onDraw: (geometry) => {
        handEdited.current = true;
        setUnaccepted(true);
        replaceZones(addDrawnZone(zonesNow.current, geometry));
      },
    }),
    [replaceZones],
  );

  const points = useMemo(() => foundSightingPoints(sightings.data ?? [], checkSightingIds.data ?? null), [sightings.data, checkSightingIds.data]);
  const stops = useMemo(() => countedStops(sightings.data ?? [], checkSightingIds.data ?? null), [sightings.data, checkSightingIds.data]);

  const accept = useCreateZoneSet();
  const fieldAreaM2 = field.data?.areaM2 ?? 0;
  const rows = zones.map((zone) => ({
    zone,
    figures: zoneFigures(zone, fieldAreaM2, points),
    standing: zoneStanding(zone, stops, pest ?? { actionThreshold: Number.POSITIVE_INFINITY, thresholdBasis: 'mean' }),
  }));
  const treated = treatedAreaM2(
    zones,
    rows.map((r) => r.figures),
  );

  if (field.isPending || (checkId && check.isPending))
    return (
      <PageFrame title="Treatment zones">
        <LoadingState label="Loading the field and its check…" />
      </PageFrame>
    );
  if (field.isError)
    return (
      <PageFrame title="Treatment zones">
        <ErrorState error={field.error} onRetry={() => field.refetch()} />
      </PageFrame>
    );
  if (check.isError)
    return (
      <PageFrame title="Treatment zones">
        <ErrorState error={check.error} onRetry={() => check.refetch()} />
      </PageFrame>
    );

  const f = field.data;
  const onAccept = () => {
    if (!pestId) return;
    accept.mutate(
      { fieldId, pestId, ...(checkId ? { checkId } : {}), zones: zonesForAcceptance(zones) },
      {
        // Show what the server stored (clipped to the field, slivers dropped), read back rather than assumed.
        onSuccess: async ({ zoneSet }) => {
          setUnaccepted(false);
          showStored(await queryClient.fetchQuery({ ...zoneSetQueryOptions(zoneSet.id), staleTime: 0 }));
        },
      },
    );
  };

  return (
    <PageFrame
      title={`Treatment zones · ${f.name}`}
      eyebrow={
        <>
          <Link to={`/fields/${f.id}`} className="hover:underline">
            {f.farmName} · {f.name}
          </Link>
          {pest && <> · {pest.name}</>}
        </>
      }
      wide
    >
      <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="space-y-3">
          <MapFrame boundaries={[{ id: f.id, geometry: f.boundary, label: f.name }]} label={`Treatment zones on ${f.name}`} className="h-[26rem] sm:h-[34rem]">
            {points.map(([lon, lat], i) => (
              <CircleMarker
                key={i}
                center={[lat, lon]}
                radius={3.5}
                pmIgnore
                interactive={false}
                pathOptions={{ color: '#241e19', weight: 1, fillColor: '#352d25', fillOpacity: 0.9 }}
              />
            ))}
            <ZoneEditLayer zones={zones} revision={revision} handlers={handlers} />
          </MapFrame>
          <p className="text-sm text-soil-600">
            Use the tools on the map: draw a polygon or rectangle for a zone by hand, switch on vertex editing to move a zone’s corners, drag a zone, or remove
            one. Dots are sightings where the pest was found. Without a mouse, shape the proposal with its threshold and margin and delete zones in the table
            below.
          </p>
        </div>

        <div className="space-y-5">
          {checkId ? (
            <Panel title="Proposal from the check">
              {check.data?.status !== 'done' ? (
                <FormMessage>This check has not finished ({check.data?.status}); zones can be proposed once its result is in.</FormMessage>
              ) : (
                <div className="space-y-3">
                  <ProposalControls proposal={proposal.data} countUnit={pest?.countUnit ?? null} onChange={onRequest} />
                  {proposal.isFetching && (
                    <p role="status" className="text-sm text-soil-600">
                      Updating the proposal…
                    </p>
                  )}
                  {proposal.isError && <FormMessage>{errorMessage(proposal.error)}</FormMessage>}
                  {proposal.data && (
                    <p className="text-sm text-soil-700">
                      {proposal.data.note} Changing these proposes again; once you have edited zones by hand, you choose whether to take the new proposal.
                    </p>
                  )}
                  {waitingProposal && (
                    <NewProposalChoice
                      zoneCount={waitingProposal.features.length}
                      onTake={() => takeProposal(waitingProposal)}
                      onKeep={() => setWaitingProposal(null)}
                    />
                  )}
                </div>
              )}
            </Panel>
          ) : (
            <Panel title="Zones drawn by hand">
              <SelectField label="Pest" value={chosenPestId} onChange={(e) => setChosenPestId(e.target.value)} hint="The pest these zones are for.">
                <option value="">Choose a pest…</option>
                {(pests.data ?? [])
                  .filter((p) => p.active)
                  .map((p) => (
                    <option key={p.id} value={p.id}>
                      {p.name}
                    </option>
                  ))}
              </SelectField>
            </Panel>
          )}

          <Panel title="Treated area">
            <dl className="grid grid-cols-2 gap-3 text-sm">
              <div>
                <dt className="text-xs font-medium uppercase tracking-wide text-soil-600">Total treated</dt>
                <dd className="mt-0.5 text-base text-soil-900" data-testid="total-treated">
                  <AreaText m2={treated} />
                </dd>
              </div>
              <div>
                <dt className="text-xs font-medium uppercase tracking-wide text-soil-600">Left untreated</dt>
                <dd className="mt-0.5 text-base text-soil-900">
                  {fieldAreaM2 > 0 ? percent.format(Math.max(0, 1 - treated / fieldAreaM2)) : '—'} of the field
                </dd>
              </div>
            </dl>
            {rows.some((r) => !r.figures.fromEngine) && (
              <p className="mt-2 text-xs text-patch-700">
                Edited and hand-drawn zones are measured in the browser; the stored version is measured again on the server when you accept.
              </p>
            )}
            <div className="mt-4 space-y-2">
              <Button onClick={onAccept} busy={accept.isPending} disabled={zones.length === 0 || !pestId}>
                Accept zones
              </Button>
              {accept.isError && <FormMessage>{errorMessage(accept.error)}</FormMessage>}
              {accept.isSuccess && (
                <FormMessage tone="success">
                  Stored as version {accept.data.zoneSet.version} ({accept.data.zoneSet.zones.length} zone{accept.data.zoneSet.zones.length === 1 ? '' : 's'},{' '}
                  <AreaText m2={accept.data.zoneSet.totalTreatedM2} /> treated).
                  {accept.data.adjustments?.map((a) => (
                    <span key={a} className="block">
                      {a}
                    </span>
                  ))}
                </FormMessage>
              )}
              {accept.isSuccess && (
                <ButtonLink to={`/fields/${fieldId}/notices/new?zoneSetId=${accept.data.zoneSet.id}${checkId ? `&checkId=${checkId}` : ''}`}>
                  Write the notice
                </ButtonLink>
              )}
            </div>
          </Panel>
        </div>
      </div>

      <Panel title="Zones">
        {zones.length === 0 ? (
          <EmptyState title="No zones yet">
            {checkId
              ? 'Nothing in this field is above the threshold; lower it, or draw a zone by hand on the map.'
              : 'Choose the pest, then draw a zone on the map.'}
          </EmptyState>
        ) : (
          <ZoneTable
            rows={rows}
            threshold={pest ? { actionThreshold: pest.actionThreshold, thresholdBasis: pest.thresholdBasis, countUnit: pest.countUnit } : null}
            onDelete={(key) => {
              markHandEdited();
              replaceZones(removeZone(zones, key));
            }}
          />
        )}
      </Panel>

      <ZoneVersionsPanel fieldId={fieldId} pestId={pestId} />
      {blocker.state === 'blocked' && <LeaveWithoutAccepting onStay={() => blocker.reset()} onLeave={() => blocker.proceed()} />}
    </PageFrame>
  );
}
