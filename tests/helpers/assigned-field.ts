// An organisation whose scout is assigned one rectangular field and whose library holds one pest, made through the
// API as an admin would: the set-up every scout journey starts from.
import { signedIn } from './http.ts';
import { makeOrganisation, type TestOrganisation } from './org.ts';
import { createFarm, createField, createPest } from './farm-records.ts';
import { rectangleBoundary } from './sightings.ts';

export interface AssignedField {
  org: TestOrganisation;
  pest: { id: string; name: string };
  fieldId: string;
}

export async function organisationWithAssignedField(label: string, fieldName: string): Promise<AssignedField> {
  const org = await makeOrganisation(label);
  const admin = await signedIn(org.users.admin.email);
  const pest = await createPest(admin, { countUnit: 'aphids per plant' });
  const farm = await createFarm(admin);
  const fieldId = (await createField(admin, farm.id, rectangleBoundary(), { name: fieldName })).id;
  await admin.post(`/api/fields/${fieldId}/scouts`, { userId: org.users.scout.id }).expect(204);
  return { org, pest, fieldId };
}
