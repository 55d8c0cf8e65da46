// Add photos, see each one travel, send them; the pest and batch count come from the page.
import { Button } from '../../../components/button.tsx';
import { FormMessage } from '../../../components/form-field.tsx';
import { usePhotoUploads, type UploadTarget } from '../hooks/use-photo-uploads.ts';
import { PhotoPicker } from './photo-picker.tsx';
import { UploadList } from './upload-list.tsx';

const nonePinned: ReadonlySet<string> = new Set();

export function PhotoUploadPanel({
  target,
  pestId,
  count,
  pinnedIds = nonePinned,
}: {
  target: UploadTarget;
  pestId: string;
  count: string;
  /** Sightings of this walk that now have a position, so a "needs a pin" line can say it is done. */
  pinnedIds?: ReadonlySet<string>;
}) {
  const uploads = usePhotoUploads(target);
  const batch = { pestId, count };
  const ready = uploads.entries.filter((e) => e.state === 'ready').length;
  const sent = uploads.entries.filter((e) => e.state === 'sent').length;
  const pending = uploads.entries.filter((e) => e.state === 'waiting' || e.state === 'sending').length;
  const countInvalid = count.trim() !== '' && !(Number(count) >= 0);

  return (
    <div className="space-y-3">
      <PhotoPicker onFiles={uploads.addFiles} />
      <UploadList
        entries={uploads.entries}
        pinnedIds={pinnedIds}
        onSendNow={uploads.sendNow}
        onRemove={uploads.removeEntry}
        onCount={uploads.setCount}
        batchCount={count}
        linkToWalk={!target.walkId}
      />
      {ready > 0 && !pestId && <FormMessage>Choose the pest before sending these photos.</FormMessage>}
      {countInvalid && <FormMessage>The count must be a number of zero or more.</FormMessage>}
      {ready > 0 && (
        <Button size="lg" className="w-full min-h-14 text-lg" disabled={!pestId || countInvalid} onClick={() => void uploads.send(batch)}>
          Send {ready} {ready === 1 ? 'photo' : 'photos'}
        </Button>
      )}
      {pending > 0 && (
        <p className="text-sm text-soil-700" role="status">
          {pending} {pending === 1 ? 'photo is' : 'photos are'} kept on this phone until {pending === 1 ? 'it arrives' : 'they arrive'}; you can close the page.
        </p>
      )}
      {sent > 0 && !uploads.busy && (
        <Button variant="quiet" size="lg" className="w-full" onClick={uploads.clearFinished}>
          Clear the {sent} sent {sent === 1 ? 'photo' : 'photos'} from this list
        </Button>
      )}
    </div>
  );
}
