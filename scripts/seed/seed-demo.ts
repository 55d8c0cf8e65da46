// Seeds the demo scenario once; a second run finds the demo organisation and changes nothing.
import { QueryTypes } from 'sequelize';
import { sequelize } from '../../server/db.ts';
import { Organisation } from '../../server/models/organisation.ts';
import { User } from '../../server/models/user.ts';
import { Farm } from '../../server/models/farm.ts';
import { FarmContact } from '../../server/models/farm-contact.ts';
import { FarmGrower } from '../../server/models/farm-grower.ts';
import { FieldAssignment } from '../../server/models/field-assignment.ts';
import { Pest } from '../../server/models/pest.ts';
import { hashPassword } from '../../server/auth/passwords.ts';
import { DEMO_PASSWORD, demoFarms, demoFields, demoOrganisationName, demoUsers } from './demo-scenario.ts';
import { pestLibrarySeed } from './pest-library.ts';
import { seedPhotos } from './seed-photos.ts';

export interface DemoIds {
  organisationId: string;
  users: Record<string, string>;
  farms: Record<string, string>;
  fields: Record<string, string>;
  pests: Record<string, string>;
}

export async function seedDemo(): Promise<{ created: boolean; ids: DemoIds }> {
  const existing = await Organisation.findOne({ where: { name: demoOrganisationName } });
  if (existing) return { created: false, ids: await loadDemoIds(existing.id) };

  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const ids = await sequelize.transaction(async (transaction) => {
    const organisation = await Organisation.create({ name: demoOrganisationName }, { transaction });
    const organisationId = organisation.id;
    const users: Record<string, string> = {};
    for (const u of demoUsers) {
      const user = await User.create({ organisationId, name: u.name, email: u.email, role: u.role, passwordHash }, { transaction });
      users[u.key] = user.id;
    }
    const farms: Record<string, string> = {};
    for (const f of demoFarms) {
      const farm = await Farm.create({ organisationId, name: f.name }, { transaction });
      farms[f.key] = farm.id;
      await FarmContact.bulkCreate(
        f.contacts.map((c) => ({ ...c, farmId: farm.id })),
        { transaction },
      );
      if (f.growerKey) await FarmGrower.create({ farmId: farm.id, userId: users[f.growerKey] }, { transaction });
    }
    const fields: Record<string, string> = {};
    for (const f of demoFields) {
      const [row] = await sequelize.query<{ id: string }>(
        `INSERT INTO fields (organisation_id, farm_id, name, crop, season, boundary)
         VALUES (:org, :farm, :name, :crop, :season, ST_Multi(ST_SetSRID(ST_GeomFromGeoJSON(:geojson), 4326))) RETURNING id`,
        {
          replacements: { org: organisationId, farm: farms[f.farmKey], name: f.name, crop: f.crop, season: f.season, geojson: JSON.stringify(f.boundary) },
          type: QueryTypes.SELECT,
          transaction,
        },
      );
      fields[f.key] = row.id;
      await FieldAssignment.create({ fieldId: row.id, userId: users.scout }, { transaction });
    }
    const pests: Record<string, string> = {};
    for (const p of pestLibrarySeed) {
      const pest = await Pest.create({ ...p, organisationId }, { transaction });
      pests[p.name] = pest.id;
    }
    return { organisationId, users, farms, fields, pests };
  });
  // Photos go through the upload service (files, walks, sightings) after the scenario's rows are committed.
  await seedPhotos(ids);
  return { created: true, ids };
}

async function loadDemoIds(organisationId: string): Promise<DemoIds> {
  const users = Object.fromEntries(
    (await User.findAll({ where: { organisationId } })).map((u) => [demoUsers.find((d) => d.email === u.email)?.key ?? u.email, u.id]),
  );
  const farms = Object.fromEntries(
    (await Farm.findAll({ where: { organisationId } })).map((f) => [demoFarms.find((d) => d.name === f.name)?.key ?? f.name, f.id]),
  );
  const fieldRows = await sequelize.query<{ id: string; name: string }>('SELECT id, name FROM fields WHERE organisation_id = :organisationId', {
    replacements: { organisationId },
    type: QueryTypes.SELECT,
  });
  const fields = Object.fromEntries(fieldRows.map((f) => [demoFields.find((d) => d.name === f.name)?.key ?? f.name, f.id]));
  const pests = Object.fromEntries((await Pest.findAll({ where: { organisationId } })).map((p) => [p.name, p.id]));
  return { organisationId, users, farms, fields, pests };
}

export const demoAccounts = () => demoUsers.map((u) => ({ role: u.role, email: u.email, password: DEMO_PASSWORD }));
