// Turns uploaded photos into sightings: type from the bytes, position and time from EXIF, field from PostGIS,
// one sighting per photo per field (SHA-256), the file stored before the row is committed.
import crypto from 'node:crypto';
import { sequelize } from '../db.ts';
import type { Actor } from '../auth/passport.ts';
import type { PhotoOutcome, Position } from '../../shared/schemas/sightings.ts';
import { badRequest } from '../errors.ts';
import { recordAudit } from './audit.ts';
import { visibleFieldIds } from './scope.ts';
import { assertMayRecord, writableField, writableWalk, type FieldRef, type WalkRef } from './ingest-access.ts';
import { findOrCreateWalk } from './walks.ts';
import { sniffPhotoType, extensionFor } from './photo-type.ts';
import { bytesSource, fileSource, type PhotoSource } from './photo-source.ts';
import type { SpooledFile } from './photo-spool.ts';
import { readPhotoExif, positionProblemSentence, type PhotoReading } from './exif-reading.ts';
import { fieldContains, fieldsContaining, nearestField } from './ingest-fields.ts';
import { newStorageKey, removeStored, writeStored } from './storage.ts';
import { requestThumbnails } from './thumbnail-queue.ts';
import type { PhotoMimeType } from './photo-type.ts';
import { findPestInOrganisation } from '../queries/pests.ts';
import { insertPhoto, photosAwaitingThumbnail } from '../queries/photos.ts';
import { findSightingOfPhotoHash, insertPhotoSighting } from '../queries/sightings.ts';
import { logger } from '../logger.ts';

/** A photo as bytes in memory (the seed) or as the temp file an upload was spooled to, hashed on arrival. */
export type IncomingPhoto = {
  /** The name the phone sent: a label only, never a path. */
  fileName: string;
  clientId?: string;
  count?: number | null;
} & ({ bytes: Uint8Array } | { spooled: Pick<SpooledFile, 'path' | 'size' | 'sha256' | 'head'> });

function readable(photo: IncomingPhoto): { source: PhotoSource; sha256: string } {
  if ('bytes' in photo) return { source: bytesSource(photo.bytes), sha256: crypto.createHash('sha256').update(photo.bytes).digest('hex') };
  const { path, size, sha256, head } = photo.spooled;
  return { source: fileSource(path, size, head), sha256 };
}

export interface IngestRequest {
  pestId: string;
  walkId?: string;
  fieldId?: string;
}

interface Context {
  actor: Actor;
  pestId: string;
  walk: WalkRef | null;
  field: FieldRef | null;
  writableIds: string[] | null;
  now: Date;
}

/** Keeps the uploaded name readable as a label: no folders, no control characters, bounded length. */
export function labelFromFileName(name: string) {
  const base = name.split(/[\\/]/).pop() ?? '';
  // Control characters are exactly what a stored label must lose.
  // eslint-disable-next-line no-control-regex
  const controlCharacters = /[\u0000-\u001f\u007f]/g;
  return base.replace(controlCharacters, '').trim().slice(0, 200);
}

/** Today's date where the photo was taken, estimated from the longitude (15° per hour, common practice). */
function localToday(now: Date, position: Position | null) {
  const shifted = new Date(now.getTime() + (position ? Math.round(position.lon / 15) : 0) * 3_600_000);
  return shifted.toISOString().slice(0, 10);
}

async function resolveContext(actor: Actor, request: IngestRequest, now: Date): Promise<Context> {
  assertMayRecord(actor);
  const pest = await findPestInOrganisation(actor.organisationId, request.pestId);
  if (!pest) throw badRequest('Choose a pest from your organisation’s pest library.', { pestId: 'That pest is not in the library.' });
  const walk = request.walkId ? await writableWalk(actor, request.walkId) : null;
  if (walk && request.fieldId && request.fieldId !== walk.fieldId)
    throw badRequest('That walk belongs to another field; choose the walk or the field, not both.');
  const field = walk ? { id: walk.fieldId, name: walk.fieldName } : request.fieldId ? await writableField(actor, request.fieldId) : null;
  return { actor, pestId: request.pestId, walk, field, writableIds: await visibleFieldIds(actor), now };
}

