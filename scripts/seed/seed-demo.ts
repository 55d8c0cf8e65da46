// Seeds the demo scenario once; a second run finds the demo organisation and changes nothing.
import { sequelize } from '../../server/db.ts';
import { findOrganisationByName, insertOrganisation } from '../../server/queries/organisations.ts';
import { insertUser, listUsersOfOrganisation } from '../../server/queries/users.ts';
import { insertFarm, listFarmsOfOrganisation } from '../../server/queries/farms.ts';
import { insertContacts } from '../../server/queries/farm-contacts.ts';
import { insertFarmGrower } from '../../server/queries/farm-growers.ts';
import { insertField, listFieldsOfOrganisation } from '../../server/queries/fields.ts';
import { insertFieldAssignment } from '../../server/queries/field-assignments.ts';
import { insertPest, listPestsOfOrganisation } from '../../server/queries/pests.ts';
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
  const existing = await findOrganisationByName(demoOrganisationName);
  if (existing) return { created: false, ids: await loadDemoIds(existing.id) };

  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const ids = await sequelize.transaction(async (transaction) => {
    const organisation = await insertOrganisation(demoOrganisationName, { transaction });
    const organisationId = organisation.id;
    const users: Record<string, string> = {};
    for (const u of demoUsers) {
      const user = await insertUser({ organisationId, name: u.name, email: u.email, role: u.role, passwordHash }, { transaction });
      users[u.key] = user.id;
    }
    const farms: Record<string, string> = {};
    for (const f of demoFarms) {
      const farm = await insertFarm({ organisationId, name: f.name }, { transaction });
      farms[f.key] = farm.id;
      await insertContacts(farm.id, f.contacts, { transaction });
      if (f.growerKey) await insertFarmGrower(farm.id, users[f.growerKey], { transaction });
    }
    const fields: Record<string, string> = {};
    for (const f of demoFields) {
      const fieldId = await insertField(
        { organisationId, farmId: farms[f.farmKey], name: f.name, crop: f.crop, season: f.season, boundary: f.boundary },
        { transaction },
      );
      fields[f.key] = fieldId;
      await insertFieldAssignment(fieldId, users.scout, { transaction });
    }
    const pests: Record<string, string> = {};
    for (const p of pestLibrarySeed) {
      const pest = await insertPest({ ...p, organisationId }, { transaction });
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
    (await listUsersOfOrganisation(organisationId)).map((u) => [demoUsers.find((d) => d.email === u.email)?.key ?? u.email, u.id]),
  );
  const farms = Object.fromEntries(
    (await listFarmsOfOrganisation(organisationId, null)).map((f) => [demoFarms.find((d) => d.name === f.name)?.key ?? f.name, f.id]),
  );
  const fieldRows = await listFieldsOfOrganisation(organisationId, null, undefined);
  const fields = Object.fromEntries(fieldRows.map((f) => [demoFields.find((d) => d.name === f.name)?.key ?? f.name, f.id]));
  const pests = Object.fromEntries((await listPestsOfOrganisation(organisationId, true)).map((p) => [p.name, p.id]));
  return { organisationId, users, farms, fields, pests };
}

export const demoAccounts = () => demoUsers.map((u) => ({ role: u.role, email: u.email, password: DEMO_PASSWORD }));
