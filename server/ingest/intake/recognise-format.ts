/**
 * Recognises an intake file by its content, never by its name: GRIB edition 2 (the letters
 * "GRIB" and edition byte 2), BUFR (the letters "BUFR"), or our exchange CSV (text with a
 * pressure column header). Pure: takes the file's first bytes.
 */

export type IntakeFormat = 'grib2' | 'bufr' | 'csv' | 'unknown';

/** How many leading bytes are looked at (a WMO bulletin heading may come before the magic). */
export const RECOGNISE_BYTES = 4096;

const MAGIC_SEARCH_BYTES = 512;

/**
 * The format of a file from its first bytes.
 * @param head - up to RECOGNISE_BYTES leading bytes of the file
 * @returns the format, and for an unknown file the reason in words
 */
export function recogniseFormat(head: Buffer): { format: IntakeFormat; reason?: string } {
  const window = head.subarray(0, MAGIC_SEARCH_BYTES);
  const grib = window.indexOf('GRIB', 0, 'latin1');
  const bufr = window.indexOf('BUFR', 0, 'latin1');
  if (grib !== -1 && (bufr === -1 || grib < bufr)) {
    // Section 0 of GRIB: "GRIB", two reserved octets, the discipline, then the edition number (octet 8).
    const edition = head[grib + 7];
    if (edition === 2) return { format: 'grib2' };
    return { format: 'unknown', reason: `GRIB edition ${edition ?? '?'} is not taken; only GRIB edition 2 model fields are.` };
  }
  if (bufr !== -1) return { format: 'bufr' };
  if (head.includes(0)) return { format: 'unknown', reason: 'The file is neither GRIB2, BUFR nor a sounding CSV (it is binary and has no GRIB or BUFR header).' };
  const text = head.toString('utf8');
  if (/(^|[,;\s])pressure_(hpa|pa)\s*([,;]|$)/im.test(text)) return { format: 'csv' };
  return { format: 'unknown', reason: 'The file is neither GRIB2, BUFR nor a sounding CSV (no pressure_hPa column header was found).' };
}
