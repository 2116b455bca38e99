import type { FeatureCollection } from 'geojson';
import { textColourOn, type RiskLadder } from '../../../../shared/contracts/office';
import type { HazardKind } from '../../../../shared/contracts/outlooks';
import type { AreaShape, EditorAreaProperties } from '../../../lib/map/area-editor-map';
import { areasInLadderOrder, type DraftArea } from './outlook-document';

export const hazardBadgeLabels: Record<HazardKind, string> = { tornado: 'Sig. tornado', hail: 'Sig. hail', wind: 'Sig. wind', flood: 'Sig. flood' };

import { ladderLevel } from '../../../../shared/workflow/levels';

/** The areas as map features: ladder colours, labels and significant-hazard badges; lowest level first. */
export function areaFeatures(areas: readonly DraftArea[], ladder: RiskLadder): FeatureCollection<AreaShape, EditorAreaProperties> {
  const ordered = areasInLadderOrder(
    areas,
    ladder.map((l) => l.key),
  );
  return {
    type: 'FeatureCollection',
    features: ordered.map((area) => {
      const level = ladderLevel(ladder, area.levelKey);
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
