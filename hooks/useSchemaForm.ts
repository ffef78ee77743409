import { useState } from 'react';
import type { ZodType } from 'zod';
import { fieldMessages } from '../schemas/errors';
import { ApiError } from './api';

/**
 * Form state checked by the same zod schema the server uses, so a field message reads the same
 * whether the browser or the server found the problem.
 */
export function useSchemaForm<T extends Record<string, string>, Out>(schema: ZodType<Out>, initial: T) {
  const [values, setValues] = useState<T>(initial);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);

  function set<K extends keyof T>(key: K, value: T[K]) {
    setValues((v) => ({ ...v, [key]: value }));
    if (errors[key as string]) setErrors(({ [key as string]: _gone, ...rest }) => rest);
  }

  /** The parsed input when valid; otherwise null, with the messages shown beside their fields. */
  function validate(): Out | null {
    const result = schema.safeParse(values);
    if (result.success) {
      setErrors({});
      setFormError(null);
      return result.data;
    }
    setErrors(fieldMessages(result.error.issues));
    return null;
  }

  function showServerError(err: unknown) {
    if (err instanceof ApiError) {
      setErrors(err.fields);
      setFormError(Object.keys(err.fields).length ? null : err.message);
    } else {
      setFormError('Something went wrong. Try again.');
    }
  }

  return { values, errors, formError, set, validate, showServerError };
}
