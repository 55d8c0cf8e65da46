// How the actor's organisation writes dates (its locale and time zone): read for every page, changed by an admin.
import type { Actor } from '../auth/passport.ts';
import { findOrganisationDateFormat, updateOrganisationDateFormat } from '../queries/organisations.ts';
import { DEFAULT_DATE_FORMAT, type DateFormat } from '../../shared/dates/format-dates.ts';
import { notFound } from '../errors.ts';

/** The signed-in actor's organisation's date format (read with the session when it can be); a visitor gets the default one. */
export async function dateFormatOf(actor: Pick<Actor, 'organisationId' | 'dateFormat'> | undefined): Promise<DateFormat> {
  if (!actor) return DEFAULT_DATE_FORMAT;
  if (actor.dateFormat) return actor.dateFormat;
  return (await findOrganisationDateFormat(actor.organisationId)) ?? DEFAULT_DATE_FORMAT;
}

export async function changeDateFormat(actor: Actor, format: DateFormat): Promise<DateFormat> {
  const stored = await updateOrganisationDateFormat(actor.organisationId, format);
  if (!stored) throw notFound('Your organisation');
  return stored;
}
