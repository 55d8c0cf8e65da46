// The grower's read-only home: their farms and fields, and the zone notices sent about them with their status.
import { Link } from 'react-router';
import type { GrowerNoticeSummary, RecipientState } from '@shared/schemas/notices.ts';
import { PageFrame, Panel } from '../../../components/page-frame.tsx';
import { AreaText } from '../../../components/area-text.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import type { FieldAnswer as Field } from '@shared/schemas/fields.ts';
import { useFarms } from '../../../lib/api/get-farms.ts';
import { useFields } from '../../../lib/api/get-fields.ts';
import { useGrowerNotices } from '../api/get-grower-notices.ts';
import { useDates } from '../../../lib/dates.ts';

const copyWords: Record<RecipientState, string> = {
  queued: 'On its way to you',
  sending: 'On its way to you',
  sent: 'In your mailbox, not opened yet',
  failed: 'Could not be delivered to you',
  opened: 'Opened, not acknowledged yet',
  acknowledged: 'Acknowledged',
};

function NoticeRow({ notice }: { notice: GrowerNoticeSummary }) {
  const dates = useDates();
  const copy = notice.myCopy;
  return (
    <li className="flex flex-wrap items-baseline justify-between gap-2 py-3">
      <div>
        <Link
          to={`/grower/notices/${notice.id}`}
          className="inline-flex min-h-10 items-center font-medium text-field-800 underline-offset-2 hover:underline focus-visible:outline focus-visible:outline-2 focus-visible:outline-field-600"
        >
          {notice.pestName} on {notice.fieldName}
        </Link>
        <p className="text-sm text-soil-700">
          {notice.farmName} · {notice.zoneCount} zone{notice.zoneCount === 1 ? '' : 's'}, <AreaText m2={notice.totalTreatedM2} /> · sent{' '}
          {notice.sentAt ? dates.date(notice.sentAt) : '—'}
        </p>
      </div>
      <p
        className={`rounded-full px-3 py-1 text-sm font-medium ${copy?.state === 'acknowledged' ? 'bg-field-100 text-field-800' : 'bg-straw-100 text-soil-800'}`}
        data-testid="grower-notice-state"
      >
        {copy ? copyWords[copy.state] : 'Sent to another contact of the farm'}
        {copy?.acknowledgedAt && ` on ${dates.date(copy.acknowledgedAt)}`}
      </p>
    </li>
  );
}

function FarmFields({ fields }: { fields: Field[] }) {
  if (fields.length === 0) return <p className="text-sm text-soil-600">No fields on this farm yet.</p>;
  return (
    <ul className="grid gap-3 sm:grid-cols-2">
      {fields.map((field) => (
        <li key={field.id}>
          <Link
            to={`/fields/${field.id}`}
            className="block rounded-xl bg-white p-4 shadow-sm ring-1 ring-soil-300/60 hover:ring-field-500 focus-visible:outline focus-visible:outline-2 focus-visible:outline-field-600"
          >
            <span className="block text-lg font-semibold text-field-900">{field.name}</span>
            <span className="mt-0.5 block text-sm text-soil-700">
              {field.crop} {field.season}
            </span>
            <AreaText m2={field.areaM2} className="mt-1 block text-sm" />
          </Link>
        </li>
      ))}
    </ul>
  );
}

export function GrowerHome() {
  const farms = useFarms();
  const fields = useFields();
  const notices = useGrowerNotices();
  return (
    <PageFrame title="My farms" eyebrow="Your farms, fields and the notices your adviser sent">
      <Panel title="Zone notices">
        {notices.isPending ? (
          <LoadingState label="Loading your notices…" />
        ) : notices.isError ? (
          <ErrorState error={notices.error} onRetry={() => notices.refetch()} />
        ) : notices.data.length === 0 ? (
          <EmptyState title="No notices yet">When your adviser sends a zone notice about one of your fields, it shows here and arrives by e-mail.</EmptyState>
        ) : (
          <>
            <ul className="divide-y divide-straw-200" aria-label="Zone notices">
              {notices.data.map((n) => (
                <NoticeRow key={n.id} notice={n} />
              ))}
            </ul>
            <p className="mt-2 text-sm text-soil-600">Open a notice to see the map, the recommendation and the cautions, and to acknowledge it.</p>
          </>
        )}
      </Panel>
      {farms.isPending || fields.isPending ? (
        <LoadingState label="Loading your farms…" />
      ) : farms.isError || fields.isError ? (
        <ErrorState error={farms.error ?? fields.error} onRetry={() => (farms.refetch(), fields.refetch())} />
      ) : farms.data.length === 0 ? (
        <EmptyState title="No farms linked to your account yet">Your adviser links your account to your farms; ask them if this stays empty.</EmptyState>
      ) : (
        [...farms.data]
          .sort((a, b) => a.name.localeCompare(b.name))
          .map((farm) => (
            <section key={farm.id} aria-labelledby={`farm-${farm.id}`}>
              <h2 id={`farm-${farm.id}`} className="mb-2 text-lg font-semibold text-soil-800">
                {farm.name}
              </h2>
              <FarmFields fields={fields.data.filter((f) => f.farmId === farm.id)} />
            </section>
          ))
      )}
    </PageFrame>
  );
}
