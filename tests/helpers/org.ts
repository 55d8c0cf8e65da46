// Each test builds its own organisation, so tests never lean on each other or on the demo seed.
import crypto from 'node:crypto';
import { insertOrganisation } from '../../server/queries/organisations.ts';
import { insertUser } from '../../server/queries/users.ts';
import { hashPassword } from '../../server/auth/passwords.ts';
import type { Role } from '../../shared/schemas/roles.ts';

export const TEST_PASSWORD = 'correct-horse-battery-staple';
let passwordHash: Promise<string> | null = null;

export interface TestOrganisation {
  id: string;
  name: string;
  users: Record<Role, { id: string; email: string; name: string }>;
}

export async function makeOrganisation(label = 'Test'): Promise<TestOrganisation> {
  passwordHash ??= hashPassword(TEST_PASSWORD);
  const tag = crypto.randomBytes(4).toString('hex');
  const organisation = await insertOrganisation(`${label} advisory ${tag}`);
  const users = {} as TestOrganisation['users'];
  for (const role of ['admin', 'adviser', 'scout', 'grower'] as const) {
    const user = await insertUser({
      organisationId: organisation.id,
      name: `${role} ${tag}`,
      email: `${role}-${tag}@test.example`,
      role,
      passwordHash: await passwordHash,
    });
    users[role] = { id: user.id, email: user.email, name: user.name };
  }
  return { id: organisation.id, name: organisation.name, users };
}

/** One more user of the role in the organisation (a second scout, say), signed in with the test password. */
export async function addUser(org: TestOrganisation, role: Role) {
  passwordHash ??= hashPassword(TEST_PASSWORD);
  const tag = crypto.randomBytes(4).toString('hex');
  const user = await insertUser({
    organisationId: org.id,
    name: `${role} ${tag}`,
    email: `${role}-${tag}@test.example`,
    role,
    passwordHash: await passwordHash,
  });
  return { id: user.id, email: user.email, name: user.name };
}
