// Rendered notice maps, one per notice version (the notice's id and its updated_at), so the public notice page's
// image is drawn once however often mail programs and visitors fetch it. A render in flight is shared too.
import { LRUCache } from 'lru-cache';

// About 50–150 KB per map image (the notice PNG at its fixed size): 200 of them stay well under 30 MB.
const rendered = new LRUCache<string, Promise<Buffer>>({ max: 200 });

export function cachedNoticeMap(noticeId: string, version: Date, render: () => Promise<Buffer>): Promise<Buffer> {
  const key = `${noticeId}@${version.toISOString()}`;
  const hit = rendered.get(key);
  if (hit) return hit;
  const image = render();
  rendered.set(key, image);
  // A failed render is not kept: the next request tries again.
  image.catch(() => rendered.delete(key));
  return image;
}
