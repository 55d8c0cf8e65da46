// Zones as ISO 11783-10 task data (ISOXML v4): the field as a partfield and the zones as a treat /
// do-not-treat map for a sprayer terminal, written and zipped with the isoxml library.
import isoxml from 'isoxml';
import JSZip from 'jszip';
import type { ExtendedPartfield, Farm, Task } from 'isoxml';
import { MACHINE_FILE_CAUTION } from '../../../shared/notices/cautions.ts';
import type { ZoneFileSource } from './zone-file-source.ts';

const { ISOXMLManager, TAGS, TaskTaskStatusEnum, PolygonPolygonTypeEnum, ExtendedPolygon } = isoxml;
// The library types geometry with its own (older) turf; the GeoJSON objects are the same RFC 7946 shapes.
type LibraryGeometry = Parameters<typeof ExtendedPolygon.fromGeoJSON>[0];

// ISO 11783-11 data dictionary entry 289 (0x0121), "Setpoint Work State": 1 = on, 0 = off. A work state and
// no rate: the rate is the applicator's, from the product label.
export const SETPOINT_WORK_STATE_DDI = '0121';
export const TREAT_ZONE_CODE = 1;
export const DO_NOT_TREAT_ZONE_CODE = 0;

// ISOXML designators are at most 32 characters (ISO 11783-10, attribute type string(32)).
const designator = (text: string) => (text.length <= 32 ? text : `${text.slice(0, 31)}…`);

/** A zipped TASKDATA folder: TASKDATA.XML with farm, partfield and one planned task, plus a README.TXT. */
export async function zonesIsoxmlZip(source: ZoneFileSource): Promise<Buffer> {
  const manager = new ISOXMLManager({ fmisTitle: 'Patchwise', fmisVersion: '1.0' });
  const farm = manager.createEntityFromAttributes(TAGS.Farm, { FarmDesignator: designator(source.farmName) }) as Farm;
  const farmRef = manager.registerEntity(farm);

  const partfield = manager.createEntityFromAttributes(TAGS.Partfield, {
    PartfieldDesignator: designator(source.fieldName),
    PartfieldArea: Math.round(source.fieldAreaM2),
    FarmIdRef: farmRef,
  }) as ExtendedPartfield;
  partfield.boundaryFromGeoJSON(source.boundary as unknown as LibraryGeometry, manager);
  const partfieldRef = manager.registerEntity(partfield);

  const workState = (on: boolean) =>
    manager.createEntityFromAttributes(TAGS.ProcessDataVariable, { ProcessDataDDI: SETPOINT_WORK_STATE_DDI, ProcessDataValue: on ? 1 : 0 });
  const treatPolygons = source.zones.flatMap((zone) =>
    ExtendedPolygon.fromGeoJSON(zone.geometry as unknown as LibraryGeometry, PolygonPolygonTypeEnum.TreatmentZone, manager),
  );
  const treat = manager.createEntityFromAttributes(TAGS.TreatmentZone, {
    TreatmentZoneCode: TREAT_ZONE_CODE,
    TreatmentZoneDesignator: designator(`Treat: ${source.pestName}`),
    PolygonTreatmentZoneonly: treatPolygons,
    ProcessDataVariable: [workState(true)],
  });
  const doNotTreat = manager.createEntityFromAttributes(TAGS.TreatmentZone, {
    TreatmentZoneCode: DO_NOT_TREAT_ZONE_CODE,
    TreatmentZoneDesignator: 'Do not treat',
    ProcessDataVariable: [workState(false)],
  });
  const task = manager.createEntityFromAttributes(TAGS.Task, {
    TaskDesignator: designator(`${source.fieldName} zones v${source.version}`),
    TaskStatus: TaskTaskStatusEnum.Planned,
    FarmIdRef: farmRef,
    PartfieldIdRef: partfieldRef,
    TreatmentZone: [treat, doNotTreat],
    // Everywhere outside the zones, and wherever the position is lost, the boom stays off.
    DefaultTreatmentZoneCode: DO_NOT_TREAT_ZONE_CODE,
    OutOfFieldTreatmentZoneCode: DO_NOT_TREAT_ZONE_CODE,
    PositionLostTreatmentZoneCode: DO_NOT_TREAT_ZONE_CODE,
  }) as Task;
  manager.registerEntity(task);
  manager.rootElement.attributes.Farm = [farm];
  manager.rootElement.attributes.Partfield = [partfield];
  manager.rootElement.attributes.Task = [task];

  const zipped = await manager.saveISOXML();
  // The task data format has no free-text description, so the words travel beside it in the same zip.
  const zip = await JSZip.loadAsync(zipped);
  zip.file('TASKDATA/README.TXT', readme(source));
  return zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE' });
}

function readme(source: ZoneFileSource) {
  const zones = source.zones.map((z) => `  Zone ${z.number} (${z.label}): ${z.areaHa.toFixed(2)} ha (${z.areaAc.toFixed(2)} ac)`).join('\r\n');
  return [
    `Treatment zones for ${source.pestName} on ${source.fieldName}, ${source.farmName}; zone set version ${source.version}.`,
    `Task "${designator(`${source.fieldName} zones v${source.version}`)}": treatment zone ${TREAT_ZONE_CODE} = treat (work state on), ${DO_NOT_TREAT_ZONE_CODE} = do not treat (off, also outside the field and when the position is lost).`,
    zones,
    '',
    MACHINE_FILE_CAUTION,
    '',
  ].join('\r\n');
}
