// The grower's notice page, opened from the e-mailed link without signing in: what was found, where the zones
// are, what the adviser recommends, and the cautions. Calm on screen, clean on paper.
import { useEffect, useMemo, type ReactNode } from 'react';
import { useParams } from 'react-router';
import { NOTICE_CAUTIONS } from '@shared/notices/cautions.ts';
import { AreaText } from '../../../components/area-text.tsx';
import { Button } from '../../../components/button.tsx';
import { LoadingState } from '../../../components/query-states.tsx';
import { ApiError } from '../../../lib/api-client.ts';
import { useNoticeLink, type LinkedNotice } from '../api/get-notice-link.ts';
import { AcknowledgeBox } from './acknowledge-box.tsx';
import { NoticeLinkMap } from './notice-link-map.tsx';
import { NoticeZoneTable } from './notice-zone-table.tsx';

const longDate = (isoDay: string) => new Date(`${isoDay}T12:00:00`).toLocaleDateString(undefined, { dateStyle: 'long' });
const percent = new Intl.NumberFormat('en', { style: 'percent', maximumFractionDigits: 1 });

function Shell({ organisation, children }: { organisation?: string; children: ReactNode }) {
  return (
    <div className="min-h-screen bg-straw-50 print:bg-white">
      <header className="bg-field-800 text-white print:bg-white print:text-soil-900">
        <div className="mx-auto flex max-w-3xl items-center gap-2 px-4 py-3 sm:px-6">
          <span aria-hidden="true" className="inline-block h-5 w-5 rounded bg-field-400 ring-2 ring-patch-400 print:hidden" />
          <span className="text-lg font-semibold tracking-tight">Patchwise</span>
          {organisation && <span className="ml-auto text-sm text-field-100 print:text-soil-700">Zone notice from {organisation}</span>}
        </div>
      </header>
      <main id="main" className="mx-auto max-w-3xl space-y-6 px-4 py-6 sm:px-6 sm:py-8 print:max-w-none print:space-y-4 print:px-0 print:py-2">{children}</main>
    </div>
  );
}

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="rounded-lg bg-white p-4 shadow-sm ring-1 ring-soil-300/60 sm:p-5 print:break-inside-avoid print:p-0 print:shadow-none print:ring-0">
      <h2 className="mb-3 text-lg font-semibold text-field-900">{title}</h2>
      {children}
    </section>
  );
}

function LinkProblem({ error }: { error: unknown }) {
  const refused = error instanceof ApiError && error.status === 404;
  const busy = error instanceof ApiError && error.status === 429;
  return (
    <Shell>
      <section role="alert" className="rounded-lg bg-white p-6 shadow-sm ring-1 ring-soil-300/60">
        <h1 className="text-2xl font-semibold text-field-900">{refused ? 'This notice link does not open a notice' : busy ? 'Please wait a minute' : 'The notice could not be loaded'}</h1>
        {refused ? (
          <div className="mt-3 space-y-2 text-soil-800">
            <p>The link may have expired (links stay valid for a season’s re-scout), your adviser may have withdrawn it, or part of it may have been lost when it was copied.</p>
            <p>Nothing is wrong with your farm records. Ask your adviser to send the notice again, or open the link straight from the e-mail.</p>
          </div>
        ) : busy ? (
          <p className="mt-3 text-soil-800">This page was opened many times in a short while. Wait a minute, then reload it.</p>
        ) : (
          <p className="mt-3 text-soil-800">{error instanceof Error ? error.message : 'Try again in a minute.'}</p>
        )}
      </section>
    </Shell>
  );
}

function ZonesDownload({ notice }: { notice: LinkedNotice }) {
  const href = useMemo(() => URL.createObjectURL(new Blob([JSON.stringify(notice.zonesGeoJson)], { type: 'application/geo+json' })), [notice.zonesGeoJson]);
  useEffect(() => () => URL.revokeObjectURL(href), [href]);
  return (
    <a href={href} download={`${notice.fieldName} zones.geojson`} className="font-medium text-field-700 underline-offset-2 hover:underline print:hidden">
      Download the zones (GeoJSON)
    </a>
  );
}

