// A field's stored zone versions, each downloadable as GeoJSON and KML, the current one also as sprayer files
// (ISO 11783-10 task data, shapefile) and ready for a notice.
import { Link } from 'react-router';
import { Panel } from '../../../components/page-frame.tsx';
import { AreaText } from '../../../components/area-text.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { MACHINE_FILE_CAUTION } from '@shared/notices/cautions.ts';
import { useZoneSets, zoneSetExportUrl } from '../../../lib/api/get-zone-sets.ts';
import { useDates } from '../../../lib/dates.ts';

const statusWords = { draft: 'Draft', accepted: 'Current', superseded: 'Replaced' } as const;

export function ZoneVersionsPanel({ fieldId, pestId }: { fieldId: string; pestId: string | null }) {
  const dates = useDates();
  const sets = useZoneSets(fieldId);
  const shown = (sets.data ?? []).filter((s) => !pestId || s.pestId === pestId);
  return (
    <Panel title="Accepted versions">
      {sets.isPending ? (
        <LoadingState label="Loading versions…" />
      ) : sets.isError ? (
        <ErrorState error={sets.error} onRetry={() => sets.refetch()} />
      ) : shown.length === 0 ? (
        <EmptyState title="No accepted zones yet">Accept the zones on the map to store them as version 1.</EmptyState>
      ) : (
        <ul className="divide-y divide-straw-200" aria-label="Zone versions">
          {shown.map((s) => (
            <li key={s.id} className="flex flex-wrap items-baseline justify-between gap-2 py-2 text-sm">
              <div>
                <p className="font-medium text-soil-900">
                  {s.pestName} · version {s.version}{' '}
                  <span
                    className={`ml-1 rounded-full px-2 py-0.5 text-xs ${s.status === 'accepted' ? 'bg-field-100 text-field-800' : 'bg-straw-100 text-soil-700'}`}
                  >
                    {statusWords[s.status]}
                  </span>
                </p>
                <p className="text-soil-600">
                  {s.zoneCount} zone{s.zoneCount === 1 ? '' : 's'}, <AreaText m2={s.totalTreatedM2} /> treated · accepted{' '}
                  {s.acceptedAt ? dates.dateTime(s.acceptedAt) : '—'} by {s.createdBy.name}
                </p>
              </div>
              <div className="flex flex-wrap gap-3">
                <a className="font-medium text-field-700 hover:underline" href={zoneSetExportUrl(s.id, 'geojson')} download>
                  GeoJSON
                </a>
                <a className="font-medium text-field-700 hover:underline" href={zoneSetExportUrl(s.id, 'kml')} download>
                  KML
                </a>
                {s.status === 'accepted' && (
                  <>
                    <a className="font-medium text-field-700 hover:underline" href={zoneSetExportUrl(s.id, 'taskdata.zip')} download>
                      Task data (ISO 11783-10)
                    </a>
                    <a className="font-medium text-field-700 hover:underline" href={zoneSetExportUrl(s.id, 'shp.zip')} download>
                      Shapefile
                    </a>
                  </>
                )}
                {s.status === 'accepted' && (
                  <Link className="font-medium text-patch-700 hover:underline" to={`/fields/${fieldId}/notices/new?zoneSetId=${s.id}`}>
                    Write the notice
                  </Link>
                )}
              </div>
            </li>
          ))}
        </ul>
      )}
      {shown.some((s) => s.status === 'accepted') && <p className="mt-2 text-xs text-soil-700">Sprayer files: {MACHINE_FILE_CAUTION}</p>}
    </Panel>
  );
}
