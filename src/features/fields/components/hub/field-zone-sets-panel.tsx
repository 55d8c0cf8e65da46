// The field's current treatment zones (the accepted version per pest), each opening in the zone editor.
import { Link } from 'react-router';
import { zoneEditorPath } from '@shared/attention-links.ts';
import { Panel } from '../../../../components/page-frame.tsx';
import { ErrorState, LoadingState } from '../../../../components/query-states.tsx';
import { AreaText } from '../../../../components/area-text.tsx';
import { useZoneSets } from '../../../../lib/api/get-zone-sets.ts';

export function FieldZoneSetsPanel({ fieldId, canEdit }: { fieldId: string; canEdit: boolean }) {
  const zoneSets = useZoneSets(fieldId);
  if (zoneSets.isPending)
    return (
      <Panel title="Treatment zones">
        <LoadingState label="Loading zones…" />
      </Panel>
    );
  if (zoneSets.isError)
    return (
      <Panel title="Treatment zones">
        <ErrorState error={zoneSets.error} onRetry={() => zoneSets.refetch()} />
      </Panel>
    );
  // Newest first as the server lists them: the first accepted version of each pest is its current one.
  const current = zoneSets.data.filter((z, i, all) => z.status === 'accepted' && all.findIndex((o) => o.status === 'accepted' && o.pestId === z.pestId) === i);
  const older = zoneSets.data.length - current.length;
  return (
    <Panel title="Treatment zones">
      {current.length === 0 ? (
        <p className="text-sm text-soil-600">No accepted zones on this field.</p>
      ) : (
        <ul className="divide-y divide-straw-200 text-sm" aria-label="Current treatment zones">
          {current.map((z) => (
            <li key={z.id} className="space-y-0.5 py-2" data-zone-set={z.id}>
              {canEdit ? (
                <Link to={zoneEditorPath(fieldId, z.checkId, z.id)} className="font-medium text-field-700 underline-offset-2 hover:underline">
                  {z.pestName}, version {z.version}
                </Link>
              ) : (
                <span className="font-medium">
                  {z.pestName}, version {z.version}
                </span>
              )}
              <p className="text-soil-700">
                {z.zoneCount} zone{z.zoneCount === 1 ? '' : 's'}, <AreaText m2={z.totalTreatedM2} /> to treat
              </p>
            </li>
          ))}
        </ul>
      )}
      {older > 0 && (
        <p className="mt-2 text-xs text-soil-600">
          {older} draft or earlier version{older === 1 ? '' : 's'} kept{canEdit ? ' in the zone editor' : ''}.
        </p>
      )}
    </Panel>
  );
}
