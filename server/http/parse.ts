import type { z } from 'zod';
import { z as zod } from 'zod';

/** Parses with a shared schema; a ZodError reaches the error middleware as a 400 with field paths. */
export function parse<S extends z.ZodType>(schema: S, data: unknown): z.infer<S> {
  return schema.parse(data);
}

const idSchema = zod.coerce.number({ error: 'Must be a number' }).int('Must be a whole number').positive('Must be positive').max(2_147_483_647, 'Too large');

/** A numeric route parameter such as `:id`; anything else is a 400 naming the parameter. */
export function idParam(params: Record<string, string | string[]>, name = 'id'): number {
  return zod.object({ [name]: idSchema }).parse(params)[name] as number;
}
