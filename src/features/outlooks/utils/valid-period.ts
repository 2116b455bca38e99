/** A valid period in words, UTC and office local: "Tue 14 Apr 11:00 – Wed 15 Apr 11:00 UTC". */
export function formatPeriod(validFrom: string, validUntil: string, timeZone: string): string {
  const format = new Intl.DateTimeFormat('en-GB', { timeZone, weekday: 'short', day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });
  const zone = timeZone === 'UTC' ? 'UTC' : (new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' }).formatToParts(new Date(validFrom)).find((p) => p.type === 'timeZoneName')?.value ?? timeZone);
  return `${format.format(new Date(validFrom)).replace(',', '')} – ${format.format(new Date(validUntil)).replace(',', '')} ${zone}`;
}

/** ISO instant → the value of a `datetime-local` input showing UTC ("2027-04-18T12:00"). */
export function toUtcInputValue(iso: string): string {
  const instant = new Date(iso);
  return Number.isNaN(instant.getTime()) ? '' : instant.toISOString().slice(0, 16);
}

/** A `datetime-local` value read as UTC → ISO instant, or null when incomplete. */
export function fromUtcInputValue(value: string): string | null {
  if (!/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/.test(value)) return null;
  const instant = new Date(`${value}:00Z`);
  return Number.isNaN(instant.getTime()) ? null : instant.toISOString();
}
