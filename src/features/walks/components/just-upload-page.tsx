// Upload without choosing a field: Patchwise finds each photo's field and that day's walk from its GPS.
import { PageFrame, Panel } from '../../../components/page-frame.tsx';
import { ErrorState } from '../../../components/query-states.tsx';
import { usePests } from '../../../lib/api/get-pests.ts';
import { useBatchTags } from '../hooks/use-batch-tags.ts';
import { PestCountPicker } from './pest-count-picker.tsx';
import { PhotoUploadPanel } from './photo-upload-panel.tsx';

export function JustUploadPage() {
  const pests = usePests(false);
  const tags = useBatchTags();
  const pestList = pests.data ?? [];
  const pestId = pestList.some((p) => p.id === tags.pestId) ? tags.pestId : '';
  return (
    <PageFrame title="Just upload">
      <Panel>
        <p className="mb-4 text-soil-700">
          Each photo goes to the field it was taken in, into your walk there for that day. Photos without a position ask for a pin.
        </p>
        <div className="space-y-4">
          {pests.isError ? (
            <ErrorState error={pests.error} title="The pest library could not be loaded" onRetry={() => pests.refetch()} />
          ) : (
            <PestCountPicker pests={pestList} pestId={pestId} count={tags.count} onPest={tags.setPestId} onCount={tags.setCount} />
          )}
          <PhotoUploadPanel target={{}} pestId={pestId} count={tags.count} />
        </div>
      </Panel>
    </PageFrame>
  );
}
