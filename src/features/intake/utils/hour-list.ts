/** Reads "0, 6, 12, 18" (commas or spaces) as a list of numbers; anything else stays as text so the shared schema names the problem. */
export function parseHourList(text: string): unknown[] {
  return text
    .split(/[,\s]+/)
    .filter((part) => part !== '')
    .map((part) => (/^\d+$/.test(part) ? Number(part) : part));
}
