// The scout's photos for one walk (or for "let Patchwise find the field"): chosen ones wait in memory for the pest
// and count; a press of send puts each into the outbox on the phone, which sends it now or when signal returns.
import { useCallback, useMemo, useState } from 'react';
import { useSignedInUser } from '../../../lib/auth.ts';
import { countFor, entriesToSend, readyEntry, withChange, type BatchTags, type UploadEntry } from '../upload-queue.ts';
import { newClientId } from '../client-id.ts';
import { removeQueued, type QueuedPhoto } from '../outbox/outbox-store.ts';
import { drainOutbox, queueAndSend } from '../outbox/outbox-sender.ts';
import { makePhotoPreview } from '../outbox/photo-preview.ts';
import { photoPosition } from '../outbox/photo-position.ts';
import { askForBackgroundSync, useOutbox, useSendProgress } from '../outbox/use-outbox.ts';

export interface UploadTarget {
  /** Photos go into this walk; without it the server finds the field and walk from each photo's position. */
  walkId?: string;
  fieldId?: string;
}

/** One row of the list for a photo in the outbox. */
export function entryFromQueued(item: QueuedPhoto, progress = 0): UploadEntry & { preview?: Blob } {
  return {
    clientId: item.clientId,
    fileName: item.fileName,
    sizeBytes: item.file.size,
    state: item.state,
    progress: item.state === 'sent' ? 1 : progress,
    count: item.count === undefined ? '' : String(item.count),
    outcome: item.outcome,
    // A refusal read from the photo's own outcome is shown once, with the outcome.
    error:
      item.refusal && item.refusal !== item.outcome?.message
        ? { message: item.refusal, retryable: false }
        : item.lastError && !item.refusal
          ? { message: item.lastError, retryable: true }
          : undefined,
    preview: item.preview,
  };
}

export function usePhotoUploads(target: UploadTarget) {
  const [chosen, setChosen] = useState<UploadEntry[]>([]);
  const [files] = useState(() => new Map<string, File>());
  const outbox = useOutbox();
  const ownerId = useSignedInUser().id;
  const progress = useSendProgress();

  const queued = useMemo(
    () =>
      outbox
        .filter((item): item is QueuedPhoto => item.kind === 'photo' && (target.walkId ? item.walkId === target.walkId : !item.walkId))
        .map((item) => entryFromQueued(item, progress.get(item.clientId))),
    [outbox, progress, target.walkId],
  );

  const addFiles = useCallback(
    (list: FileList | File[]) => {
      const added = Array.from(list).map((file) => {
        const clientId = newClientId();
        files.set(clientId, file);
        return readyEntry(clientId, file);
      });
      setChosen((entries) => [...entries, ...added]);
    },
    [files],
  );

  const removeEntry = useCallback(
    (clientId: string) => {
      files.delete(clientId);
      setChosen((entries) => entries.filter((e) => e.clientId !== clientId));
      if (queued.some((e) => e.clientId === clientId)) void removeQueued(clientId);
    },
    [files, queued],
  );

  /** Puts every chosen photo into the outbox with its pest, count and preview; they go now or with the next signal. */
  const send = useCallback(
    async (batch: BatchTags) => {
      const going = entriesToSend(chosen);
      const createdAt = Date.now();
      const items = await Promise.all(
        going.map(async (entry, i): Promise<QueuedPhoto> => {
          const file = files.get(entry.clientId)!;
          return {
            kind: 'photo',
            clientId: entry.clientId,
            ownerId,
            state: 'waiting',
            attempts: 0,
            createdAt: createdAt + i,
            pestId: batch.pestId,
            count: countFor(entry, batch),
            walkId: target.walkId,
            fieldId: target.fieldId,
            file,
            fileName: file.name,
            preview: await makePhotoPreview(file),
            position: await photoPosition(file),
          };
        }),
      );
      await queueAndSend(...items);
      const gone = new Set(going.map((e) => e.clientId));
      gone.forEach((id) => files.delete(id));
      setChosen((entries) => entries.filter((e) => !gone.has(e.clientId)));
      void askForBackgroundSync();
    },
    [chosen, files, ownerId, target.walkId, target.fieldId],
  );

  const setCount = useCallback((clientId: string, count: string) => setChosen((entries) => withChange(entries, clientId, { count })), []);

  const clearFinished = useCallback(() => {
    for (const entry of queued) if (entry.state === 'sent') void removeQueued(entry.clientId);
  }, [queued]);

  return {
    entries: [...queued, ...chosen],
    addFiles,
    removeEntry,
    setCount,
    send,
    /** Tries the waiting photos now rather than at the next signal. */
    sendNow: () => void drainOutbox(ownerId),
    clearFinished,
    busy: queued.some((e) => e.state === 'sending'),
  };
}
