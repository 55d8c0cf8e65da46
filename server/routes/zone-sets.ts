import { Router } from 'express';
import { z } from 'zod';
import { requireRole, actor } from '../middleware/access.ts';
import { parse } from '../middleware/validate.ts';
import { zoneProposalSchema, zoneSetCreateSchema } from '../../shared/schemas/zones.ts';
import { createZoneSet, getZoneSet, listZoneSets } from '../services/zone-sets.ts';
import { proposeZones } from '../services/zone-proposals.ts';
import { exportFileName, zonesGeoJson, zonesKml } from '../services/zone-export.ts';
import { machineFile } from '../services/zone-files/zone-machine-files.ts';
import { sendMachineFile } from './machine-file-response.ts';

/** Zone proposals from a check, and the accepted, versioned zone sets of a field (mounted at /api). */
export const zoneSetsRouter = Router();
const idParam = (what: string) => z.object({ id: z.uuid({ error: `That ${what} id is not valid.` }) });

zoneSetsRouter.post('/checks/:id/zone-proposal', requireRole('admin', 'adviser'), async (req, res) => {
  res.json({ zones: await proposeZones(actor(req), parse(idParam('check'), req.params).id, parse(zoneProposalSchema, req.body)) });
});

zoneSetsRouter.post('/fields/:id/zone-sets', requireRole('admin', 'adviser'), async (req, res) => {
  res.status(201).json(await createZoneSet(actor(req), parse(idParam('field'), req.params).id, parse(zoneSetCreateSchema, req.body)));
});

zoneSetsRouter.get('/fields/:id/zone-sets', requireRole('admin', 'adviser', 'grower'), async (req, res) => {
  res.json({ zoneSets: await listZoneSets(actor(req), parse(idParam('field'), req.params).id) });
});

zoneSetsRouter.get('/zone-sets/:id', requireRole('admin', 'adviser', 'grower'), async (req, res) => {
  res.json({ zoneSet: await getZoneSet(actor(req), parse(idParam('zone set'), req.params).id) });
});

zoneSetsRouter.get('/zone-sets/:id/export.geojson', requireRole('admin', 'adviser', 'grower'), async (req, res) => {
  const zoneSet = await getZoneSet(actor(req), parse(idParam('zone set'), req.params).id);
  res.setHeader('Content-Type', 'application/geo+json');
  res.setHeader('Content-Disposition', `attachment; filename="${exportFileName(`${zoneSet.fieldName} ${zoneSet.pestName}`, zoneSet.version, 'geojson')}"`);
  res.send(JSON.stringify(zonesGeoJson(zoneSet)));
});

zoneSetsRouter.get('/zone-sets/:id/export.kml', requireRole('admin', 'adviser', 'grower'), async (req, res) => {
  const zoneSet = await getZoneSet(actor(req), parse(idParam('zone set'), req.params).id);
  res.setHeader('Content-Type', 'application/vnd.google-earth.kml+xml');
  res.setHeader('Content-Disposition', `attachment; filename="${exportFileName(`${zoneSet.fieldName} ${zoneSet.pestName}`, zoneSet.version, 'kml')}"`);
  res.send(zonesKml(zoneSet, `${zoneSet.fieldName}, ${zoneSet.pestName}`));
});

zoneSetsRouter.get('/zone-sets/:id/export.taskdata.zip', requireRole('admin', 'adviser', 'grower'), async (req, res) => {
  const zoneSet = await getZoneSet(actor(req), parse(idParam('zone set'), req.params).id);
  sendMachineFile(res, await machineFile(zoneSet, 'taskdata'));
});

zoneSetsRouter.get('/zone-sets/:id/export.shp.zip', requireRole('admin', 'adviser', 'grower'), async (req, res) => {
  const zoneSet = await getZoneSet(actor(req), parse(idParam('zone set'), req.params).id);
  sendMachineFile(res, await machineFile(zoneSet, 'shapefile'));
});