export function PublicNoticePage() {
  const { token = '' } = useParams();
  const notice = useNoticeLink(token);
  useEffect(() => {
    document.title = notice.data ? `${notice.data.pestName} on ${notice.data.fieldName} · Zone notice` : 'Zone notice · Patchwise';
  }, [notice.data]);

  if (notice.isPending) return <Shell><LoadingState label="Opening your notice…" /></Shell>;
  if (notice.isError) return <LinkProblem error={notice.error} />;
  const n = notice.data;
  const treatedShare = 1 - n.untreatedShare;

  return (
    <Shell organisation={n.organisationName}>
      <header className="space-y-2">
        <p className="text-sm font-medium text-soil-600">Zone notice for {n.recipientName}{n.sentAt ? `, sent ${new Date(n.sentAt).toLocaleDateString(undefined, { dateStyle: 'long' })}` : ''}</p>
        <h1 className="text-2xl font-semibold tracking-tight text-field-900 sm:text-3xl">{n.pestName} on {n.fieldName}</h1>
        <p className="text-soil-800">
          Your adviser {n.adviserName} proposes treating {n.zones.length === 1 ? 'one zone' : `${n.zones.length} zones`} covering <AreaText m2={n.totalTreatedM2} /> ({percent.format(treatedShare)} of the field), and leaving the rest untreated.
        </p>
        <div className="flex flex-wrap gap-2 pt-1 print:hidden">
          <Button variant="secondary" onClick={() => window.print()}>Print</Button>
        </div>
      </header>

      <AcknowledgeBox token={token} acknowledgedAt={n.acknowledgedAt} />

      <Section title="The field">
        <dl className="grid gap-3 text-sm sm:grid-cols-2">
          <div><dt className="text-xs font-medium uppercase tracking-wide text-soil-600">Farm</dt><dd className="text-base text-soil-900">{n.farmName}</dd></div>
          <div><dt className="text-xs font-medium uppercase tracking-wide text-soil-600">Field</dt><dd className="text-base text-soil-900">{n.fieldName} (<AreaText m2={n.fieldAreaM2} />)</dd></div>
          <div><dt className="text-xs font-medium uppercase tracking-wide text-soil-600">Pest</dt><dd className="text-base text-soil-900">{n.pestName}</dd></div>
          <div><dt className="text-xs font-medium uppercase tracking-wide text-soil-600">Walked on</dt><dd className="text-base text-soil-900">{n.walkDates.length ? n.walkDates.map(longDate).join(', ') : 'No walk recorded'}</dd></div>
        </dl>
      </Section>

      <Section title="What the scouting found">
        <p className="text-soil-900" data-testid="verdict">{n.verdict.headline}</p>
        {n.verdict.figures.length > 0 && (
          <ul className="mt-2 list-disc space-y-1 pl-5 text-sm text-soil-700">
            {n.verdict.figures.map((figure) => <li key={figure}>{figure}</li>)}
          </ul>
        )}
      </Section>

      <Section title="Where the zones are">
        <NoticeLinkMap notice={n} boundary={n.boundary} />
        <div className="mt-4">
          <NoticeZoneTable zones={n.zones} totalTreatedM2={n.totalTreatedM2} untreatedShare={n.untreatedShare} />
        </div>
        <p className="mt-2 text-sm"><ZonesDownload notice={n} /></p>
      </Section>

      <Section title="What your adviser recommends">
        <p className="whitespace-pre-wrap text-soil-900">{n.recommendation}</p>
        {n.rescoutOn && <p className="mt-3 font-medium text-soil-900">Re-scout on {longDate(n.rescoutOn)}.</p>}
      </Section>

      <section aria-labelledby="cautions" className="rounded-lg border-l-4 border-straw-500 bg-white p-4 shadow-sm ring-1 ring-soil-300/60 sm:p-5 print:break-inside-avoid print:shadow-none">
        <h2 id="cautions" className="mb-2 text-lg font-semibold text-field-900">Before any treatment</h2>
        <ul className="list-disc space-y-1.5 pl-5 text-soil-900">
          {NOTICE_CAUTIONS.map((caution) => <li key={caution}>{caution}</li>)}
        </ul>
      </section>

      <footer className="border-t border-straw-300 pt-4 text-sm text-soil-700">
        From {n.adviserName}, {n.organisationName}. Questions about this notice go to your adviser; this page is read-only.
      </footer>
    </Shell>
  );
}
