// The adviser's field review: map, sightings, the pattern check with its evidence, its robustness,
// the threshold status and the season — for one field, pest and date window (kept in the address).
import { stopsSummary } from '@shared/units/stops-summary.ts';
import { lazy, Suspense, useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router';
import { useQueryClient } from '@tanstack/react-query';
import type { CheckSummary, CheckView } from '@shared/schemas/checks.ts';
import { PageFrame, Panel } from '../../../components/page-frame.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { AreaText } from '../../../components/area-text.tsx';
import { useField } from '../../../lib/api/get-field.ts';
import { usePests } from '../../../lib/api/get-pests.ts';
import { useSightings } from '../../../lib/api/get-sightings.ts';
import { useCheck } from '../../../lib/api/get-check.ts';
import { fieldChecksQueryKey, useFieldChecks } from '../../../lib/api/get-field-checks.ts';
import { CheckPanel } from './check-panel.tsx';
import { CheckEvidence } from './check-evidence.tsx';
import { defaultDraft, optionsFromDraft, type CheckOptionsDraft } from '../check-options-draft.ts';
import { ReviewToolbar, type ReviewWindow } from './review-toolbar.tsx';
import { SensitivityStrip } from './sensitivity-strip.tsx';
import { ThresholdStatusPanel } from './threshold-status-panel.tsx';
import { FieldHistoryPanel } from './field-history-panel.tsx';
import { PastChecksPanel } from './past-checks-panel.tsx';
import { CheckComparison } from './check-comparison.tsx';
import { inRunOrder } from '../check-comparison.ts';
import { SightingsTable } from './sightings-table.tsx';
import type { TableFilters } from './sightings-table-filters.tsx';

// Leaflet and the map layers load on their own, so the table and figures do not wait for them.
const ReviewMap = lazy(async () => ({ default: (await import('./review-map.tsx')).ReviewMap }));

/** The review's address parameters, leaving out the empty ones. */
function addressParams(values: Record<string, string | null | undefined>) {
  return new URLSearchParams(Object.entries(values).filter((e): e is [string, string] => Boolean(e[1])));
}

export function reviewPath(fieldId: string, params: { pest?: string; from?: string | null; to?: string | null; check?: string; compare?: string } = {}) {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) if (value) search.set(key, value);
  const text = search.toString();
  return `/fields/${fieldId}/review${text ? `?${text}` : ''}`;
}

