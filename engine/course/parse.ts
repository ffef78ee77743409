/** Zod parsing that fails with an error message naming each problem and where it is. */
import { z } from 'zod';

export function parseOrThrow<S extends z.ZodType>(
  schema: S,
  input: unknown,
  what: string,
  makeError: (message: string) => Error = (m) => new Error(m),
): z.output<S> {
  const parsed = schema.safeParse(input);
  if (parsed.success) return parsed.data;
  throw makeError(`invalid ${what}:\n${z.prettifyError(parsed.error)}`);
}
