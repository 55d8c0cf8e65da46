// One zone notice as the grower reads it: the decision first (zones, area, share untreated, recommendation, re-scout
// date), then where the zones are, the cautions, and how we know. Shared by the e-mailed link's page and the signed-in grower's; calm on screen, clean on paper.
import { useEffect, useMemo, type ReactNode } from 'react';
import { MACHINE_FILE_CAUTION, NOTICE_CAUTIONS } from '@shared/notices/cautions.ts';
import type { NoticeLinkResponse } from '@shared/schemas/notices.ts';
import { decisionText, thresholdLineText, zoneEvidenceText } from '@shared/notices/notice-words.ts';
import { unconfirmedThresholdNoticeSentence } from '@shared/thresholds/threshold-confirmation.ts';
import { NeedsConfirmingMark } from '../needs-confirming-mark.tsx';
import { useDates } from '../../lib/dates.ts';
import { AreaText } from '../area-text.tsx';
import { Button } from '../button.tsx';
import { AcknowledgeBox, type AcknowledgeControl } from './acknowledge-box.tsx';
import { NoticeMap } from './notice-map.tsx';
import { NoticeQuestions, type QuestionControl } from './notice-questions.tsx';
import { NoticeZoneTable } from './notice-zone-table.tsx';

export type NoticePageContent = NoticeLinkResponse['notice'];

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
  // The notice's own date format, kept with it when it was sent, so the page writes dates as its e-mail did.
  const dates = useDates(n.dateFormat);
  const figures = [...(n.verdict.plain && n.verdict.plain !== n.verdict.headline ? [n.verdict.headline] : []), ...n.verdict.figures];

  return (
    <>
      <header className="space-y-2">
        <p className="text-sm font-medium text-soil-600">
          Zone notice for {n.recipientName}
          {n.sentAt ? `, sent ${dates.date(n.sentAt)}` : ''}
        </p>
        <h1 className="text-2xl font-semibold tracking-tight text-field-900 sm:text-3xl">
          {n.pestName} on {n.fieldName}
        </h1>
      </header>

      <section
        aria-labelledby="decision"
        className="rounded-lg border-l-4 border-field-700 bg-white p-4 shadow-sm ring-1 ring-soil-300/60 sm:p-5 print:break-inside-avoid print:shadow-none"
      >
        <h2 id="decision" className="mb-2 text-lg font-semibold text-field-900">
          The decision
        </h2>
        <p className="text-lg font-medium text-soil-900" data-testid="decision">
          {decisionText(n)}
        </p>
        <h3 className="mt-4 text-sm font-semibold uppercase tracking-wide text-soil-600">Recommendation from {n.adviserName}</h3>
        <p className="mt-1 whitespace-pre-wrap text-soil-900">{n.recommendation}</p>
        {n.rescoutOn && <p className="mt-3 font-medium text-soil-900">Re-scout on {dates.calendarDate(n.rescoutOn)}.</p>}
        <div className="mt-3 flex flex-wrap gap-2 print:hidden">
          <Button variant="secondary" onClick={() => window.print()}>
            Print
          </Button>
        </div>
      </section>

      <AcknowledgeBox acknowledgedAt={n.acknowledgedAt} control={acknowledge} dates={dates} />

      <Section title="Where the zones are">
        <NoticeMap notice={n} />
        <div className="mt-4">
          <NoticeZoneTable zones={n.zones} totalTreatedM2={n.totalTreatedM2} untreatedShare={n.untreatedShare} />
        </div>
        <div className="mt-2 text-sm">
          <ZonesDownload notice={n} />
        </div>
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

      <Section title="How we know">
        <p className="text-soil-800">
          {n.pestName} on {n.fieldName} (<AreaText m2={n.fieldAreaM2} />
          ), {n.farmName}; walked on {n.walkDates.length ? n.walkDates.map(dates.calendarDate).join(', ') : 'no recorded walk'}.
        </p>
        <ul aria-label="Counts in each zone" className="mt-2 list-disc space-y-1 pl-5 text-soil-900">
          {n.zones.map((z) => (
            <li key={z.label}>{zoneEvidenceText(z, n.threshold)}</li>
          ))}
        </ul>
        {n.threshold && <p className="mt-1 text-sm text-soil-700">{thresholdLineText(n.threshold)}</p>}
        {n.threshold?.confirmed === false && <NeedsConfirmingMark sentence={unconfirmedThresholdNoticeSentence} className="mt-1" />}
        <p className="mt-3 text-soil-900" data-testid="verdict">
          The check’s verdict: {n.verdict.plain ?? n.verdict.headline}
        </p>
        {figures.length > 0 && (
          <details className="mt-2 rounded-md bg-straw-50 px-3 py-2 ring-1 ring-inset ring-straw-300 print:bg-white">
            <summary className="cursor-pointer text-sm font-medium text-field-800">The figures behind the check</summary>
            <ul className="mt-2 list-disc space-y-1 pl-5 text-sm text-soil-700">
              {figures.map((figure) => (
                <li key={figure}>{figure}</li>
              ))}
            </ul>
          </details>
        )}
      </Section>

      <NoticeQuestions questions={n.questions} adviserName={n.adviserName} control={ask} dates={dates} />

      <footer className="border-t border-straw-300 pt-4 text-sm text-soil-700">
        From {n.adviserName}, {n.organisationName}. Questions about this notice go to your adviser; apart from them, this page is read-only.
      </footer>
    </>
  );
}
