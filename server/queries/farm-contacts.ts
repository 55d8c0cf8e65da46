import { execute, selectRows, type InTransaction } from './sql.ts';

export interface FarmContactRow {
  id: string;
  farmId: string;
  name: string;
  email: string;
}

const CONTACT_COLUMNS = 'id, farm_id AS "farmId", name, email';

/** The contacts of these farms, by name. */
export const listContactsOfFarms = (farmIds: string[], options: InTransaction = {}) =>
  farmIds.length
    ? selectRows<FarmContactRow>(`SELECT ${CONTACT_COLUMNS} FROM farm_contacts WHERE farm_id IN (:farmIds) ORDER BY name ASC`, { farmIds }, options)
    : Promise.resolve([]);

/** One farm's contacts in the order they were stored. */
export const listContactsOfFarm = (farmId: string, options: InTransaction = {}) =>
  selectRows<FarmContactRow>(`SELECT ${CONTACT_COLUMNS} FROM farm_contacts WHERE farm_id = :farmId`, { farmId }, options);

/** Stores the contacts in the given order; addresses trimmed and in lower case. */
export async function insertContacts(farmId: string, contacts: { name: string; email: string }[], options: InTransaction = {}) {
  if (!contacts.length) return;
  const replacements: Record<string, unknown> = { farmId };
  const values = contacts.map((c, i) => {
    replacements[`name${i}`] = c.name;
    replacements[`email${i}`] = c.email.trim().toLowerCase();
    return `(:farmId, :name${i}, :email${i})`;
  });
  await execute(`INSERT INTO farm_contacts (farm_id, name, email) VALUES ${values.join(', ')}`, replacements, options);
}

export const deleteContactsOfFarm = (farmId: string, options: InTransaction = {}) =>
  execute('DELETE FROM farm_contacts WHERE farm_id = :farmId', { farmId }, options);

/** The grower contacts of the farm a field lies on, by name. */
export const listContactsOfFieldFarm = (fieldId: string, options: InTransaction = {}) =>
  selectRows<{ id: string; name: string; email: string }>(
    `SELECT c.id, c.name, c.email FROM farm_contacts c JOIN fields f ON f.farm_id = c.farm_id WHERE f.id = :fieldId ORDER BY c.name`,
    { fieldId },
    options,
  );
