// The scout's upload queue: one request per photo, two at a time, each with its progress and outcome.
import { useCallback, useEffect, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { csrfTokenForUpload, uploadPhoto, PhotoUploadError } from '../api/upload-photo.ts';
import { walkQueryKey } from '../api/get-walk.ts';
import { walkListsQueryKey } from '../api/get-walks.ts';
import { countFor, drainQueue, entriesToSend, failed, readyEntry, withChange, type BatchTags, type UploadEntry } from '../upload-queue.ts';
import { loadEntries, newClientId, saveEntries } from './upload-store.ts';

const PARALLEL_UPLOADS = 2;

export interface UploadTarget {
  /** Photos go into this walk; without it the server finds the field and walk from each photo's position. */
  walkId?: string;
  fieldId?: string;
}

export function usePhotoUploads(target: UploadTarget) {
  const scope = target.walkId ?? 'find-field';
  const queryClient = useQueryClient();
  const [entries, setEntries] = useState<UploadEntry[]>(() => loadEntries(scope));
  const files = useRef(new Map<string, File>());
  const entriesRef = useRef(entries);
  entriesRef.current = entries;

  useEffect(() => saveEntries(scope, entries), [scope, entries]);

  const patch = useCallback((clientId: string, change: Partial<UploadEntry>) => {
    setEntries((list) => withChange(list, clientId, change));
  }, []);

  const addFiles = useCallback((chosen: FileList | File[]) => {
    const added: UploadEntry[] = [];
    for (const file of Array.from(chosen)) {
      const clientId = newClientId();
      files.current.set(clientId, file);
      added.push(readyEntry(clientId, file));
    }
    setEntries((list) => [...list, ...added]);
  }, []);

  const removeEntry = useCallback((clientId: string) => {
    files.current.delete(clientId);
    setEntries((list) => list.filter((e) => e.clientId !== clientId));
  }, []);

  const sendOne = useCallback(
    async (entry: UploadEntry, batch: BatchTags) => {
      const file = files.current.get(entry.clientId);
      if (!file) return;
      patch(entry.clientId, { state: 'sending', progress: 0, error: undefined });
      try {
        const outcome = await uploadPhoto(
          { file, clientId: entry.clientId, pestId: batch.pestId, count: countFor(entry, batch), walkId: target.walkId, fieldId: target.fieldId },
          await csrfTokenForUpload(),
          (progress) => patch(entry.clientId, { progress }),
        );
        patch(entry.clientId, { state: 'sent', progress: 1, outcome });
        files.current.delete(entry.clientId);
        const walkId = outcome.walkId ?? target.walkId;
        if (walkId) void queryClient.invalidateQueries({ queryKey: walkQueryKey(walkId) });
        // A photo without a walk may have started one on whichever field it fell in.
        void queryClient.invalidateQueries({ queryKey: walkListsQueryKey });
      } catch (error) {
        const retryable = error instanceof PhotoUploadError ? error.retryable : true;
        patch(entry.clientId, failed((error as Error).message, retryable));
      }
    },
    [patch, queryClient, target.walkId, target.fieldId],
  );

  /** Sends the given photos (all ready ones by default) a few at a time. */
  const send = useCallback(
    async (batch: BatchTags, only?: string[]) => {
      await drainQueue(entriesToSend(entriesRef.current, only), PARALLEL_UPLOADS, (entry) => sendOne(entry, batch));
    },
    [sendOne],
  );

  const retry = useCallback((clientId: string, batch: BatchTags) => send(batch, [clientId]), [send]);

  const setCount = useCallback((clientId: string, count: string) => patch(clientId, { count }), [patch]);

  const clearFinished = useCallback(() => setEntries((list) => list.filter((e) => e.state !== 'sent')), []);

  return {
    entries,
    hasFile: (clientId: string) => files.current.has(clientId),
    addFiles,
    removeEntry,
    setCount,
    send,
    retry,
    clearFinished,
    busy: entries.some((e) => e.state === 'sending'),
  };
}
