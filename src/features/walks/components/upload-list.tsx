import type { UploadEntry } from '../upload-queue.ts';
import { UploadRow } from './upload-row.tsx';

export function UploadList({
  entries,
  pinnedIds,
  onSendNow,
  onRemove,
  onCount,
  batchCount,
  linkToWalk,
}: {
  entries: (UploadEntry & { preview?: Blob })[];
  pinnedIds: ReadonlySet<string>;
  onSendNow: () => void;
  onRemove: (clientId: string) => void;
  onCount: (clientId: string, count: string) => void;
  batchCount: string;
  linkToWalk: boolean;
}) {
  if (!entries.length) return null;
  return (
    <ul className="space-y-2" aria-label="Photos in this batch" aria-live="polite">
      {entries.map((entry) => (
        <UploadRow
          key={entry.clientId}
          entry={entry}
          pinned={!!entry.outcome?.sightingId && entry.outcome.outcome === 'needs-pin' && pinnedIds.has(entry.outcome.sightingId)}
          onSendNow={onSendNow}
          onRemove={() => onRemove(entry.clientId)}
          onCount={(count) => onCount(entry.clientId, count)}
          batchCount={batchCount}
          linkToWalk={linkToWalk}
        />
      ))}
    </ul>
  );
}