type Placement = { kind: 'field'; field: FieldRef; position: Position | null } | { kind: 'outcome'; outcome: Omit<PhotoOutcome, 'fileName' | 'clientId'> };

async function place(context: Context, reading: PhotoReading): Promise<Placement> {
  const { position } = reading;
  if (context.field) {
    if (!position) return { kind: 'field', field: context.field, position: null };
    if (await fieldContains(context.field.id, position)) return { kind: 'field', field: context.field, position };
    const near = await nearestField(context.actor.organisationId, position, [context.field.id]);
    return {
      kind: 'outcome',
      outcome: {
        outcome: 'outside',
        message: near
          ? `This photo was taken ${Math.round(near.distanceM)} m outside ${context.field.name}; nothing was kept. Check the photo, or pin it inside the field.`
          : `This photo was taken outside ${context.field.name}, the field of this walk; nothing was kept.`,
        ...(near ? { nearestField: near } : {}),
      },
    };
  }
  if (!position) {
    return {
      kind: 'outcome',
      outcome: {
        outcome: 'rejected',
        message: `${positionProblemSentence(reading.positionProblem ?? 'missing')}: choose the walk first, then send it again to pin it by hand.`,
      },
    };
  }
  const [inside] = await fieldsContaining(context.actor.organisationId, position, context.writableIds);
  if (inside) return { kind: 'field', field: inside, position };
  const [elsewhere] = context.writableIds ? await fieldsContaining(context.actor.organisationId, position, null) : [];
  if (elsewhere) {
    return {
      kind: 'outcome',
      outcome: {
        outcome: 'rejected',
        message: 'This photo was taken in a field you are not assigned to; nothing was kept. Ask an adviser to assign you to that field.',
      },
    };
  }
  const near = await nearestField(context.actor.organisationId, position, context.writableIds);
  return {
    kind: 'outcome',
    outcome: {
      outcome: 'outside',
      message: near
        ? `This photo was taken ${Math.round(near.distanceM)} m outside ${near.name}; nothing was kept. Choose that field's walk and pin it if it belongs there.`
        : 'This photo was taken outside every field assigned to you; nothing was kept.',
      ...(near ? { nearestField: near } : {}),
    },
  };
}

async function existingSighting(fieldId: string, sha256: string) {
  return (await findSightingOfPhotoHash(fieldId, sha256)) ?? null;
}

function duplicateOutcome(field: FieldRef, existing: { id: string; walkId: string; photoId: string }): Omit<PhotoOutcome, 'fileName' | 'clientId'> {
  return {
    outcome: 'duplicate',
    message: `This photo is already a sighting in ${field.name}; nothing new was added.`,
    sightingId: existing.id,
    photoId: existing.photoId,
    walkId: existing.walkId,
    fieldId: field.id,
    fieldName: field.name,
  };
}

const isUniqueViolation = (error: unknown) => (error as { parent?: { code?: string } }).parent?.code === '23505';

async function store(
  context: Context,
  photo: IncomingPhoto,
  source: PhotoSource,
  mimeType: PhotoMimeType,
  sha256: string,
  reading: PhotoReading,
  field: FieldRef,
  position: Position | null,
) {
  const { actor } = context;
  const walkedOn = reading.localDate ?? localToday(context.now, position);
  const storageKey = newStorageKey(actor.organisationId, extensionFor[mimeType], context.now);
  await writeStored(storageKey, source.body);
  try {
    return await sequelize.transaction(async (transaction) => {
      const walkId = context.walk?.id ?? (await findOrCreateWalk(actor, field.id, walkedOn, transaction)).id;
      const photoId = await insertPhoto(
        {
          org: actor.organisationId,
          userId: actor.id,
          sha256,
          storageKey,
          mimeType,
          byteSize: source.size,
          originalName: labelFromFileName(photo.fileName),
          exif: JSON.stringify(reading.kept),
        },
        { transaction },
      );
      const sightingId = await insertPhotoSighting(
        {
          org: actor.organisationId,
          fieldId: field.id,
          walkId,
          pestId: context.pestId,
          photoId,
          sha256,
          count: photo.count ?? null,
          hasPosition: position !== null,
          lon: position?.lon ?? 0,
          lat: position?.lat ?? 0,
          // A photo without a usable position waits for the scout's pin.
          positionSource: position ? 'exif' : 'pin',
          accuracyM: position ? reading.accuracyM : null,
          altitudeM: reading.altitudeM,
          directionDeg: reading.directionDeg,
          observedAt: reading.observedAt,
          timeFlag: reading.timeFlag,
          status: position ? 'placed' : 'needs-pin',
          userId: actor.id,
        },
        { transaction },
      );
      await recordAudit(
        actor,
        'create',
        'sighting',
        sightingId,
        { photoId, walkId, fieldId: field.id, status: position ? 'placed' : 'needs-pin' },
        transaction,
      );
      return { sightingId, photoId, walkId };
    });
  } catch (error) {
    // The row never committed: the file must not stay behind.
    await removeStored(storageKey);
    throw error;
  }
}

