import type { FeatureCollection } from 'geojson';
import { textColourOn, type RiskLadder } from '../../../../shared/contracts/office';
import type { HazardKind } from '../../../../shared/contracts/outlooks';
import type { AreaShape, EditorAreaProperties } from '../../../lib/map/area-editor-map';
import { areasInLadderOrder, type DraftArea } from './outlook-document';

const FALLBACK_COLOUR = '#c9d1dc';

export const hazardBadgeLabels: Record<HazardKind, string> = { tornado: 'Sig. tornado', hail: 'Sig. hail', wind: 'Sig. wind', flood: 'Sig. flood' };

/** The ladder step of an area, or a stand-in when the office removed that level. */
export function levelOf(ladder: RiskLadder, levelKey: string) {
  return ladder.find((l) => l.key === levelKey) ?? { key: levelKey, label: `Unknown level (${levelKey})`, colour: FALLBACK_COLOUR, meaning: '' };
}

/** "Level 2 · Scattered", with the area's own label after it when it has one. */
export function areaTitle(ladder: RiskLadder, area: Pick<DraftArea, 'levelKey' | 'label'>): string {
  const level = levelOf(ladder, area.levelKey).label;
  return area.label.trim() ? `${level} — ${area.label.trim()}` : level;
}

/** The areas as map features: ladder colours, labels and significant-hazard badges; lowest level first. */
export function areaFeatures(areas: readonly DraftArea[], ladder: RiskLadder): FeatureCollection<AreaShape, EditorAreaProperties> {
  const ordered = areasInLadderOrder(
    areas,
    ladder.map((l) => l.key),
  );
  return {
    type: 'FeatureCollection',
    features: ordered.map((area) => {
      const level = levelOf(ladder, area.levelKey);
      return {
        type: 'Feature',
        geometry: area.geometry,
        properties: {
          id: area.id,
          fillColour: level.colour,
          textColour: textColourOn(level.colour),
          title: level.label,
          badges: area.hazards.filter((h) => h.significant).map((h) => hazardBadgeLabels[h.hazard]),
        },
      };
    }),
  };
}
