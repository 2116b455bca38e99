import { lazy, Suspense, useState } from 'react';
import { Loading } from '../../../components/ui/loading';
import { StaticRiskMap } from '../../../lib/map/static-risk-map';
import type { MapArea, MapBounds } from '../utils/map-areas';

const RiskAreaMap = lazy(async () => ({ default: (await import('../../../lib/map/risk-area-map')).RiskAreaMap }));

/**
 * The issuance's map: a light static SVG at once, and the interactive (Leaflet) map only when
 * asked for, so the public pages load without the map library.
 */
export function IssuanceMap({ label, bounds, areas }: { label: string; bounds: MapBounds; areas: readonly MapArea[] }) {
  const [interactive, setInteractive] = useState(false);
  return (
    <div className="space-y-2">
      {interactive ? (
        <Suspense fallback={<Loading label="Loading the interactive map…" />}>
          <RiskAreaMap label={label} bounds={bounds} areas={areas} className="h-[22rem] rounded-md border border-line sm:h-[26rem]" />
        </Suspense>
      ) : (
        <>
          <StaticRiskMap label={label} bounds={bounds} areas={areas} className="overflow-hidden rounded-md border border-line" />
          <button
            type="button"
            onClick={() => setInteractive(true)}
            className="inline-flex items-center gap-1.5 rounded-md border border-line bg-panel px-2.5 py-1.5 text-[13px] font-medium text-ink hover:bg-sunken"
          >
            Open the interactive map (zoom and pan)
          </button>
        </>
      )}
    </div>
  );
}
