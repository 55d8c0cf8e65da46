import type { Role } from '../../shared/schemas/roles.ts';
import { selectRow, selectRows, type InTransaction } from './sql.ts';
import { queryPool } from './pool.ts';

export interface UserRow {
  id: string;
  organisationId: string;
  name: string;
  email: string;
  passwordHash: string | null;
  role: Role;
  active: boolean;
  createdAt: Date;
}

const USER_COLUMNS = `id, organisation_id AS "organisationId", name, email, password_hash AS "passwordHash", role, active, created_at AS "createdAt"`;

// Addresses are stored trimmed and in lower case, so sign-in and invitations compare them as typed.
const storedEmail = (email: string) => email.trim().toLowerCase();

export const findUser = (id: string, options: InTransaction = {}) => selectRow<UserRow>(`SELECT ${USER_COLUMNS} FROM users WHERE id = :id`, { id }, options);

export const findUserInOrganisation = (organisationId: string, id: string, options: InTransaction = {}) =>
  selectRow<UserRow>(`SELECT ${USER_COLUMNS} FROM users WHERE id = :id AND organisation_id = :organisationId`, { id, organisationId }, options);

export const findUserByEmail = (email: string, options: InTransaction = {}) =>
  selectRow<UserRow>(`SELECT ${USER_COLUMNS} FROM users WHERE email = :email LIMIT 1`, { email }, options);

export const listUsersOfOrganisation = (organisationId: string, options: InTransaction = {}) =>
  selectRows<UserRow>(`SELECT ${USER_COLUMNS} FROM users WHERE organisation_id = :organisationId ORDER BY name ASC`, { organisationId }, options);

/** Id and name of each of these users (any organisation: the ids come from the caller's own rows). */
export const findUserNames = (ids: string[], options: InTransaction = {}) =>
  ids.length ? selectRows<{ id: string; name: string }>('SELECT id, name FROM users WHERE id IN (:ids)', { ids }, options) : Promise.resolve([]);

export interface NewUser {
  organisationId: string;
  name: string;
  email: string;
  role: Role;
  passwordHash: string | null;
}

export const insertUser = async (user: NewUser, options: InTransaction = {}) =>
  (await selectRow<UserRow>(
    `INSERT INTO users (organisation_id, name, email, role, password_hash) VALUES (:organisationId, :name, :email, :role, :passwordHash) RETURNING ${USER_COLUMNS}`,
    { ...user, email: storedEmail(user.email) },
    options,
  ))!;

export interface UserChanges {
  name?: string;
  role?: Role;
  active?: boolean;
  passwordHash?: string;
}

const userColumn: Record<keyof UserChanges, string> = { name: 'name', role: 'role', active: 'active', passwordHash: 'password_hash' };

/** Writes the given columns (only those present) and returns the row as stored. */
export const updateUser = async (id: string, changes: UserChanges, options: InTransaction = {}) => {
  const keys = (Object.keys(changes) as (keyof UserChanges)[]).filter((k) => k in userColumn && changes[k] !== undefined);
  const sets = keys.map((k) => `${userColumn[k]} = :${k}`).join(', ');
  return (await selectRow<UserRow>(
    `UPDATE users SET ${sets ? `${sets}, ` : ''}updated_at = now() WHERE id = :id RETURNING ${USER_COLUMNS}`,
    { ...changes, id },
    options,
  ))!;
};

export interface ActorRow {
  id: string;
  organisationId: string;
  role: Role;
  name: string;
  email: string;
}

/**
 * The signed-in user behind a session, or null when the account is gone or deactivated: one indexed read of five
 * columns per request, straight on the pg pool, since Sequelize's query path costs more than the query itself.
 */
export async function findActiveActor(id: string): Promise<ActorRow | null> {
  const { rows } = await queryPool.query<ActorRow>(`SELECT id, organisation_id AS "organisationId", role, name, email FROM users WHERE id = $1 AND active`, [
    id,
  ]);
  return rows[0] ?? null;
}
