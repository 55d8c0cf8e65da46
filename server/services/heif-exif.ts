// Finds the Exif block of a HEIC/HEIF photo (ISO/IEC 23008-12). exifr locates it itself but ignores the item's
// base offset in the ItemLocationBox (ISO/IEC 14496-12 §8.11.3), so photos from encoders that write one lost their
// GPS position; mp4box's box parser reads the location whole, and exifr then reads the TIFF block it points to.
import { createFile, MP4BoxBuffer } from 'mp4box';

const isHeifContainer = (bytes: Uint8Array) => bytes.length >= 12 && String.fromCharCode(...bytes.subarray(4, 8)) === 'ftyp';

/** The TIFF-structured Exif data of a HEIF file's Exif item, or null when the file has none (or is not HEIF). */
export function heifExifTiff(bytes: Uint8Array): Uint8Array | null {
  if (!isHeifContainer(bytes)) return null;
  const file = createFile();
  // A fresh ArrayBuffer of exactly these bytes (a Buffer may be a view into a larger shared pool).
  const copy = new Uint8Array(bytes).buffer;
  file.appendBuffer(MP4BoxBuffer.fromArrayBuffer(copy, 0), true);
  const meta = file.meta;
  const exifItem = meta?.iinf?.item_infos?.find((item) => item.item_type === 'Exif');
  const location = exifItem ? meta?.iloc?.items.find((item) => item.item_ID === exifItem.item_ID) : undefined;
  if (!meta || !location || location.extents.length === 0) return null;
  // construction_method 0: offsets into the file; 1: offsets into the meta box's ItemDataBox.
  const origin = location.construction_method === 1 && meta.idat ? (meta.idat.start ?? 0) + (meta.idat.hdr_size ?? 0) : 0;
  if (location.construction_method > 1) return null;
  const parts = location.extents.map((extent) => {
    const start = origin + location.base_offset + extent.extent_offset;
    return bytes.subarray(start, start + (extent.extent_length || bytes.length - start));
  });
  const item = parts.length === 1 ? parts[0] : Buffer.concat(parts);
  if (item.length < 4) return null;
  // The item starts with exif_tiff_header_offset (ISO/IEC 23008-12 Annex A.2.1): bytes to skip before the TIFF header.
  const skip = 4 + new DataView(item.buffer, item.byteOffset, item.byteLength).getUint32(0);
  return skip < item.length ? item.subarray(skip) : null;
}
