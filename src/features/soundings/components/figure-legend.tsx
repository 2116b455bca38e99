import type { UnitFormatters } from '../../../hooks/use-units';
import { colourFor, legendTicks, type ColourScale } from '../utils/map-colours';
import type { FigureDefinition } from '../utils/sounding-figures';

interface FigureLegendProps {
  figure: FigureDefinition;
  scale: ColourScale;
  units: UnitFormatters;
}

/** The colour key for the map: a ramp with labelled ticks in the person's units, plus "no value". */
export function FigureLegend({ figure, scale, units }: FigureLegendProps) {
  const ticks = legendTicks(scale);
  const labelled = legendTicks(scale, 3);
  const gradient = `linear-gradient(to right, ${ticks.map((tick) => colourFor(tick, scale) ?? '#fff').join(', ')})`;
  return (
    <figure aria-label={`Colour key: ${figure.name}`} className="rounded-lg border border-line bg-panel px-3 py-2.5">
      <figcaption className="mb-1.5 text-[13px] font-semibold text-ink">{figure.name}</figcaption>
      <div className="h-3 rounded-sm ring-1 ring-black/10" style={{ background: gradient }} />
      <ol className="mt-1 flex justify-between text-[12px] text-ink-muted">
        {labelled.map((tick, index) => (
          <li key={tick}>
            {index === labelled.length - 1 ? (scale.darkAt < scale.lightAt ? '≤ ' : '≥ ') : ''}
            {figure.format(tick, units)}
          </li>
        ))}
      </ol>
      <p className="mt-1.5 flex items-center gap-3 text-[12px] text-ink-muted">
        <span className="inline-flex items-center gap-1">
          <span className="inline-block size-3 rounded-full border border-ink bg-white" /> No value
        </span>
        <span className="inline-flex items-center gap-1">
          <span className="inline-block size-3 rounded-full border-2 border-dashed border-ink" /> Modified sounding
        </span>
      </p>
    </figure>
  );
}