export function FieldReviewPage() {
  const { fieldId = '' } = useParams();
  const [params, setParams] = useSearchParams();
  const field = useField(fieldId);
  const pests = usePests(false);
  const from = params.get('from') ?? undefined;
  const to = params.get('to') ?? undefined;
  const checkId = params.get('check');
  const sightings = useSightings({ fieldId, from, to, status: 'placed' });
  const check = useCheck(checkId);
  const comparedId = params.get('compare');
  const fieldChecks = useFieldChecks(fieldId);
  const queryClient = useQueryClient();
  const [draft, setDraft] = useState<CheckOptionsDraft>(defaultDraft);
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const mapRef = useRef<HTMLDivElement>(null);
  // "Show on map" from the table far below: select the sighting and bring the map into view.
  const showOnMap = (sightingId: string) => {
    setSelectedId(sightingId);
    mapRef.current?.scrollIntoView({ behavior: 'smooth', block: 'center' });
  };

  // Without a chosen pest, review the one with the most found sightings here.
  const pestId = useMemo(() => {
    const chosen = params.get('pest');
    if (chosen) return chosen;
    if (check.data) return check.data.pestId;
    const tally = new Map<string, number>();
    for (const s of sightings.data ?? []) if (!s.isEmptyStop) tally.set(s.pestId, (tally.get(s.pestId) ?? 0) + 1);
    return [...tally.entries()].sort((a, b) => b[1] - a[1])[0]?.[0];
  }, [params, check.data, sightings.data]);

  // Arriving without a check in the address opens the field's latest stored one (of the chosen pest, when
  // one is chosen), once: a window the adviser picks afterwards starts from a blank form.
  const arrivedWithoutCheck = useRef(!checkId);
  useEffect(() => {
    if (!arrivedWithoutCheck.current || !fieldChecks.data) return;
    arrivedWithoutCheck.current = false;
    const chosenPest = params.get('pest');
    // A window in the address is the adviser's choice: only a check of exactly that window opens then.
    const chosenWindow = params.has('from') || params.has('to');
    const latest = fieldChecks.data.find(
      (c) =>
        c.status !== 'failed' && (!chosenPest || c.pestId === chosenPest) && (!chosenWindow || (c.from === params.get('from') && c.to === params.get('to'))),
    );
    if (!latest || params.get('check')) return;
    setParams(addressParams({ pest: latest.pestId, from: latest.from, to: latest.to, check: latest.id }), { replace: true });
  }, [fieldChecks.data, params, setParams]);

  // A check that finishes while open shows its verdict in the list of past checks too.
  const openedStatus = check.data?.status;
  const lastStatus = useRef(openedStatus);
  useEffect(() => {
    const was = lastStatus.current;
    lastStatus.current = openedStatus;
    if (openedStatus === 'done' && (was === 'queued' || was === 'running')) void queryClient.invalidateQueries({ queryKey: fieldChecksQueryKey(fieldId) });
  }, [openedStatus, fieldId, queryClient]);

  const [tableFilters, setTableFilters] = useState<TableFilters>({});
  useEffect(() => setTableFilters((f) => ({ ...f, pestId })), [pestId]);

  const changeWindow = (next: ReviewWindow) => setParams(addressParams({ pest: next.pestId, from: next.from, to: next.to }));
  const openCheck = useCallback(
    (opened: CheckView) =>
      setParams((p) => {
        p.set('check', opened.id);
        return p;
      }),
    [setParams],
  );

  const compareTwo = (first: CheckSummary, second: CheckSummary) => {
    const [earlier, later] = inRunOrder(first, second);
    setParams(addressParams({ pest: later.pestId, from: later.from, to: later.to, check: later.id, compare: earlier.id }));
  };
  const compared = useMemo(() => {
    const rows = fieldChecks.data ?? [];
    const a = rows.find((c) => c.id === checkId);
    const b = rows.find((c) => c.id === comparedId);
    return a && b && a.id !== b.id ? inRunOrder(a, b) : null;
  }, [fieldChecks.data, checkId, comparedId]);

  const pestSightings = useMemo(() => (sightings.data ?? []).filter((s) => s.pestId === pestId), [sightings.data, pestId]);
  const window = pestId ? { fieldId, pestId, from, to } : null;
  const built = optionsFromDraft(draft);
  const request = window && built.ok ? { ...window, options: { ...built.options } } : null;
  const result = check.data?.status === 'done' && check.data.result && check.data.pestId === pestId ? check.data.result : null;

  if (field.isPending || pests.isPending)
    return (
      <PageFrame title="Field review">
        <LoadingState label="Loading the field…" />
      </PageFrame>
    );
  if (field.isError)
    return (
      <PageFrame title="Field review">
        <ErrorState error={field.error} onRetry={() => field.refetch()} />
      </PageFrame>
    );
  if (pests.isError)
    return (
      <PageFrame title="Field review">
        <ErrorState error={pests.error} onRetry={() => pests.refetch()} />
      </PageFrame>
    );

  const f = field.data;
  const pestName = pests.data.find((p) => p.id === pestId)?.name ?? 'this pest';
  const found = pestSightings.filter((s) => !s.isEmptyStop).length;
  const summary = sightings.isPending ? 'Loading sightings…' : stopsSummary(found, pestSightings.length - found, pestName);

  return (
    <PageFrame
      title={`${f.name} — review`}
      eyebrow={
        <>
          {f.farmName} · {f.crop} {f.season} · <AreaText m2={f.areaM2} />
        </>
      }
      actions={
        <Link to={`/fields/${f.id}`} className="text-sm font-medium text-field-700 underline-offset-2 hover:underline">
          Field details
        </Link>
      }
      wide
    >
      <ReviewToolbar pests={pests.data} crop={f.crop} window={{ pestId, from, to }} onChange={changeWindow} summary={summary} />
      <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_27rem]">
        <div ref={mapRef} data-review-map-frame>
          <Panel>
            {sightings.isError ? (
              <ErrorState error={sightings.error} onRetry={() => sightings.refetch()} />
            ) : (
              <Suspense
                fallback={
                  <div className="flex h-[40rem] items-center justify-center rounded-lg bg-straw-100">
                    <LoadingState label="Loading the map…" />
                  </div>
                }
              >
                <ReviewMap
                  field={f}
                  sightings={pestSightings}
                  result={result}
                  checkId={result ? (check.data?.id ?? null) : null}
                  selectedId={selectedId}
                  onSelect={setSelectedId}
                />
              </Suspense>
            )}
          </Panel>
        </div>
        <CheckPanel window={window} draft={draft} onDraftChange={setDraft} check={check} onCheckOpened={openCheck} />
      </div>
      {compared && (
        <CheckComparison
          field={f}
          earlier={compared[0]}
          later={compared[1]}
          closeHref={reviewPath(fieldId, { pest: pestId, from, to, check: checkId ?? undefined })}
        />
      )}
      <PastChecksPanel
        checks={fieldChecks}
        openedId={checkId}
        comparedId={comparedId}
        openHref={(c) => reviewPath(fieldId, { pest: c.pestId, from: c.from, to: c.to, check: c.id })}
        onCompare={compareTwo}
      />
      {result && check.data && (
        <CheckEvidence
          result={result}
          checkId={check.data.id}
          sightings={sightings.data ?? []}
          zoneEditorPath={`/fields/${f.id}/zones?checkId=${check.data.id}`}
          onShowOnMap={showOnMap}
        />
      )}
      <SensitivityStrip key={`${pestId}-${from}-${to}`} request={request} />
      <ThresholdStatusPanel fieldId={fieldId} pestId={pestId} />
      <Panel title="Sightings">
        {sightings.isPending ? (
          <LoadingState label="Loading sightings…" />
        ) : sightings.isError ? (
          <ErrorState error={sightings.error} onRetry={() => sightings.refetch()} />
        ) : sightings.data.length === 0 ? (
          <EmptyState title="No sightings in this window">Scouts’ photos and empty stops appear here as soon as they are uploaded.</EmptyState>
        ) : (
          <SightingsTable
            fieldId={fieldId}
            fieldName={f.name}
            crop={f.crop}
            sightings={sightings.data}
            pests={pests.data}
            filters={tableFilters}
            onFiltersChange={setTableFilters}
            selectedId={selectedId}
            onShowOnMap={showOnMap}
          />
        )}
      </Panel>
      <FieldHistoryPanel fieldId={fieldId} pestId={pestId} />
    </PageFrame>
  );
}
