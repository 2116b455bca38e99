import { hazardKinds, hazardLabels, type HazardKind } from '../../../../shared/contracts/risk-areas';
import { textColourOn } from '../../../../shared/contracts/office';

/** A ladder step as the public pages show it (from the issuance's frozen snapshot). */
export interface LadderStep {
  key: string;
  label: string;
  colour: string;
  meaning: string;
}

function formatIn(iso: string, timeZone: string): string {
  const instant = new Date(iso);
  if (Number.isNaN(instant.getTime())) return '—';
  const text = new Intl.DateTimeFormat('en-GB', {
    timeZone,
    weekday: 'short',
    day: 'numeric',
    month: 'short',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  }).format(instant);
  const zone =
    timeZone === 'UTC'
      ? 'UTC'
      : (new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' }).formatToParts(instant).find((p) => p.type === 'timeZoneName')?.value ?? timeZone);
  return `${text} ${zone}`;
}

/** The valid period twice: in UTC and in the office's local time ("Tue 2 Dec, 00:47 UTC"). */
export function validPeriodText(validFrom: string, validUntil: string, officeTimeZone: string): { utc: string; local: string } {
  return {
    utc: `${formatIn(validFrom, 'UTC')} – ${formatIn(validUntil, 'UTC')}`,
    local: `${formatIn(validFrom, officeTimeZone)} – ${formatIn(validUntil, officeTimeZone)}`,
  };
}

export function formatInstant(iso: string, timeZone = 'UTC'): string {
  return formatIn(iso, timeZone);
}

/** Falls back to the key when a snapshot names a level the ladder no longer has. */
export function stepFor(ladder: readonly LadderStep[], levelKey: string): LadderStep {
  return ladder.find((l) => l.key === levelKey) ?? { key: levelKey, label: levelKey, colour: '#b6c0cd', meaning: '' };
}

export function textColourFor(colour: string): string {
  return /^#[0-9a-fA-F]{6}$/.test(colour) ? textColourOn(colour) : '#172030';
}

interface HazardFlag {
  hazard: HazardKind;
  significant: boolean;
}

/** "Tornado (significant), Large hail" — hazards in the fixed order tornado, hail, wind, flood. */
export function hazardsText(hazards: readonly HazardFlag[]): string {
  const ordered = [...hazards].sort((a, b) => hazardKinds.indexOf(a.hazard) - hazardKinds.indexOf(b.hazard));
  return ordered.map((h) => `${hazardLabels[h.hazard]}${h.significant ? ' (significant)' : ''}`).join(', ');
}

/** The levels present in an outlook, lowest first, each once, for the map legend. */
export function levelsPresent(ladder: readonly LadderStep[], levelKeys: readonly string[]): LadderStep[] {
  const keys = new Set(levelKeys);
  const known = ladder.filter((l) => keys.has(l.key));
  const unknown = [...keys].filter((k) => !ladder.some((l) => l.key === k)).map((k) => stepFor(ladder, k));
  return [...known, ...unknown];
}

/** Where each export of an issuance lives (public, permanent addresses). */
export function issuanceDownloads(issuanceNumber: string): { label: string; href: string; format: string }[] {
  const base = `/api/public/issuances/${encodeURIComponent(issuanceNumber)}`;
  return [
    { label: 'GeoJSON', format: 'RFC 7946', href: `${base}/geojson` },
    { label: 'KML', format: 'KML 2.2', href: `${base}/kml` },
    { label: 'Map image (SVG)', format: 'SVG', href: `${base}/map.svg` },
    { label: 'Map image (PNG)', format: 'PNG', href: `${base}/map.png` },
  ];
}

export const feedHref = '/api/public/feed.atom';

export const dayLabel = (day: number) => `Day ${day}`;
