// Every zone notice of the organisation with each recipient's copy (on its way, sent, failed, opened, acknowledged),
// narrowed by farm, field, state and date; the filters live in the address so a filtered list can be shared.
import { Link, useSearchParams } from 'react-router';
import { noticeListStates, type NoticeListEntry, type NoticeListState } from '@shared/schemas/notices.ts';
import { PageFrame, Panel } from '../../../components/page-frame.tsx';
import { Button } from '../../../components/button.tsx';
import { SelectField, TextField } from '../../../components/form-field.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { useFarms } from '../../../lib/api/get-farms.ts';
import { useFields } from '../../../lib/api/get-fields.ts';
import { useNoticeOverview, type NoticeOverviewFilter } from '../api/get-notice-overview.ts';
import { RecipientStateBadge } from './recipient-state.tsx';
import { useDates } from '../../../lib/dates.ts';
import { useAppConfig } from '../../../lib/app-config.ts';
import { isCalendarDate } from '@shared/schemas/calendar-date.ts';
import { dayAfter, startOfDayIn } from '@shared/dates/start-of-day.ts';

const stateWords: Record<NoticeListState, string> = {
  'not-acknowledged': 'Someone has not acknowledged yet',
  acknowledged: 'Acknowledged by someone',
  opened: 'Opened, not acknowledged',
  accepted: 'Accepted by the mail server, not opened',
  'on-its-way': 'Still going out',
  failed: 'Not delivered',
  draft: 'Drafts, not sent',
};
const statusWords = { draft: 'Draft', sending: 'Sending', sent: 'Sent', 'partly-failed': 'Some copies failed' } as const;

const isDay = (text: string | null): text is string => !!text && isCalendarDate(text);

function NoticeRow({ notice }: { notice: NoticeListEntry }) {
  const dates = useDates();
  const dated = notice.sentAt ?? notice.createdAt;
  return (
    <tr data-notice={notice.id} className="align-top">
      <td className="px-3 py-2">
        <Link to={`/notices/${notice.id}`} className="font-medium text-field-700 hover:underline">
          {notice.pestName} · {notice.fieldName}
        </Link>
        <p className="text-soil-600">
          {notice.farmName} · zones version {notice.zoneSetVersion}
        </p>
      </td>
      <td className="whitespace-nowrap px-3 py-2 text-soil-700">
        {notice.sentAt ? 'Sent' : 'Written'} {dates.date(dated)}
      </td>
      <td className="px-3 py-2 text-soil-800">{statusWords[notice.status]}</td>
      <td className="px-3 py-2">
        {notice.recipients.length === 0 ? (
          <span className="text-soil-600">Not sent yet</span>
        ) : (
          <ul className="space-y-1" aria-label={`Recipients of the ${notice.pestName} notice for ${notice.fieldName}`}>
            {notice.recipients.map((r) => (
              <li key={r.id} data-recipient={r.email} className="flex flex-wrap items-center gap-2">
                <span className="text-soil-900">{r.name}</span>
                <span className="text-soil-600">{r.email}</span>
                <span data-testid="recipient-state">
                  <RecipientStateBadge state={r.state} />
                </span>
                {r.revokedAt && <span className="text-xs text-soil-600">link withdrawn</span>}
                {r.addedForNotice && <span className="text-xs text-soil-600">added for this notice</span>}
              </li>
            ))}
          </ul>
        )}
      </td>
    </tr>
  );
}

