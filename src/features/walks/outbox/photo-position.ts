// The photo's own GPS position read on the phone, only to show a waiting photo on the walk map; the server reads it again.
export async function photoPosition(file: Blob): Promise<{ lon: number; lat: number } | undefined> {
  try {
    const { gps } = await import('exifr');
    const found = await gps(file);
    return found && Number.isFinite(found.longitude) && Number.isFinite(found.latitude) ? { lon: found.longitude, lat: found.latitude } : undefined;
  } catch {
    return undefined;
  }
}
