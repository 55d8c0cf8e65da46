// Finds the Exif block of a HEIC/HEIF photo (ISO/IEC 23008-12). exifr locates it itself but ignores the item's
// base offset in the ItemLocationBox (ISO/IEC 14496-12 §8.11.3), so photos from encoders that write one lost their
// GPS position; mp4box's box parser reads the location whole, and exifr then reads the TIFF block it points to.
// Only the ftyp and meta boxes are read, then the Exif item's extents by range reads: never the coded image.
import { createFile, MP4BoxBuffer } from 'mp4box';
import { asSource, type PhotoSource } from './photo-source.ts';

/** Larger meta boxes or Exif items are not read (EXIF in a JPEG APP1 is at most 64 KB; phones write the same block). */
const MAX_META_BYTES = 4 * 1024 * 1024;
const MAX_EXIF_ITEM_BYTES = 1024 * 1024;
/** Top-level boxes looked at before giving up on finding meta. */
const MAX_TOP_LEVEL_BOXES = 64;

const boxType = (bytes: Uint8Array, at: number) => String.fromCharCode(...bytes.subarray(at, at + 4));

export interface HeifHeader {
  /** The ftyp box followed by the meta box, as one buffer (mp4box and image-size read it as a short file). */
  bytes: Uint8Array;
  /** Where the meta box starts in `bytes` and in the file. */
  metaInBytes: number;
  metaInFile: number;
}

/** The ftyp and meta boxes of a HEIF file, found by walking the top-level box headers; null when it is not HEIF. */
export async function heifHeaderBoxes(input: Uint8Array | PhotoSource): Promise<HeifHeader | null> {
  const source = asSource(input);
  if (source.size < 12 || boxType(source.head, 4) !== 'ftyp') return null;
  let ftyp: Uint8Array | null = null;
  let offset = 0;
  for (let n = 0; n < MAX_TOP_LEVEL_BOXES && offset + 8 <= source.size; n++) {
    const header = Buffer.from(await source.read(offset, offset + 16));
    let size = header.readUInt32BE(0);
    const type = boxType(header, 4);
    if (size === 1) size = header.length >= 16 ? Number(header.readBigUInt64BE(8)) : 0;
    else if (size === 0) size = source.size - offset;
    if (size < 8) return null;
    if (type === 'ftyp' || type === 'meta') {
      if (size > MAX_META_BYTES) return null;
      const box = await source.read(offset, offset + size);
      if (type === 'ftyp') ftyp = box;
      else if (ftyp) return { bytes: Buffer.concat([ftyp, box]), metaInBytes: ftyp.length, metaInFile: offset };
    }
    offset += size;
  }
  return null;
}

/** The TIFF-structured Exif data of a HEIF file's Exif item, or null when the file has none (or is not HEIF). */
export async function heifExifTiff(input: Uint8Array | PhotoSource): Promise<Uint8Array | null> {
  const source = asSource(input);
  const header = await heifHeaderBoxes(source);
  if (!header) return null;
  const file = createFile();
  // A fresh ArrayBuffer of exactly these bytes (a Buffer may be a view into a larger shared pool).
  const copy = new Uint8Array(header.bytes).buffer;
  file.appendBuffer(MP4BoxBuffer.fromArrayBuffer(copy, 0), true);
  const meta = file.meta;
  const exifItem = meta?.iinf?.item_infos?.find((item) => item.item_type === 'Exif');
  const location = exifItem ? meta?.iloc?.items.find((item) => item.item_ID === exifItem.item_ID) : undefined;
  if (!meta || !location || location.extents.length === 0) return null;
  if (location.construction_method > 1) return null;
  // construction_method 0: offsets into the file; 1: offsets into the meta box's ItemDataBox, which mp4box placed
  // within our short buffer, so it is moved back to where the meta box sits in the file.
  const idatInBytes = meta.idat ? (meta.idat.start ?? 0) + (meta.idat.hdr_size ?? 0) : 0;
  const origin = location.construction_method === 1 && meta.idat ? idatInBytes - header.metaInBytes + header.metaInFile : 0;
  const parts: Uint8Array[] = [];
  let total = 0;
  for (const extent of location.extents) {
    const start = origin + location.base_offset + extent.extent_offset;
    const length = Math.min(extent.extent_length || source.size - start, MAX_EXIF_ITEM_BYTES - total);
    if (length <= 0) break;
    const part = await source.read(start, start + length);
    parts.push(part);
    total += part.length;
  }
  const item = parts.length === 1 ? parts[0] : Buffer.concat(parts);
  if (item.length < 4) return null;
  // The item starts with exif_tiff_header_offset (ISO/IEC 23008-12 Annex A.2.1): bytes to skip before the TIFF header.
  const skip = 4 + new DataView(item.buffer, item.byteOffset, item.byteLength).getUint32(0);
  return skip < item.length ? item.subarray(skip) : null;
}