export function NoticesPage() {
  const [search, setSearch] = useSearchParams();
  const farmId = search.get('farm') ?? '';
  const fieldId = search.get('field') ?? '';
  const stateParam = search.get('state');
  const state = noticeListStates.find((s) => s === stateParam);
  const fromDay = search.get('from');
  const toDay = search.get('to');
  const farms = useFarms();
  const fields = useFields(farmId || undefined);
  // The days are the organisation's, whatever zone the reader's computer keeps: a filter by day waits for its zone.
  const { timeZone } = useDates().format;
  const config = useAppConfig();
  const zoneKnown = !config.isPending || !(isDay(fromDay) || isDay(toDay));

  const filter: NoticeOverviewFilter = {
    ...(farmId ? { farmId } : {}),
    ...(fieldId ? { fieldId } : {}),
    ...(state ? { state } : {}),
    ...(isDay(fromDay) ? { from: startOfDayIn(timeZone, fromDay) } : {}),
    ...(isDay(toDay) ? { before: startOfDayIn(timeZone, dayAfter(toDay)) } : {}),
  };
  const list = useNoticeOverview(filter, zoneKnown);

  const setParam = (key: string, value: string, alsoClear: string[] = []) =>
    setSearch(
      (now) => {
        const next = new URLSearchParams(now);
        if (value) next.set(key, value);
        else next.delete(key);
        for (const k of alsoClear) next.delete(k);
        return next;
      },
      { replace: true },
    );

  const notices = list.data?.pages.flatMap((p) => p.notices) ?? [];

  return (
    <PageFrame title="Notices" eyebrow="Every zone notice and who has read it" wide>
      <Panel title="Filter">
        <form className="grid gap-3 sm:grid-cols-2 lg:grid-cols-5" onSubmit={(e) => e.preventDefault()} aria-label="Filter the notices">
          <SelectField label="Farm" value={farmId} onChange={(e) => setParam('farm', e.target.value, ['field'])}>
            <option value="">All farms</option>
            {farms.data?.map((f) => (
              <option key={f.id} value={f.id}>
                {f.name}
              </option>
            ))}
          </SelectField>
          <SelectField label="Field" value={fieldId} onChange={(e) => setParam('field', e.target.value)}>
            <option value="">All fields</option>
            {fields.data?.map((f) => (
              <option key={f.id} value={f.id}>
                {f.name}
              </option>
            ))}
          </SelectField>
          <SelectField label="State" value={state ?? ''} onChange={(e) => setParam('state', e.target.value)}>
            <option value="">Any state</option>
            {noticeListStates.map((s) => (
              <option key={s} value={s}>
                {stateWords[s]}
              </option>
            ))}
          </SelectField>
          <TextField label="From" type="date" value={fromDay ?? ''} onChange={(e) => setParam('from', e.target.value)} />
          <TextField
            label="To"
            type="date"
            value={toDay ?? ''}
            onChange={(e) => setParam('to', e.target.value)}
            hint={`Sent on (a draft: written on), both days included, as days in the ${timeZone} time zone.`}
          />
        </form>
      </Panel>

      <Panel title="Notices">
        <p className="mb-3 text-sm text-soil-700">
          Each recipient’s copy: <em>queued</em> or <em>sending</em> while it goes out, <em>sent</em> once the mail server accepted it, <em>failed</em> when it
          could not be delivered after every retry, then <em>opened</em> and <em>acknowledged</em> as the grower reads the notice page.
        </p>
        {list.isPending ? (
          <LoadingState label="Loading the notices…" />
        ) : list.isError ? (
          <ErrorState error={list.error} onRetry={() => list.refetch()} />
        ) : notices.length === 0 ? (
          <EmptyState title="No notice matches">Change the filters above, or write a notice from a field’s accepted zones.</EmptyState>
        ) : (
          <>
            <div className="overflow-x-auto rounded-lg bg-white ring-1 ring-soil-300/60">
              <table className="min-w-full text-left text-sm">
                <caption className="sr-only">Zone notices</caption>
                <thead className="bg-straw-100 text-xs text-soil-700">
                  <tr>
                    <th scope="col" className="px-3 py-2">
                      Notice
                    </th>
                    <th scope="col" className="px-3 py-2">
                      Date
                    </th>
                    <th scope="col" className="px-3 py-2">
                      Status
                    </th>
                    <th scope="col" className="px-3 py-2">
                      Recipients
                    </th>
                  </tr>
                </thead>
                <tbody className="divide-y divide-straw-200">
                  {notices.map((n) => (
                    <NoticeRow key={n.id} notice={n} />
                  ))}
                </tbody>
              </table>
            </div>
            {list.hasNextPage && (
              <Button variant="secondary" className="mt-3" onClick={() => list.fetchNextPage()} busy={list.isFetchingNextPage}>
                Show more notices
              </Button>
            )}
          </>
        )}
      </Panel>
    </PageFrame>
  );
}
