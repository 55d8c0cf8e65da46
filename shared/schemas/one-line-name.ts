import { z } from 'zod';

// Control characters (Unicode Cc: C0, DEL, C1; line breaks among them) and the line and paragraph separators, with
// the spaces around them: a name is one line of text in e-mail headers, CSV exports, tables and logs.
const CONTROL_RUN = /\s*[\p{Cc}\u2028\u2029]+\s*/gu;

export const withoutControlCharacters = (text: string) => text.replace(CONTROL_RUN, ' ');

/** A name typed by a person: one line, trimmed, between 1 and `max` characters. */
export function oneLineNameSchema(emptyMessage: string, max = 120, tooLongMessage = `Keep it to ${max} characters or fewer.`) {
  return z.string({ error: emptyMessage }).overwrite(withoutControlCharacters).trim().min(1, { error: emptyMessage }).max(max, { error: tooLongMessage });
}
