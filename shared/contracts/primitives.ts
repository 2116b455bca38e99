import { z } from 'zod';

/**
 * Building blocks every contract uses for text, dates and counters, so that input the database
 * cannot store (U+0000, year 0 or past 9999, integers past 32 bits) is refused with a 400 naming
 * the field instead of failing deep in a query.
 */

/** Largest value of a PostgreSQL `integer` column (2^31 − 1). */
export const MAX_INT32 = 2_147_483_647;

/** Text that may be stored: anything but the NUL character, which PostgreSQL text cannot hold. */
export const safeTextSchema = z.string().refine((value) => !value.includes('\u0000'), { message: 'Text may not contain the NUL character (U+0000).' });

/** An optimistic-concurrency version: a whole number from 0 to 2^31 − 1. */
export const versionSchema = z
  .number({ message: 'Send the version number you loaded.' })
  .int({ message: 'The version is a whole number.' })
  .min(0, { message: 'The version is 0 or more.' })
  .max(MAX_INT32, { message: 'That version number is too large to be real; reload and try again.' });

function isRealCalendarDate(year: number, month: number, day: number): boolean {
  if (year < 1 || year > 9999) return false;
  const date = new Date(Date.UTC(2000, month - 1, day));
  date.setUTCFullYear(year);
  return date.getUTCFullYear() === year && date.getUTCMonth() === month - 1 && date.getUTCDate() === day;
}

/** A calendar day written YYYY-MM-DD that exists (no 13th month, no 30 February), years 0001–9999. */
export function calendarDateSchema(label: string) {
  return z
    .string()
    .regex(/^\d{4}-\d{2}-\d{2}$/, { message: `${label} must be YYYY-MM-DD.` })
    .refine(
      (value) => {
        const [year, month, day] = value.split('-').map(Number);
        return isRealCalendarDate(year ?? 0, month ?? 0, day ?? 0);
      },
      { message: `${label} must be a real calendar day between 0001-01-01 and 9999-12-31.` },
    );
}

/** An ISO 8601 time with an offset (e.g. 2027-04-18T12:00:00Z) on a real day, years 0001–9999 in UTC. */
export function isoTimeSchema(label: string) {
  return z
    .string()
    .datetime({ offset: true, message: `${label} must be an ISO 8601 time, e.g. 2027-04-18T12:00:00Z.` })
    .refine(
      (value) => {
        const [year, month, day] = value.slice(0, 10).split('-').map(Number);
        if (!isRealCalendarDate(year ?? 0, month ?? 0, day ?? 0)) return false;
        const utcYear = new Date(value).getUTCFullYear();
        return utcYear >= 1 && utcYear <= 9999;
      },
      { message: `${label} must be a real time between the years 0001 and 9999.` },
    );
}