async function ingestOne(context: Context, photo: IncomingPhoto): Promise<Omit<PhotoOutcome, 'fileName' | 'clientId'>> {
  const { source, sha256 } = readable(photo);
  const type = await sniffPhotoType(source);
  if (!type.ok) return { outcome: 'rejected', message: type.message };
  const reading = await readPhotoExif(source, context.now);
  const placement = await place(context, reading);
  if (placement.kind === 'outcome') return placement.outcome;
  const { field, position } = placement;
  const existing = await existingSighting(field.id, sha256);
  if (existing) return duplicateOutcome(field, existing);
  let stored;
  try {
    stored = await store(context, photo, source, type.mimeType, sha256, reading, field, position);
  } catch (error) {
    if (!isUniqueViolation(error)) throw error;
    const winner = await existingSighting(field.id, sha256);
    if (!winner) throw error;
    return duplicateOutcome(field, winner);
  }
  const placed = position !== null;
  const timeNote =
    reading.timeFlag === 'future'
      ? ' Its time is in the future, so it was not trusted.'
      : reading.timeFlag === 'old'
        ? ' Its time is over two years old, so it was not trusted.'
        : '';
  return {
    outcome: placed ? 'placed' : 'needs-pin',
    message: placed
      ? `Placed in ${field.name}.${timeNote}`
      : `${positionProblemSentence(reading.positionProblem ?? 'missing')}: pin it on the map of ${field.name}.${timeNote}`,
    ...stored,
    fieldId: field.id,
    fieldName: field.name,
  };
}

/** Ingests a batch; each photo gets its own outcome, and one photo's failure never touches the others. */
export async function ingestPhotos(actor: Actor, request: IngestRequest, photos: IncomingPhoto[], now = new Date()): Promise<PhotoOutcome[]> {
  const context = await resolveContext(actor, request, now);
  const results: PhotoOutcome[] = [];
  for (const photo of photos) {
    const head = { ...(photo.clientId !== undefined ? { clientId: photo.clientId } : {}), fileName: labelFromFileName(photo.fileName) };
    try {
      results.push({ ...head, ...(await ingestOne(context, photo)) });
    } catch (error) {
      logger.error({ err: error, fileName: head.fileName }, 'photo ingest failed');
      // Not the photo's fault (storage or database not answering): the phone keeps it and sends it again later.
      results.push({
        ...head,
        outcome: 'retry',
        message: 'Patchwise could not save this photo just now; nothing was kept. It is sent again by itself in a little while.',
      });
    }
  }
  const stored = results.filter((r) => r.photoId && (r.outcome === 'placed' || r.outcome === 'needs-pin')).map((r) => r.photoId!);
  // A batch sent again after its connection was cut: photos stored by a process that died before queuing their
  // thumbnails come back as duplicates, and get their thumbnails queued now instead of at the next housekeeping.
  const duplicates = results.filter((r) => r.photoId && r.outcome === 'duplicate').map((r) => r.photoId!);
  // Like queuing itself, a failed look-up only delays them (housekeeping re-queues photos left pending).
  const resent = await photosAwaitingThumbnail(duplicates).catch(() => []);
  await requestThumbnails([...stored, ...resent]);
  return results;
}
