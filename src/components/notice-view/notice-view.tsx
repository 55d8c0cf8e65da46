// One zone notice as the grower reads it: what was found, where the zones are, what the adviser recommends, and
// the cautions. Shared by the e-mailed link's page and the signed-in grower's; calm on screen, clean on paper.
import { useEffect, useMemo, type ReactNode } from 'react';
import { MACHINE_FILE_CAUTION, NOTICE_CAUTIONS } from '@shared/notices/cautions.ts';
import type { NoticeLinkResponse } from '@shared/schemas/notices.ts';
import { AreaText } from '../area-text.tsx';
import { Button } from '../button.tsx';
import { AcknowledgeBox, type AcknowledgeControl } from './acknowledge-box.tsx';
import { NoticeMap } from './notice-map.tsx';
import { NoticeQuestions, type QuestionControl } from './notice-questions.tsx';
import { NoticeZoneTable } from './notice-zone-table.tsx';

export type NoticePageContent = NoticeLinkResponse['notice'];

const longDate = (isoDay: string) => new Date(`${isoDay}T12:00:00`).toLocaleDateString(undefined, { dateStyle: 'long' });
const percent = new Intl.NumberFormat('en', { style: 'percent', maximumFractionDigits: 1 });

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="rounded-lg bg-white p-4 shadow-sm ring-1 ring-soil-300/60 sm:p-5 print:break-inside-avoid print:p-0 print:shadow-none print:ring-0">
      <h2 className="mb-3 text-lg font-semibold text-field-900">{title}</h2>
      {children}
    </section>
  );
}

function ZonesDownload({ notice }: { notice: NoticePageContent }) {
  const href = useMemo(() => URL.createObjectURL(new Blob([JSON.stringify(notice.zonesGeoJson)], { type: 'application/geo+json' })), [notice.zonesGeoJson]);
  useEffect(() => () => URL.revokeObjectURL(href), [href]);
  const link = 'font-medium text-field-700 underline-offset-2 hover:underline';
  return (
    <div className="space-y-1 print:hidden">
      <p className="flex flex-wrap gap-x-4 gap-y-1">
        <a href={href} download={`${notice.fieldName} zones.geojson`} className={link}>
          Download the zones (GeoJSON)
        </a>
        <a href={notice.zoneFiles.taskData} download className={link}>
          Task data for a sprayer terminal (ISO 11783-10)
        </a>
        <a href={notice.zoneFiles.shapefile} download className={link}>
          Shapefile
        </a>
      </p>
      <p className="text-xs text-soil-700">{MACHINE_FILE_CAUTION}</p>
    </div>
  );
}

export function NoticeView({ notice: n, acknowledge, ask }: { notice: NoticePageContent; acknowledge: AcknowledgeControl; ask: QuestionControl }) {
  useEffect(() => {
    document.title = `${n.pestName} on ${n.fieldName} · Zone notice`;
  }, [n.pestName, n.fieldName]);
  const treatedShare = 1 - n.untreatedShare;

  return (
    <>
      <header className="space-y-2">
        <p className="text-sm font-medium text-soil-600">
          Zone notice for {n.recipientName}
          {n.sentAt ? `, sent ${new Date(n.sentAt).toLocaleDateString(undefined, { dateStyle: 'long' })}` : ''}
        </p>
        <h1 className="text-2xl font-semibold tracking-tight text-field-900 sm:text-3xl">
          {n.pestName} on {n.fieldName}
        </h1>
        <p className="text-soil-800">
          Your adviser {n.adviserName} proposes treating {n.zones.length === 1 ? 'one zone' : `${n.zones.length} zones`} covering{' '}
          <AreaText m2={n.totalTreatedM2} /> ({percent.format(treatedShare)} of the field), and leaving the rest untreated.
        </p>
        <div className="flex flex-wrap gap-2 pt-1 print:hidden">
          <Button variant="secondary" onClick={() => window.print()}>
            Print
          </Button>
        </div>
      </header>

      <AcknowledgeBox acknowledgedAt={n.acknowledgedAt} control={acknowledge} />

      <Section title="The field">
        <dl className="grid gap-3 text-sm sm:grid-cols-2">
          <div>
            <dt className="text-xs font-medium uppercase tracking-wide text-soil-600">Farm</dt>
            <dd className="text-base text-soil-900">{n.farmName}</dd>
          </div>
          <div>
            <dt className="text-xs font-medium uppercase tracking-wide text-soil-600">Field</dt>
            <dd className="text-base text-soil-900">
              {n.fieldName} (<AreaText m2={n.fieldAreaM2} />)
            </dd>
          </div>
          <div>
            <dt className="text-xs font-medium uppercase tracking-wide text-soil-600">Pest</dt>
            <dd className="text-base text-soil-900">{n.pestName}</dd>
          </div>
          <div>
            <dt className="text-xs font-medium uppercase tracking-wide text-soil-600">Walked on</dt>
            <dd className="text-base text-soil-900">{n.walkDates.length ? n.walkDates.map(longDate).join(', ') : 'No walk recorded'}</dd>
          </div>
        </dl>
      </Section>

      <Section title="What the scouting found">
        <p className="text-soil-900" data-testid="verdict">
          {n.verdict.headline}
        </p>
        {n.verdict.figures.length > 0 && (
          <ul className="mt-2 list-disc space-y-1 pl-5 text-sm text-soil-700">
            {n.verdict.figures.map((figure) => (
              <li key={figure}>{figure}</li>
            ))}
          </ul>
        )}
      </Section>

      <Section title="Where the zones are">
        <NoticeMap notice={n} />
        <div className="mt-4">
          <NoticeZoneTable zones={n.zones} totalTreatedM2={n.totalTreatedM2} untreatedShare={n.untreatedShare} />
        </div>
        <p className="mt-2 text-sm">
          <ZonesDownload notice={n} />
        </p>
      </Section>

      <Section title="What your adviser recommends">
        <p className="whitespace-pre-wrap text-soil-900">{n.recommendation}</p>
        {n.rescoutOn && <p className="mt-3 font-medium text-soil-900">Re-scout on {longDate(n.rescoutOn)}.</p>}
      </Section>

      <section
        aria-labelledby="cautions"
        className="rounded-lg border-l-4 border-straw-500 bg-white p-4 shadow-sm ring-1 ring-soil-300/60 sm:p-5 print:break-inside-avoid print:shadow-none"
      >
        <h2 id="cautions" className="mb-2 text-lg font-semibold text-field-900">
          Before any treatment
        </h2>
        <ul className="list-disc space-y-1.5 pl-5 text-soil-900">
          {NOTICE_CAUTIONS.map((caution) => (
            <li key={caution}>{caution}</li>
          ))}
        </ul>
      </section>

      <NoticeQuestions questions={n.questions} adviserName={n.adviserName} control={ask} />

      <footer className="border-t border-straw-300 pt-4 text-sm text-soil-700">
        From {n.adviserName}, {n.organisationName}. Questions about this notice go to your adviser; apart from them, this page is read-only.
      </footer>
    </>
  );
}
