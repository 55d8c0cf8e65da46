// The e-mail exactly as the server composes it (subject, HTML and text), with its map image.
import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client.ts';
import type { NoticePreviewResponse } from '@shared/schemas/notices.ts';
import { noticeQueryKey } from './get-notice.ts';

export const getNoticePreview = (id: string) => api<NoticePreviewResponse>(`/api/notices/${id}/preview`);
export const noticePreviewQueryOptions = (id: string) => queryOptions({ queryKey: [...noticeQueryKey(id), 'preview'], queryFn: () => getNoticePreview(id) });
export const useNoticePreview = (id: string, enabled = true) => useQuery({ ...noticePreviewQueryOptions(id), enabled });

async function asDataUrl(blob: Blob) {
  return new Promise<string>((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(String(reader.result));
    reader.onerror = () => reject(reader.error);
    reader.readAsDataURL(blob);
  });
}

/** The map as a data: URL, so the sandboxed preview (which has no cookies) can show it in place of the e-mail's cid: image. */
export const getNoticeMapDataUrl = async (mapPath: string) => {
  const res = await fetch(mapPath, { credentials: 'same-origin' });
  if (!res.ok) throw new Error('The map image could not be made for the preview.');
  return asDataUrl(await res.blob());
};
export const noticeMapQueryOptions = (id: string, mapPath: string) =>
  queryOptions({ queryKey: [...noticeQueryKey(id), 'map'], queryFn: () => getNoticeMapDataUrl(mapPath), staleTime: Infinity });
export const useNoticeMap = (id: string, mapPath: string | undefined) => useQuery({ ...noticeMapQueryOptions(id, mapPath ?? ''), enabled: Boolean(mapPath) });
