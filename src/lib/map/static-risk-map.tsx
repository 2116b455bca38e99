import { useId } from 'react';
import type { MapArea, MapBounds } from './risk-area-types';
import { areaPath, fitMercator, linesPath } from './svg-paths';
import { useOfflineBoundaries } from './use-offline-boundaries';

const width = 900;
const height = 560;

/**
 * A light, static risk map drawn as SVG (no Leaflet): the overview boundary lines of the
 * region and the risk areas in the order given, lowest level first; significant hazards get a
 * bold dark outline. It shows at once on the public pages; the interactive map loads on demand.
 */
export function StaticRiskMap({ label, bounds, areas, className }: { label: string; bounds: MapBounds; areas: readonly MapArea[]; className?: string }) {
  const { boundaries } = useOfflineBoundaries('overview');
  const clipId = useId();
  const project = fitMercator(bounds, width, height, 10);
  return (
    <figure className={className}>
      <svg viewBox={`0 0 ${width} ${height}`} role="img" aria-label={label} className="block h-auto w-full rounded-md bg-[#eef1f5]">
        <clipPath id={clipId}>
          <rect width={width} height={height} />
        </clipPath>
        <g clipPath={`url(#${clipId})`}>
          {areas.map((area) => (
            <path key={area.id} d={areaPath(area.geometry, project)} fill={area.colour} fillOpacity={0.72} fillRule="evenodd" stroke="#172030" strokeOpacity={0.7} strokeWidth={1}>
              <title>{area.detail ? `${area.title}: ${area.detail}` : area.title}</title>
            </path>
          ))}
          {boundaries ? (
            <g fill="none" pointerEvents="none">
              <path d={linesPath(boundaries.counties.geometry, project, bounds)} stroke="#c3cad4" strokeWidth={0.6} />
              <path d={linesPath(boundaries.states.geometry, project, bounds)} stroke="#7d8898" strokeWidth={1.2} />
              <path d={linesPath(boundaries.nation.geometry, project, bounds)} stroke="#515d6e" strokeWidth={1.6} />
            </g>
          ) : null}
          {areas
            .filter((area) => area.significant)
            .map((area) => (
              <path key={`sig:${area.id}`} d={areaPath(area.geometry, project)} fill="none" stroke="#101624" strokeWidth={3.5} strokeOpacity={0.9} pointerEvents="none" />
            ))}
        </g>
      </svg>
    </figure>
  );
}
