// The scout's start page: the fields assigned to them, the one they stand in and the nearest first, past seasons
// folded away, and a way to upload without choosing one.
import { Link } from 'react-router';
import type { FieldAnswer } from '@shared/schemas/fields.ts';
import { PageFrame } from '../../../components/page-frame.tsx';
import { ButtonLink } from '../../../components/button.tsx';
import { AreaText } from '../../../components/area-text.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { useFields } from '../../../lib/api/get-fields.ts';
import { useWatchedPosition } from '../../../lib/use-watched-position.ts';
import { orderFieldsForScout, type PlacedField } from '../field-order.ts';
import { scoutPaths } from '../paths.ts';
import { useKeepForNoSignal } from '../hooks/use-keep-for-no-signal.ts';
import { useWalksOfDays } from '../../../lib/api/get-walks.ts';
import { useSignedInUser } from '../../../lib/auth.ts';
import { useDates } from '../../../lib/dates.ts';
import { localToday } from '../../../lib/local-today.ts';

const distance = (m: number) => (m < 1000 ? `${Math.round(m)} m away` : `${(m / 1000).toFixed(1)} km away`);

/**
 * When the scout finished today's walk on each field, by field id. Today is the phone's calendar day, the day a walk
 * started on this phone is given, so only that day's walks are asked for.
 */
function useFinishedToday(): ReadonlyMap<string, string> {
  const me = useSignedInUser();
  const walks = useWalksOfDays({ walkedOn: localToday() });
  const finished = new Map<string, string>();
  for (const walk of walks.data ?? []) {
    if (walk.scoutId === me.id && walk.finishedAt) finished.set(walk.fieldId, walk.finishedAt);
  }
  return finished;
}

function FieldLink({ placed, finishedAt }: { placed: PlacedField; finishedAt?: string }) {
  const dates = useDates();
  const { field, inside, distanceM } = placed;
  return (
    <Link
      to={scoutPaths.field(field.id)}
      className={`block min-h-16 rounded-lg bg-white p-4 shadow-sm ring-1 hover:ring-field-600 focus-visible:outline focus-visible:outline-2 focus-visible:outline-field-600 ${inside ? 'ring-2 ring-field-700' : 'ring-soil-300/60'}`}
    >
      <span className="block text-lg font-semibold text-field-900">{field.name}</span>
      <span className="block text-sm text-soil-700">
        {field.farmName} · {field.crop} {field.season} · <AreaText m2={field.areaM2} />
        {distanceM !== null && ` · ${inside ? 'you are in it' : distance(distanceM)}`}
      </span>
      {finishedAt && (
        <span className="mt-1 block text-sm font-semibold text-field-800" data-field-finished>
          Finished at {dates.time(finishedAt)}
        </span>
      )}
    </Link>
  );
}

function FieldList({ fields, label }: { fields: PlacedField[]; label: string }) {
  const finishedToday = useFinishedToday();
  return (
    <ul className="space-y-3" aria-label={label}>
      {fields.map((placed) => (
        <li key={placed.field.id}>
          <FieldLink placed={placed} finishedAt={finishedToday.get(placed.field.id)} />
        </li>
      ))}
    </ul>
  );
}

function OrderedFields({ fields }: { fields: FieldAnswer[] }) {
  const watched = useWatchedPosition();
  const position = watched.kind === 'found' ? watched.position : null;
  const order = orderFieldsForScout(fields, position, new Date().getFullYear());
  return (
    <>
      <p className="text-base text-soil-800" role="status" aria-live="polite">
        {order.here
          ? `You are in ${order.here.name}.`
          : watched.kind === 'found'
            ? 'You are in none of your fields; the nearest comes first.'
            : watched.kind === 'unavailable'
              ? watched.message
              : 'Finding your position to put the nearest field first…'}
      </p>
      {order.current.length > 0 ? (
        <FieldList fields={order.current} label="Fields assigned to you" />
      ) : (
        <p className="text-soil-700">No field of this season.</p>
      )}
      {order.past.length > 0 && (
        <details className="rounded-lg bg-straw-50 p-3 ring-1 ring-straw-200">
          <summary className="min-h-12 cursor-pointer py-3 font-medium text-soil-900">Past seasons ({order.past.length})</summary>
          <FieldList fields={order.past} label="Fields of past seasons" />
        </details>
      )}
    </>
  );
}

export function MyFieldsPage() {
  const fields = useFields();
  useKeepForNoSignal(fields.data?.map((f) => f.id));
  return (
    <PageFrame title="Walk a field" eyebrow="Fields assigned to you">
      <ButtonLink to={scoutPaths.justUpload} size="lg" variant="secondary" className="w-full min-h-14 text-lg">
        Just upload: let Patchwise find the field
      </ButtonLink>
      {fields.isPending && <LoadingState />}
      {fields.isError && <ErrorState error={fields.error} onRetry={() => fields.refetch()} />}
      {fields.data?.length === 0 && (
        <EmptyState title="No fields assigned to you yet">Ask your adviser or admin to assign you the fields you scout.</EmptyState>
      )}
      {fields.data && fields.data.length > 0 && <OrderedFields fields={fields.data} />}
    </PageFrame>
  );
}
