// The grower's notice page, opened from the e-mailed link without signing in: the notice view inside a plain
// frame of its own, or a plain explanation when the link opens nothing.
import { useEffect, type ReactNode } from 'react';
import { useParams } from 'react-router';
import { LoadingState } from '../../../components/query-states.tsx';
import { NoticeView } from '../../../components/notice-view/notice-view.tsx';
import { ApiError } from '../../../lib/api-client.ts';
import { errorMessage } from '../../../lib/form-errors.ts';
import { useNoticeLink } from '../api/get-notice-link.ts';
import { useAcknowledgeNotice } from '../api/acknowledge-notice.ts';
import { useReportNoticeOpened } from '../api/report-notice-opened.ts';
import { useAskNoticeQuestion } from '../api/ask-notice-question.ts';
import { useOnceWhen } from '../../../lib/use-once-when.ts';

function Shell({ organisation, children }: { organisation?: string; children: ReactNode }) {
  return (
    <div className="min-h-screen bg-straw-50 print:bg-white">
      <header className="bg-field-800 text-white print:hidden">
        <div className="mx-auto flex max-w-3xl items-center gap-2 px-4 py-3 sm:px-6">
          <span aria-hidden="true" className="inline-block h-5 w-5 rounded bg-field-400 ring-2 ring-patch-400" />
          <span className="text-lg font-semibold tracking-tight">Patchwise</span>
          {organisation && <span className="ml-auto text-sm text-field-100">Zone notice from {organisation}</span>}
        </div>
      </header>
      <main id="main" className="mx-auto max-w-3xl space-y-6 px-4 py-6 sm:px-6 sm:py-8 print:max-w-none print:space-y-4 print:px-0 print:py-2">
        {children}
      </main>
    </div>
  );
}

function LinkProblem({ error }: { error: unknown }) {
  const refused = error instanceof ApiError && error.status === 404;
  const busy = error instanceof ApiError && error.status === 429;
  return (
    <Shell>
      <section role="alert" className="rounded-lg bg-white p-6 shadow-sm ring-1 ring-soil-300/60">
        <h1 className="text-2xl font-semibold text-field-900">
          {refused ? 'This notice link does not open a notice' : busy ? 'Please wait a minute' : 'The notice could not be loaded'}
        </h1>
        {refused ? (
          <div className="mt-3 space-y-2 text-soil-800">
            <p>
              The link may have expired (links stay valid for a season’s re-scout), your adviser may have withdrawn it, or part of it may have been lost when it
              was copied.
            </p>
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

export function PublicNoticePage() {
  const { token = '' } = useParams();
  const notice = useNoticeLink(token);
  const acknowledge = useAcknowledgeNotice(token);
  const ask = useAskNoticeQuestion(token);
  const { mutate: reportOpened } = useReportNoticeOpened(token);
  // Opening is recorded by the page once the notice has loaded, never by the GET itself.
  useOnceWhen(Boolean(notice.data), reportOpened);
  useEffect(() => {
    if (!notice.data) document.title = 'Zone notice · Patchwise';
  }, [notice.data]);

  if (notice.isPending)
    return (
      <Shell>
        <LoadingState label="Opening your notice…" />
      </Shell>
    );
  if (notice.isError) return <LinkProblem error={notice.error} />;
  return (
    <Shell organisation={notice.data.organisationName}>
      <NoticeView
        notice={notice.data}
        acknowledge={{
          onAcknowledge: () => acknowledge.mutate(),
          busy: acknowledge.isPending,
          error: acknowledge.isError ? errorMessage(acknowledge.error) : undefined,
        }}
        ask={{ onAsk: (text, sent) => ask.mutate(text, { onSuccess: sent }), busy: ask.isPending, error: ask.isError ? errorMessage(ask.error) : undefined }}
      />
    </Shell>
  );
}
