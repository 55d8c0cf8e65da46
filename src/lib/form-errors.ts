// Field-by-field messages for a form, from the shared zod schema first and the server's answer second.
// Hand-written because no form library is installed; it is only the mapping from issues to inputs.
import type { z } from 'zod';
import { ApiError } from './api-client.ts';

export type FieldErrors = Record<string, string>;

export function zodFieldErrors(error: z.ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.join('.') || '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

/** Parses form values with a shared schema: the parsed value, or the messages to show beside each input. */
export function checkForm<S extends z.ZodType>(schema: S, values: unknown): { ok: true; value: z.output<S> } | { ok: false; errors: FieldErrors } {
  const result = schema.safeParse(values);
  return result.success ? { ok: true, value: result.data } : { ok: false, errors: zodFieldErrors(result.error) };
}

export function serverFieldErrors(error: unknown): FieldErrors {
  return error instanceof ApiError ? error.fields : {};
}

export function errorMessage(error: unknown): string {
  if (error instanceof Error) return error.message;
  return 'Something went wrong; try again.';
}
