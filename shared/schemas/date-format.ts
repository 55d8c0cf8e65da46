// An organisation's date format, checked against what the JavaScript runtime's Intl knows (ECMA-402).
import { z } from 'zod';

/** True for a well-formed BCP 47 language tag (Intl.getCanonicalLocales throws a RangeError otherwise). */
export function isLocaleTag(tag: string) {
  try {
    return Intl.getCanonicalLocales(tag).length === 1;
  } catch {
    return false;
  }
}

/** True for a time zone of the IANA database that Intl accepts (it throws a RangeError for any other). */
export function isTimeZone(zone: string) {
  try {
    new Intl.DateTimeFormat('en', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

export const dateFormatSchema = z
  .object({
    locale: z
      .string({ error: 'Choose how dates are written, as a language tag such as en-GB or de-DE.' })
      .trim()
      .max(35, 'A language tag has at most 35 characters, such as en-GB or de-DE.')
      .refine(isLocaleTag, { error: 'That is not a language tag: write it like en-GB, en-US or de-DE.' })
      .transform((tag) => Intl.getCanonicalLocales(tag)[0]),
    timeZone: z
      .string({ error: 'Choose the time zone, such as Europe/London or America/Chicago.' })
      .trim()
      .max(64, 'A time zone name has at most 64 characters, such as Europe/London.')
      .refine(isTimeZone, { error: 'That time zone is not known: write it as an IANA name such as Europe/London or America/Chicago.' }),
  })
  .strict();
export type DateFormatSettings = z.output<typeof dateFormatSchema>;
