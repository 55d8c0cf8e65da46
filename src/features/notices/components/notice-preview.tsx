// The e-mail as the grower will get it: its HTML in an empty sandbox (no scripts, no forms, no cookies), with the
// map image put in place of the message's inline picture, and the plain-text part beside it.
import { useId } from 'react';
import { ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { useNoticeMap, useNoticePreview } from '../api/get-notice-preview.ts';

const INLINE_MAP = /cid:notice-map@patchwise/g;

export function NoticePreview({ noticeId }: { noticeId: string }) {
  const preview = useNoticePreview(noticeId);
  const map = useNoticeMap(noticeId, preview.data?.mapPath);
  const plainTextId = useId();
  if (preview.isPending) return <LoadingState label="Composing the preview…" />;
  if (preview.isError) return <ErrorState error={preview.error} onRetry={() => preview.refetch()} />;
  const p = preview.data;
  const html = map.data ? p.html.replace(INLINE_MAP, map.data) : p.html;
  return (
    <div className="space-y-4">
      <p className="text-sm">
        <span className="font-medium text-soil-700">Subject:</span> <span data-testid="preview-subject">{p.subject}</span>
      </p>
      <section>
        <h3 className="mb-1 text-xs font-semibold uppercase tracking-wide text-soil-600">As the grower sees it</h3>
        <iframe title={`Preview: ${p.subject}`} sandbox="" srcDoc={html} className="h-[36rem] w-full rounded-md bg-white ring-1 ring-soil-300/60" />
      </section>
      <section>
        <h3 id={plainTextId} className="mb-1 text-xs font-semibold uppercase tracking-wide text-soil-600">
          Plain text
        </h3>
        {/* Focusable so that a keyboard can scroll a long message. */}
        <pre
          role="region"
          aria-labelledby={plainTextId}
          tabIndex={0}
          className="max-h-80 overflow-auto whitespace-pre-wrap rounded-md bg-straw-50 p-3 font-sans text-sm text-soil-800 ring-1 ring-straw-200 focus-visible:outline focus-visible:outline-2 focus-visible:outline-field-600"
        >
          {p.text}
        </pre>
      </section>
    </div>
  );
}
