import type { ZodType, z } from 'zod';
import { fromZod } from '../errors.ts';

/** Parses a request part with a shared zod schema, throwing the API's own 400 error. */
export function parse<S extends ZodType>(schema: S, value: unknown): z.infer<S> {
  const result = schema.safeParse(value);
  if (!result.success) throw fromZod(result.error);
  return result.data;
}
