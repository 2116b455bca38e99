/** Builders of small exchange-format CSV texts for tests. */

export const BASE_METADATA: Record<string, string> = {
  station: 'TST',
  name: 'Test Station',
  latitude: '38.4',
  longitude: '-91.3',
  elevation_m: '100',
  valid: '2027-04-18T18:00:00Z',
  source: 'model',
};

export const BASE_HEADER = 'pressure_hPa,height_m,temperature_C,dewpoint_C,wind_direction_deg,wind_speed_kt';

/** A plausible warm-season sounding, 1000–200 hPa, as CSV rows. */
export const BASE_ROWS = [
  '1000,100,28,20,170,10',
  '950,560,24,18,190,20',
  '900,1030,21,15,210,30',
  '850,1520,18,12,230,35',
  '700,3100,8,-2,250,40',
  '500,5800,-10,-25,260,50',
  '400,7200,-22,-35,265,55',
  '300,9500,-38,-50,270,60',
  '250,10800,-46,-60,270,65',
  '200,12000,-55,-70,270,70',
];

/** Join metadata (`null` removes a key), header and rows into a CSV text. */
export function buildCsv(options: { metadata?: Record<string, string | null>; header?: string; rows?: string[] } = {}): string {
  const metadata = { ...BASE_METADATA, ...options.metadata };
  const lines = Object.entries(metadata)
    .filter((entry): entry is [string, string] => entry[1] !== null)
    .map(([key, value]) => `# ${key}: ${value}`);
  lines.push(options.header ?? BASE_HEADER, ...(options.rows ?? BASE_ROWS));
  return lines.join('\n');
}

/** The 1-based line of row `rowIndex` in a text built with the default metadata. */
export const rowLine = (rowIndex: number): number => Object.keys(BASE_METADATA).length + 2 + rowIndex;
