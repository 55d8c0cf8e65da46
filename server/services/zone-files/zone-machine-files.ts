// One entry for the sprayer-ready files of a zone set: which file, its name and its bytes.
import type { ZoneSetView } from '../../../shared/schemas/zones.ts';
import { findNoticeZoneSetRef } from '../../queries/notices.ts';
import { notFound } from '../../errors.ts';
import { exportFileName } from '../zone-export.ts';
import { zoneSetInOrganisation } from '../zone-sets.ts';
import { zoneFileSource } from './zone-file-source.ts';
import { zonesIsoxmlZip } from './zone-isoxml.ts';
import { zonesShapefileZip } from './zone-shapefile.ts';

export const machineFileKinds = ['taskdata', 'shapefile'] as const;
export type MachineFileKind = (typeof machineFileKinds)[number];

/** The file name part after the zone set's name: it says the format, the extension says it is a zip. */
export const machineFileSuffix: Record<MachineFileKind, string> = { taskdata: 'taskdata.zip', shapefile: 'shp.zip' };

export interface MachineFile {
  fileName: string;
  contentType: 'application/zip';
  bytes: Buffer;
}

export async function machineFile(zoneSet: ZoneSetView, kind: MachineFileKind): Promise<MachineFile> {
  const source = await zoneFileSource(zoneSet);
  const title = `${zoneSet.fieldName} ${zoneSet.pestName}`;
  const bytes =
    kind === 'taskdata'
      ? await zonesIsoxmlZip(source)
      : await zonesShapefileZip(source, exportFileName(title, zoneSet.version, 'zones').replace(/\.zones$/, '-zones'));
  return { fileName: exportFileName(title, zoneSet.version, machineFileSuffix[kind]), contentType: 'application/zip', bytes };
}

/** The files of the zones a notice was sent with (for its e-mailed link and the grower's own page). */
export async function noticeMachineFile(noticeId: string, kind: MachineFileKind): Promise<MachineFile> {
  const notice = await findNoticeZoneSetRef(noticeId);
  const zoneSet = notice ? await zoneSetInOrganisation(notice.organisation_id, notice.zone_set_id) : null;
  if (!zoneSet) throw notFound('The zones of that notice');
  return machineFile(zoneSet, kind);
}

/** Paths of a notice's zone files under a base (the link's or the grower's notice path). */
export const noticeMachineFilePaths = (base: string) => ({
  taskData: `${base}/zones.${machineFileSuffix.taskdata}`,
  shapefile: `${base}/zones.${machineFileSuffix.shapefile}`,
});
