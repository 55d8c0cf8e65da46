// A small JPEG of a photo, made on the phone, so a photo waiting for a connection can be recognised in the list.
const PREVIEW_WIDTH_PX = 160;

/** The preview, or undefined where the browser cannot decode the photo (HEIC outside Safari, say): the name shows instead. */
export async function makePhotoPreview(file: Blob): Promise<Blob | undefined> {
  try {
    // One decode, scaled on the way: the height follows the photo's own proportions.
    const bitmap = await createImageBitmap(file, { resizeWidth: PREVIEW_WIDTH_PX, resizeQuality: 'medium', imageOrientation: 'from-image' });
    const canvas = document.createElement('canvas');
    canvas.width = bitmap.width;
    canvas.height = bitmap.height;
    canvas.getContext('2d')?.drawImage(bitmap, 0, 0);
    bitmap.close();
    return await new Promise<Blob | undefined>((resolve) => canvas.toBlob((blob) => resolve(blob ?? undefined), 'image/jpeg', 0.7));
  } catch {
    return undefined;
  }
}
