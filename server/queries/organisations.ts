import { selectRow, type InTransaction } from './sql.ts';
import type { DateFormat } from '../../shared/dates/format-dates.ts';

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

/** How the organisation writes dates: its locale and IANA time zone. */
export const findOrganisationDateFormat = (id: string, options: InTransaction = {}) =>
  selectRow<DateFormat>('SELECT locale, time_zone AS "timeZone" FROM organisations WHERE id = :id', { id }, options);

export const updateOrganisationDateFormat = (id: string, format: DateFormat, options: InTransaction = {}) =>
  selectRow<DateFormat>(
    'UPDATE organisations SET locale = :locale, time_zone = :timeZone WHERE id = :id RETURNING locale, time_zone AS "timeZone"',
    { id, locale: format.locale, timeZone: format.timeZone },
    options,
  );
