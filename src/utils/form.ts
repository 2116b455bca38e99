import type { z } from 'zod';
import { err, ok, type Result } from '../../shared/result';
import { fieldErrorsFrom, isApiError, issuesFromZod, type FieldErrors } from '../lib/api-client';

/** Checks form values with the shared contract schema; failures come back keyed by field path. */
export function parseForm<T>(schema: z.ZodType<T>, values: unknown): Result<T, FieldErrors> {
  const parsed = schema.safeParse(values);
  return parsed.success ? ok(parsed.data) : err(fieldErrorsFrom(issuesFromZod(parsed.error)));
}

export interface FormFailure {
  /** Messages to show beside fields, keyed by dotted path. */
  fields: FieldErrors;
  /** A message for the top of the form. */
  message: string;
}

const FALLBACK = 'That did not work. Please try again.';

/** Splits a failed submit into field messages and one form-level message. */
export function formFailureFrom(error: unknown): FormFailure {
  if (isApiError(error)) return { fields: fieldErrorsFrom(error.issues), message: error.message };
  return { fields: {}, message: FALLBACK };
}
