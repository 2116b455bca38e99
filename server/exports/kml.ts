import { create } from 'xmlbuilder2';
import type { RiskLevel } from '../../shared/contracts/office';
import { hazardLabels, type RiskArea } from '../../shared/contracts/outlooks';

export interface KmlInput {
  number: string;
  state: string;
  day: number;
  validFrom: string;
  validUntil: string;
  headline: string;
  officeName: string;
  ladder: RiskLevel[];
  areas: RiskArea[];
  caution: string;
}

/** KML colours are aabbggrr hex; `#rrggbb` at the given opacity. */
export function kmlColour(hex: string, alpha = 0xb3): string {
  const h = hex.replace('#', '');
  return `${alpha.toString(16).padStart(2, '0')}${h.slice(4, 6)}${h.slice(2, 4)}${h.slice(0, 2)}`.toLowerCase();
}

const ringText = (ring: [number, number][]) => ring.map(([lon, lat]) => `${lon},${lat},0`).join(' ');

/** An issuance as a KML 2.2 document (OGC 07-147r2): one style per level, one Placemark per area. */
export function buildKml(input: KmlInput): string {
  const doc = create({ version: '1.0', encoding: 'UTF-8' }).ele('kml', { xmlns: 'http://www.opengis.net/kml/2.2' }).ele('Document');
  doc.ele('name').txt(`${input.officeName} · outlook ${input.number} (Day ${input.day})`);
  doc.ele('description').txt(`${input.headline}\nValid ${input.validFrom} to ${input.validUntil} (UTC). State: ${input.state}.\n${input.caution}`);
  const data = doc.ele('ExtendedData');
  for (const [name, value] of Object.entries({ issuance: input.number, validFrom: input.validFrom, validUntil: input.validUntil, caution: input.caution })) {
    data.ele('Data', { name }).ele('value').txt(value);
  }
  for (const level of input.ladder) {
    const style = doc.ele('Style', { id: `level-${level.key}` });
    style.ele('LineStyle').ele('color').txt('ff442a1f').up().ele('width').txt('1.5');
    style.ele('PolyStyle').ele('color').txt(kmlColour(level.colour));
  }
  const order = new Map(input.ladder.map((l, i) => [l.key, i]));
  for (const area of [...input.areas].sort((a, b) => (order.get(a.levelKey) ?? 0) - (order.get(b.levelKey) ?? 0))) {
    const level = input.ladder.find((l) => l.key === area.levelKey);
    const placemark = doc.ele('Placemark');
    placemark.ele('name').txt(level?.label ?? area.levelKey);
    const hazards = area.hazards.map((h) => `${hazardLabels[h.hazard]}${h.significant ? ' (significant)' : ''}`).join(', ');
    placemark.ele('description').txt([area.label, hazards ? `Hazards: ${hazards}` : ''].filter(Boolean).join('\n'));
    placemark.ele('styleUrl').txt(`#level-${area.levelKey}`);
    const polygons = area.geometry.type === 'Polygon' ? [area.geometry.coordinates] : area.geometry.coordinates;
    const parent = polygons.length > 1 ? placemark.ele('MultiGeometry') : placemark;
    for (const rings of polygons) {
      const polygon = parent.ele('Polygon');
      rings.forEach((ring, i) => {
        polygon.ele(i === 0 ? 'outerBoundaryIs' : 'innerBoundaryIs').ele('LinearRing').ele('coordinates').txt(ringText(ring));
      });
    }
  }
  return doc.end({ prettyPrint: true });
}
