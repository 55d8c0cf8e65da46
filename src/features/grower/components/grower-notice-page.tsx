// A zone notice opened from the signed-in grower's home: the same view the e-mailed link opens, inside the app.
import { useParams } from 'react-router';
import { ButtonLink } from '../../../components/button.tsx';
import { NoticeView } from '../../../components/notice-view/notice-view.tsx';
import { PageFrame } from '../../../components/page-frame.tsx';
import { ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import { useAcknowledgeGrowerNotice } from '../api/acknowledge-grower-notice.ts';
import { useGrowerNotice } from '../api/get-grower-notice.ts';
import { useReportGrowerNoticeOpened } from '../api/report-grower-notice-opened.ts';
import { useAskGrowerNoticeQuestion } from '../api/ask-grower-notice-question.ts';
import { useOnceWhen } from '../../../lib/use-once-when.ts';

export function GrowerNoticePage() {
  const { noticeId = '' } = useParams();
  const notice = useGrowerNotice(noticeId);
  const acknowledge = useAcknowledgeGrowerNotice(noticeId);
  const ask = useAskGrowerNoticeQuestion(noticeId);
  const { mutate: reportOpened } = useReportGrowerNoticeOpened(noticeId);
  // Opening is recorded by the page once the notice has loaded, never by the GET itself.
  useOnceWhen(Boolean(notice.data), reportOpened);
  if (notice.isPending)
    return (
      <PageFrame title="Zone notice">
        <LoadingState label="Opening the notice…" />
      </PageFrame>
    );
  if (notice.isError)
    return (
      <PageFrame title="Zone notice">
        <ErrorState error={notice.error} onRetry={() => notice.refetch()} />
      </PageFrame>
    );
  return (
    <div className="mx-auto w-full max-w-3xl space-y-6 px-4 py-5 sm:px-6 sm:py-8 print:max-w-none print:space-y-4 print:px-0 print:py-2">
      <ButtonLink to="/" variant="quiet" className="print:hidden">
        ← My farms
      </ButtonLink>
      <NoticeView
        notice={notice.data}
        acknowledge={{
          onAcknowledge: () => acknowledge.mutate(),
          busy: acknowledge.isPending,
          error: acknowledge.isError ? errorMessage(acknowledge.error) : undefined,
        }}
        ask={{ onAsk: (text, sent) => ask.mutate(text, { onSuccess: sent }), busy: ask.isPending, error: ask.isError ? errorMessage(ask.error) : undefined }}
      />
    </div>
  );
}
