import type { UploadEntry } from '../upload-queue.ts';
import { UploadRow } from './upload-row.tsx';

export function UploadList({
  entries,
  pinnedIds,
  canRetry,
  onRetry,
  onRemove,
  onCount,
  batchCount,
  linkToWalk,
}: {
  entries: UploadEntry[];
  pinnedIds: ReadonlySet<string>;
  canRetry: (clientId: string) => boolean;
  onRetry: (clientId: string) => void;
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
          canRetry={canRetry(entry.clientId)}
          onRetry={() => onRetry(entry.clientId)}
          onRemove={() => onRemove(entry.clientId)}
          onCount={(count) => onCount(entry.clientId, count)}
          batchCount={batchCount}
          linkToWalk={linkToWalk}
        />
      ))}
    </ul>
  );
}
