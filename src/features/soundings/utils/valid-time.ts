/** Valid times as forecasters read them: UTC first ("16 Jun 2014 19:00 UTC"), office time beside. */

function formatIn(iso: string | null, timeZone: string, withZoneName: boolean): string {
  if (iso === null) return 'no valid time';
  const instant = new Date(iso);
  if (Number.isNaN(instant.getTime())) return '—';
  const text = new Intl.DateTimeFormat('en-GB', {
    timeZone,
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  }).format(instant);
  if (!withZoneName) return text;
  const zone =
    new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' }).formatToParts(instant).find((part) => part.type === 'timeZoneName')?.value ??
    timeZone;
  return `${text} ${zone}`;
}

export function formatValidTimeUtc(iso: string | null): string {
  const text = formatIn(iso, 'UTC', false);
  return text === '—' ? text : `${text} UTC`;
}

/** The same instant in the office's time zone, with its short zone name (e.g. "CDT"). */
export function formatValidTimeLocal(iso: string | null, timeZone: string): string {
  return formatIn(iso, timeZone, true);
}

/** "19Z 16 Jun": compact label for the map's valid-time choice. */
export function formatValidTimeShort(iso: string): string {
  const instant = new Date(iso);
  if (Number.isNaN(instant.getTime())) return '—';
  const hour = String(instant.getUTCHours()).padStart(2, '0');
  const minute = instant.getUTCMinutes();
  const day = new Intl.DateTimeFormat('en-GB', { timeZone: 'UTC', day: 'numeric', month: 'short' }).format(instant);
  return `${hour}${minute === 0 ? '' : `:${String(minute).padStart(2, '0')}`} UTC, ${day}`;
}

/**
 * A `datetime-local` input value (read as UTC) to ISO 8601, and back. An empty or unreadable
 * value gives `undefined` so the filter is simply not applied.
 */
export function utcInputToIso(value: string): string | undefined {
  if (value === '') return undefined;
  const instant = new Date(value.length === 16 ? `${value}:00Z` : `${value}Z`);
  return Number.isNaN(instant.getTime()) ? undefined : instant.toISOString();
}

export function isoToUtcInput(iso: string | undefined): string {
  if (iso === undefined) return '';
  const instant = new Date(iso);
  return Number.isNaN(instant.getTime()) ? '' : instant.toISOString().slice(0, 16);
}
