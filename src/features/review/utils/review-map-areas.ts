import type { MapArea, MapBounds } from '../../../lib/map/risk-area-types';
import type { OfficeSettings } from '../../../../shared/contracts/office';
import { hazardLabels, type AreaGeometry, type HazardKind } from '../../../../shared/contracts/outlooks';
import { areaTitle, ladderLevel } from '../../../../shared/workflow/levels';

export type { MapArea, MapBounds };

type Ladder = OfficeSettings['riskLadder'];

export function levelColour(ladder: Ladder, levelKey: string): string {
  return ladderLevel(ladder, levelKey).colour;
}

interface AreaLike {
  id?: string | undefined;
  levelKey: string;
  geometry: AreaGeometry;
  label?: string | undefined;
  hazards: readonly { hazard: HazardKind; significant: boolean }[];
}

/** Areas for the map, lowest level first (higher levels draw on top), titled with level and label. */
export function reviewMapAreas(areas: readonly AreaLike[], ladder: Ladder): MapArea[] {
  const rank = (key: string) => {
    const i = ladder.findIndex((l) => l.key === key);
    return i === -1 ? ladder.length : i;
  };
  return [...areas]
    .sort((a, b) => rank(a.levelKey) - rank(b.levelKey))
    .map((area, index) => ({
      id: area.id ?? `area-${index}`,
      geometry: area.geometry,
      colour: levelColour(ladder, area.levelKey),
      title: areaTitle(ladder, area),
      detail: area.hazards.map((h) => `${hazardLabels[h.hazard]}${h.significant ? ' (significant)' : ''}`).join(', '),
      significant: area.hazards.some((h) => h.significant),
    }));
}

