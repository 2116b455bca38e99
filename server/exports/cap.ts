import { create } from 'xmlbuilder2';
import type { Geometry, Position } from 'geojson';
import type { RiskArea } from '../../shared/contracts/outlooks';
import { hazardLabels, type HazardKind } from '../../shared/contracts/outlooks';
import type { RiskLevel } from '../../shared/contracts/office';

/** The CAP 1.2 XML namespace (OASIS CAP 1.2, section 3.3). */
export const capNamespace = 'urn:oasis:names:tc:emergency:cap:1.2';

export type CapMsgType = 'Alert' | 'Update' | 'Cancel';
export type CapUrgency = 'Immediate' | 'Expected' | 'Future' | 'Past' | 'Unknown';
export type CapSeverity = 'Extreme' | 'Severe' | 'Moderate' | 'Minor' | 'Unknown';
export type CapCertainty = 'Observed' | 'Likely' | 'Possible' | 'Unlikely' | 'Unknown';

/** A message this one refers to (CAP `<references>` entry: sender,identifier,sent). */
export interface CapReference {
  sender: string;
  identifier: string;
  sent: Date;
}

export interface CapIssuanceInput {
  sender: string;
  identifier: string;
  sent: Date;
  msgType: CapMsgType;
  references: CapReference[];
  /** Shown in `<note>` (e.g. the withdrawal reason on a Cancel). */
  note?: string;
  officeName: string;
  number: string;
  day: number;
  validFrom: Date;
  validUntil: Date;
  headline: string;
  discussion: string;
  ladder: RiskLevel[];
  areas: RiskArea[];
  caution: string;
  web: string;
}

/**
 * A CAP dateTime: "YYYY-MM-DDThh:mm:ss" with a numeric offset. CAP 1.2 forbids the "Z"
 * designator and writes UTC as "-00:00"; whole seconds are enough for outlooks.
 */
export function capDateTime(time: Date): string {
  return `${time.toISOString().slice(0, 19)}-00:00`;
}

/** One `<references>` entry; entries are separated by whitespace. */
export function capReference(ref: CapReference): string {
  return `${ref.sender},${ref.identifier},${capDateTime(ref.sent)}`;
}

/**
 * Severity from a level's place on the office's ladder (lowest first). The ladder is editable,
 * so the mapping uses position, not keys: the lowest step is Minor, the highest of a ladder of
 * three or more is Extreme, the lower half of the rest Moderate and the upper half Severe.
 */
export function capSeverity(levelKey: string, ladder: RiskLevel[]): CapSeverity {
  const rank = ladder.findIndex((l) => l.key === levelKey);
  if (rank < 0) return 'Unknown';
  const top = ladder.length - 1;
  if (rank === 0) return 'Minor';
  if (rank === top && ladder.length >= 3) return 'Extreme';
  return rank / top < 0.5 ? 'Moderate' : 'Severe';
}

/**
 * Urgency from the valid period as seen at `sent`: an outlook is never a warning, so never
 * Immediate. Expected when its period has begun or begins within the hour, Future when it
 * begins later, Past once it has ended.
 */
export function capUrgency(validFrom: Date, validUntil: Date, sent: Date): CapUrgency {
  if (validUntil.getTime() <= sent.getTime()) return 'Past';
  return validFrom.getTime() - sent.getTime() <= 3_600_000 ? 'Expected' : 'Future';
}

/** Certainty from the lead time: Day 1 is Likely, Days 2 and 3 Possible. */
export function capCertainty(day: number): CapCertainty {
  return day <= 1 ? 'Likely' : 'Possible';
}

/** Exterior rings of a Polygon or MultiPolygon (CAP polygons cannot carry holes). */
function exteriorRings(geometry: Geometry): Position[][] {
  if (geometry.type === 'Polygon') return geometry.coordinates[0] ? [geometry.coordinates[0]] : [];
  if (geometry.type === 'MultiPolygon') return geometry.coordinates.flatMap((p) => (p[0] ? [p[0]] : []));
  return [];
}

const round = (value: number) => Number(value.toFixed(5));

/**
 * A CAP polygon: whitespace-separated "lat,lon" pairs (WGS 84), first pair repeated last,
 * at least four pairs. GeoJSON positions are [lon, lat]; the ring is closed if it was not.
 */
export function capPolygon(ring: Position[]): string | null {
  const pairs = ring.map(([lon = 0, lat = 0]) => `${round(lat)},${round(lon)}`);
  if (pairs.length && pairs[0] !== pairs[pairs.length - 1]) pairs.push(pairs[0] ?? '');
  return pairs.length >= 4 ? pairs.join(' ') : null;
}

