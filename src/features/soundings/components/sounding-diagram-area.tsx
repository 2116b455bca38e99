import { ChartSpline } from 'lucide-react';
import type { SoundingDetail } from '../api/get-sounding';
import { useUnits } from '../../../hooks/use-units';
import { figureDefinitions, libraryFigureKeys } from '../utils/sounding-figures';

/**
 * Where the diagram workbench goes. Until the diagram kit lands this shows the stored key
 * figures and says the diagram is on its way.
 */
export function SoundingDiagramArea({ sounding }: { sounding: SoundingDetail }) {
  const units = useUnits();
  return (
    <section aria-labelledby="sounding-figures-title" className="space-y-4">
      <div className="flex items-center gap-3 rounded-lg border border-dashed border-line-strong bg-panel px-4 py-8 text-sm text-ink-muted">
        <ChartSpline aria-hidden className="size-5" />
        The skew-T log-p diagram, hodograph and what-if editor will appear here. {sounding.levels.length} levels stored.
      </div>
      <div className="rounded-lg border border-line bg-panel p-4">
        <h2 id="sounding-figures-title" className="mb-2 text-sm font-semibold text-ink">
          Key figures
        </h2>
        <dl className="grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-4">
          {libraryFigureKeys.map((key) => (
            <div key={key} className="flex justify-between gap-2 border-b border-line py-1">
              <dt className="text-ink-muted" title={figureDefinitions[key].name}>
                {figureDefinitions[key].label}
              </dt>
              <dd className="font-medium">{figureDefinitions[key].format(sounding.figures[key], units)}</dd>
            </div>
          ))}
        </dl>
      </div>
    </section>
  );
}
