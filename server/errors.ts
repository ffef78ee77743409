import { ZodError } from 'zod';
import { fieldMessages } from '../schemas/errors';

/** An error meant for the client: its status, a stable code and a message a person can act on. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
  }
}

export const notFound = (what = 'That') => new HttpError(404, 'not_found', `${what} was not found.`);
export const forbidden = (message = 'Your role does not allow this.') => new HttpError(403, 'forbidden', message);
export const unauthenticated = () => new HttpError(401, 'unauthenticated', 'Sign in to continue.');

export function validationError(error: ZodError): HttpError {
  const fields = fieldMessages(error.issues);
  const first = Object.values(fields)[0] ?? 'Some fields need attention.';
  return new HttpError(400, 'invalid_input', first, fields);
}

/** Parses a request part with a zod schema, turning failures into a 400 with field messages. */
export function parseWith<T>(schema: { safeParse(v: unknown): { success: true; data: T } | { success: false; error: ZodError } }, value: unknown): T {
  const result = schema.safeParse(value ?? {});
  if (!result.success) throw validationError(result.error);
  return result.data;
}