function hazardWords(areas: RiskArea[]): string[] {
  const seen = new Map<HazardKind, boolean>();
  for (const area of areas) for (const h of area.hazards) seen.set(h.hazard, (seen.get(h.hazard) ?? false) || h.significant);
  return [...seen].map(([hazard, significant]) => `${hazardLabels[hazard]}${significant ? ' (significant)' : ''}`);
}

/**
 * The CAP 1.2 alert of one issuance: one `<info>` per risk level present (highest first), each
 * with one `<area>` per risk area of that level. An issuance without areas still has one info.
 */
export function buildCapAlert(input: CapIssuanceInput): string {
  const doc = create({ version: '1.0', encoding: 'UTF-8' });
  const alert = doc.ele(capNamespace, 'alert');
  alert.ele('identifier').txt(input.identifier);
  alert.ele('sender').txt(input.sender);
  alert.ele('sent').txt(capDateTime(input.sent));
  alert.ele('status').txt('Actual');
  alert.ele('msgType').txt(input.msgType);
  alert.ele('source').txt('Stormdraft');
  alert.ele('scope').txt('Public');
  if (input.note) alert.ele('note').txt(input.note);
  if (input.references.length) alert.ele('references').txt(input.references.map(capReference).join(' '));

  const cancelled = input.msgType === 'Cancel';
  const levelsPresent = [...input.ladder].reverse().filter((level) => input.areas.some((a) => a.levelKey === level.key));
  const unknownLevels = [...new Set(input.areas.map((a) => a.levelKey))].filter((key) => !input.ladder.some((l) => l.key === key));
  const groups: { key: string | null; label: string }[] = [...levelsPresent.map((l) => ({ key: l.key, label: l.label })), ...unknownLevels.map((key) => ({ key, label: key }))];
  if (!groups.length) groups.push({ key: null, label: 'No risk areas' });

  for (const group of groups) {
    const areas = group.key === null ? [] : input.areas.filter((a) => a.levelKey === group.key);
    const info = alert.ele('info');
    info.ele('language').txt('en-US');
    info.ele('category').txt('Met');
    info.ele('event').txt(`Severe-thunderstorm outlook: ${group.label}`);
    info.ele('responseType').txt(cancelled ? 'AllClear' : group.key !== null && capSeverity(group.key, input.ladder) !== 'Minor' ? 'Prepare' : 'Monitor');
    info.ele('urgency').txt(cancelled ? 'Past' : capUrgency(input.validFrom, input.validUntil, input.sent));
    const severity: CapSeverity = cancelled ? 'Unknown' : group.key === null ? 'Minor' : capSeverity(group.key, input.ladder);
    info.ele('severity').txt(severity);
    info.ele('certainty').txt(cancelled ? 'Unknown' : capCertainty(input.day));
    info.ele('effective').txt(capDateTime(input.sent));
    info.ele('onset').txt(capDateTime(input.validFrom));
    info.ele('expires').txt(capDateTime(input.validUntil));
    info.ele('senderName').txt(input.officeName);
    const headline = `${cancelled ? 'WITHDRAWN: ' : ''}Day ${input.day} outlook ${input.number}: ${input.headline || group.label}`;
    info.ele('headline').txt(headline.slice(0, 160));
    const hazards = hazardWords(areas);
    const description = [cancelled ? `Outlook ${input.number} has been withdrawn.${input.note ? ` ${input.note}` : ''}` : '', `${group.label}.`, hazards.length ? `Hazards: ${hazards.join(', ')}.` : '', input.discussion].filter(Boolean).join('\n\n');
    info.ele('description').txt(description);
    info.ele('instruction').txt(input.caution);
    info.ele('web').txt(input.web);
    if (group.key !== null) {
      info.ele('parameter').ele('valueName').txt('riskLevel').up().ele('value').txt(group.key);
      info.ele('parameter').ele('valueName').txt('outlookDay').up().ele('value').txt(String(input.day));
    }
    areas.forEach((area, index) => {
      const polygons = exteriorRings(area.geometry).map(capPolygon).filter((p): p is string => p !== null);
      if (!polygons.length) return;
      const element = info.ele('area');
      element.ele('areaDesc').txt(`${group.label} risk area ${index + 1}${area.label ? ` (${area.label})` : ''}`);
      for (const polygon of polygons) element.ele('polygon').txt(polygon);
    });
  }
  return doc.end({ prettyPrint: true });
}
