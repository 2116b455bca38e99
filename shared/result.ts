/**
 * A value that is either a success or a failure, as data rather than an exception.
 * Operations that can fail for expected reasons (parse, validate, import) return this.
 */
export type Result<T, E> = { ok: true; value: T } | { ok: false; error: E };

export const ok = <T>(value: T): Result<T, never> => ({ ok: true, value });
export const err = <E>(error: E): Result<never, E> => ({ ok: false, error });
