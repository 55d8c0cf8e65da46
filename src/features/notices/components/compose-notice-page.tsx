// Writing a zone notice from accepted zones: the recommendation (what, where, when to re-scout) and the
// re-scout date, saved as a draft that the notice page previews and sends.
import { useState, type FormEvent } from 'react';
import { Link, useNavigate, useParams, useSearchParams } from 'react-router';
import { noticeCreateSchema } from '@shared/schemas/notices.ts';
import { PageFrame, Panel } from '../../../components/page-frame.tsx';
import { Button } from '../../../components/button.tsx';
import { FormMessage, TextAreaField, TextField } from '../../../components/form-field.tsx';
import { EmptyState, ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { checkForm, errorMessage, serverFieldErrors, type FieldErrors } from '../../../lib/form-errors.ts';
import { useZoneSet } from '../../../lib/api/get-zone-set.ts';
import { useCreateNotice } from '../api/create-notice.ts';
import { NoticeZoneTable } from '../../../components/notice-view/notice-zone-table.tsx';
import { FieldNoticesPanel } from './field-notices-panel.tsx';

export function ComposeNoticePage() {
  const { fieldId = '' } = useParams();
  const [search] = useSearchParams();
  const zoneSetId = search.get('zoneSetId');
  const checkId = search.get('checkId') ?? undefined;
  const zoneSet = useZoneSet(zoneSetId);
  const create = useCreateNotice();
  const navigate = useNavigate();
  const [recommendation, setRecommendation] = useState('');
  const [rescoutOn, setRescoutOn] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});

  if (!zoneSetId) {
    return (
      <PageFrame title="Write a zone notice">
        <EmptyState title="Accept zones first">
          A notice is written from an accepted zone version.{' '}
          <Link className="font-medium text-field-700 underline" to={`/fields/${fieldId}/zones`}>
            Open the zone editor
          </Link>
          .
        </EmptyState>
      </PageFrame>
    );
  }
  if (zoneSet.isPending)
    return (
      <PageFrame title="Write a zone notice">
        <LoadingState label="Loading the zones…" />
      </PageFrame>
    );
  if (zoneSet.isError)
    return (
      <PageFrame title="Write a zone notice">
        <ErrorState error={zoneSet.error} onRetry={() => zoneSet.refetch()} />
      </PageFrame>
    );
  const z = zoneSet.data;

  const onSubmit = (event: FormEvent) => {
    event.preventDefault();
    const checked = checkForm(noticeCreateSchema, {
      fieldId,
      zoneSetId,
      ...((checkId ?? z.checkId) ? { checkId: checkId ?? z.checkId } : {}),
      recommendation,
      ...(rescoutOn ? { rescoutOn } : {}),
    });
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    create.mutate(checked.value, {
      onSuccess: (notice) => navigate(`/notices/${notice.id}`),
      onError: (error) => setErrors(serverFieldErrors(error)),
    });
  };

  return (
    <PageFrame title={`Zone notice · ${z.fieldName}`} eyebrow={`${z.pestName} · zones version ${z.version}`} wide>
      <div className="grid gap-5 lg:grid-cols-[minmax(0,1fr)_28rem]">
        <Panel title="Recommendation">
          <form className="space-y-4" onSubmit={onSubmit} noValidate>
            <TextAreaField
              label="Recommendation"
              rows={8}
              value={recommendation}
              onChange={(e) => setRecommendation(e.target.value)}
              hint="Say what to do, where (which zones), and when to re-scout. The cautions about labels, intervals, applicators and buffers are added to every notice."
              error={errors.recommendation}
            />
            <TextField
              label="Re-scout on"
              type="date"
              value={rescoutOn}
              onChange={(e) => setRescoutOn(e.target.value)}
              error={errors.rescoutOn}
              hint="Optional; shown to the grower beside the recommendation."
              className="max-w-xs"
            />
            {create.isError && <FormMessage>{errorMessage(create.error)}</FormMessage>}
            <Button type="submit" busy={create.isPending}>
              Save and preview
            </Button>
          </form>
        </Panel>
        <Panel title={`Zones (version ${z.version})`}>
          <NoticeZoneTable zones={z.zones} totalTreatedM2={z.totalTreatedM2} untreatedShare={z.untreatedShare} />
        </Panel>
      </div>
      <FieldNoticesPanel fieldId={fieldId} />
    </PageFrame>
  );
}
