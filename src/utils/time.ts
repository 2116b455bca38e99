/** Clock readings for the status strip: 24-hour time, a short zone name and the date. */
export interface ClockReading {
  time: string;
  zone: string;
  date: string;
}

export function readClock(instant: Date, timeZone: string): ClockReading {
  const parts = new Intl.DateTimeFormat('en-GB', {
    timeZone,
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
    weekday: 'short',
    day: 'numeric',
    month: 'short',
  }).formatToParts(instant);
  const part = (type: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === type)?.value ?? '';
  // en-US knows the familiar abbreviations (CDT, EST); en-GB would say GMT-5.
  const zoneName =
    new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' }).formatToParts(instant).find((p) => p.type === 'timeZoneName')?.value ?? timeZone;
  return {
    time: `${part('hour')}:${part('minute')}`,
    zone: timeZone === 'UTC' ? 'UTC' : zoneName,
    date: `${part('weekday')} ${part('day')} ${part('month')}`,
  };
}

/** A timestamp for tables: "2 Dec 2026, 14:05 UTC". */
export function formatTimestampUtc(iso: string): string {
  const instant = new Date(iso);
  if (Number.isNaN(instant.getTime())) return '—';
  const text = new Intl.DateTimeFormat('en-GB', {
    timeZone: 'UTC',
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  }).format(instant);
  return `${text} UTC`;
}
