import { Columns3 } from 'lucide-react';
import type { UnitFormatters } from '../../../hooks/use-units';
import { figureDefinitions, optionalLibraryFigureGroups, type FigureKey } from '../utils/sounding-figures';

interface LibraryColumnChooserProps {
  chosen: readonly FigureKey[];
  onToggle: (key: FigureKey, on: boolean) => void;
  units: UnitFormatters;
}

/** A disclosure listing the figures the library can add as columns, grouped by hazard. */
export function LibraryColumnChooser({ chosen, onToggle, units }: LibraryColumnChooserProps) {
  return (
    <details className="group relative">
      <summary className="inline-flex cursor-pointer list-none items-center gap-1.5 rounded-md border border-line-strong bg-panel px-2.5 py-1 text-[13px] font-medium text-ink hover:bg-sunken">
        <Columns3 aria-hidden className="size-3.5" />
        More figures{chosen.length > 0 ? ` (${chosen.length})` : ''}
      </summary>
      <div className="absolute right-0 z-20 mt-1 grid w-[34rem] max-w-[90vw] grid-cols-2 gap-x-4 gap-y-3 rounded-lg border border-line bg-panel p-3 shadow-lg">
        {optionalLibraryFigureGroups.map((group) => (
          <fieldset key={group.title}>
            <legend className="mb-1 text-[12px] font-semibold tracking-wide text-ink-muted uppercase">{group.title}</legend>
            {group.keys.map((key) => {
              const figure = figureDefinitions[key];
              const unit = figure.unit(units);
              return (
                <label key={key} className="flex items-center gap-2 py-0.5 text-[13px] text-ink">
                  <input type="checkbox" checked={chosen.includes(key)} onChange={(event) => onToggle(key, event.target.checked)} />
                  <span>
                    {figure.name}
                    {unit ? <span className="text-ink-faint"> ({unit})</span> : null}
                  </span>
                </label>
              );
            })}
          </fieldset>
        ))}
      </div>
    </details>
  );
}
