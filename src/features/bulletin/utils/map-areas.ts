import type { MapArea, MapBounds } from '../../../lib/map/risk-area-types';
import type { AreaGeometry, HazardKind } from '../../../../shared/contracts/risk-areas';
import { hazardsText, stepFor, type LadderStep } from './issuance-format';

export type { MapArea, MapBounds };

interface AreaLike {
  id: string;
  levelKey: string;
  geometry: AreaGeometry;
  label?: string | undefined;
  hazards: readonly { hazard: HazardKind; significant: boolean }[];
}

/** Areas ready for the map, lowest level first so higher levels draw on top. */
export function mapAreasOf(areas: readonly AreaLike[], ladder: readonly LadderStep[]): MapArea[] {
  const rank = (key: string) => {
    const index = ladder.findIndex((l) => l.key === key);
    return index === -1 ? ladder.length : index;
  };
  return [...areas]
    .sort((a, b) => rank(a.levelKey) - rank(b.levelKey))
    .map((area) => {
      const step = stepFor(ladder, area.levelKey);
      const hazards = hazardsText(area.hazards);
      return {
        id: area.id,
        geometry: area.geometry,
        colour: step.colour,
        title: area.label ? `${step.label} — ${area.label}` : step.label,
        detail: hazards,
        significant: area.hazards.some((h) => h.significant),
      };
    });
}

/** The box around every area (or null for none), padded a little. */
export function boundsOfAreas(areas: readonly { geometry: AreaGeometry }[]): MapBounds | null {
  let west = Infinity;
  let south = Infinity;
  let east = -Infinity;
  let north = -Infinity;
  for (const area of areas) {
    const rings = area.geometry.type === 'Polygon' ? area.geometry.coordinates : area.geometry.coordinates.flat();
    for (const ring of rings)
      for (const [lon, lat] of ring) {
        west = Math.min(west, lon);
        east = Math.max(east, lon);
        south = Math.min(south, lat);
        north = Math.max(north, lat);
      }
  }
  if (!Number.isFinite(west)) return null;
  const padLon = Math.max(0.5, (east - west) * 0.1);
  const padLat = Math.max(0.5, (north - south) * 0.1);
  return { west: west - padLon, south: south - padLat, east: east + padLon, north: north + padLat };
}
