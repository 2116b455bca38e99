/**
 * Outlook valid periods. An outlook day runs from 06:00 to 06:00 office local time (our
 * convention; the author may edit it). Day 1 starts at the issuance time and ends at the end of
 * the outlook day containing it; Days 2 and 3 are the following full outlook days.
 */
export const outlookDayStartHour = 6;

/** Offset of `timeZone` from UTC at `instant`, in milliseconds (positive east of Greenwich). */
export function timeZoneOffsetMs(instant: number, timeZone: string): number {
  const parts = new Intl.DateTimeFormat('en-US', {
    timeZone,
    hourCycle: 'h23',
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
    hour: '2-digit',
    minute: '2-digit',
    second: '2-digit',
  }).formatToParts(new Date(instant));
  const get = (type: string) => Number(parts.find((p) => p.type === type)?.value ?? 0);
  const asUtc = Date.UTC(get('year'), get('month') - 1, get('day'), get('hour'), get('minute'), get('second'));
  return asUtc - Math.floor(instant / 1000) * 1000;
}

/** The UTC instant of a local wall-clock time in `timeZone` (DST handled by re-checking the offset). */
export function zonedTimeToUtc(year: number, month: number, day: number, hour: number, timeZone: string): number {
  const guess = Date.UTC(year, month - 1, day, hour);
  const first = guess - timeZoneOffsetMs(guess, timeZone);
  return guess - timeZoneOffsetMs(first, timeZone);
}

/** The local calendar date of an instant in `timeZone`. */
export function localDate(instant: number, timeZone: string): { year: number; month: number; day: number; hour: number } {
  const local = new Date(instant + timeZoneOffsetMs(instant, timeZone));
  return { year: local.getUTCFullYear(), month: local.getUTCMonth() + 1, day: local.getUTCDate(), hour: local.getUTCHours() };
}

/** The valid period of a Day 1, 2 or 3 outlook issued at `issuedAt` by an office in `timeZone`. */
export function validPeriod(day: 1 | 2 | 3 | number, issuedAt: Date, timeZone: string): { validFrom: Date; validUntil: Date } {
  const local = localDate(issuedAt.getTime(), timeZone);
  // The outlook day containing the issuance starts at 06:00 local on this date, or the day before.
  const startDate = new Date(Date.UTC(local.year, local.month - 1, local.day - (local.hour < outlookDayStartHour ? 1 : 0)));
  const dayStart = (offsetDays: number) => {
    const d = new Date(startDate.getTime() + offsetDays * 86_400_000);
    return new Date(zonedTimeToUtc(d.getUTCFullYear(), d.getUTCMonth() + 1, d.getUTCDate(), outlookDayStartHour, timeZone));
  };
  const validFrom = day === 1 ? new Date(Math.floor(issuedAt.getTime() / 60_000) * 60_000) : dayStart(day - 1);
  return { validFrom, validUntil: dayStart(day) };
}
