import { selectRow, type InTransaction } from './sql.ts';

export interface OrganisationRow {
  id: string;
  name: string;
}

export const findOrganisation = (id: string, options: InTransaction = {}) =>
  selectRow<OrganisationRow>('SELECT id, name FROM organisations WHERE id = :id', { id }, options);

export const findOrganisationByName = (name: string, options: InTransaction = {}) =>
  selectRow<OrganisationRow>('SELECT id, name FROM organisations WHERE name = :name LIMIT 1', { name }, options);

export const insertOrganisation = async (name: string, options: InTransaction = {}) =>
  (await selectRow<OrganisationRow>('INSERT INTO organisations (name) VALUES (:name) RETURNING id, name', { name }, options))!;
