import { clsx } from 'clsx';
import { useId, useState } from 'react';
import type { SaveModifiedSoundingInput } from '../../../../shared/contracts/soundings';
import type { Units } from '../../../../shared/contracts/users';
import type { SoundingLevel } from '../../../../shared/sounding';
import { Hodograph } from './hodograph';
import { IndexPanel } from './index-panel';
import { LevelsTable } from './levels-table';
import type { ParcelKey } from './parcels';
import { SkewTDiagram } from './skew-t-diagram';
import { useWhatIf } from './use-what-if';
import { WhatIfEditor } from './what-if-editor';

export interface SoundingWorkbenchProps {
  /** Levels sorted by decreasing pressure (heights MSL), as stored. */
  levels: readonly SoundingLevel[];
  units: Units;
  /** Save the what-if as a named modified sounding; omitted → no save form. */
  onSaveModified?: (input: SaveModifiedSoundingInput) => void | Promise<unknown>;
  /** Hide the what-if editor and dragging (public or read-only views). */
  readOnly?: boolean;
  /** When this sounding is itself a saved modified sounding: its name, shown as a badge. */
  modifiedLabel?: string | null;
  className?: string;
}

const card = 'rounded-lg border border-line bg-panel p-3';
const heading = 'mb-2 text-sm font-semibold text-ink';

/** Diagram, hodograph, indices, what-if editor and data table of one sounding. */
export function SoundingWorkbench({ levels, units, onSaveModified, readOnly = false, modifiedLabel = null, className }: SoundingWorkbenchProps) {
  const id = useId();
  const whatIf = useWhatIf(levels);
  const [selectedParcel, setSelectedParcel] = useState<ParcelKey>('mixedLayer');
  const [tableOpen, setTableOpen] = useState(false);
  const { modified } = whatIf;
  const surface = levels[0];
  const surfaceChanged = whatIf.change.surfaceTemperatureC !== undefined || whatIf.change.surfaceDewpointC !== undefined;

  return (
    <div className={clsx('grid gap-4 lg:grid-cols-[minmax(0,1fr)_22rem]', className)}>
      <section className={clsx(card, 'min-w-0')} aria-label="Skew-T log-p diagram">
        <div className="mb-2 flex flex-wrap items-center gap-2">
          <h2 className="text-sm font-semibold text-ink">Skew-T log-p</h2>
          {modifiedLabel ? (
            <span className="rounded-full bg-warning-soft px-2 py-0.5 text-[12px] font-medium text-warning">Modified · {modifiedLabel}</span>
          ) : null}
          {whatIf.isModified ? (
            <span className="rounded-full bg-accent-soft px-2 py-0.5 text-[12px] font-medium text-accent-strong">What-if (not saved)</span>
          ) : null}
        </div>
        <SkewTDiagram
          levels={modified.levels}
          analysis={modified.analysis}
          units={units}
          chosenParcel={modified.chosenParcel}
          selectedParcel={selectedParcel}
          onSelectedParcelChange={setSelectedParcel}
          originalSurface={surfaceChanged && surface ? { temperatureC: surface.temperatureC, dewpointC: surface.dewpointC } : null}
          {...(readOnly
            ? {}
            : {
                onSurfaceChange: (next: { temperatureC?: number; dewpointC?: number }) =>
                  whatIf.update({
                    ...(next.temperatureC !== undefined ? { surfaceTemperatureC: next.temperatureC } : {}),
                    ...(next.dewpointC !== undefined ? { surfaceDewpointC: next.dewpointC } : {}),
                  }),
              })}
        />
      </section>

      <div className="flex min-w-0 flex-col gap-4">
        <section className={card} aria-labelledby={`${id}-hodograph`}>
          <h2 id={`${id}-hodograph`} className={heading}>
            Hodograph (0–10 km)
          </h2>
          <Hodograph levels={modified.levels} kinematics={modified.analysis.kinematics} units={units} />
        </section>
        {readOnly ? null : (
          <div className={card}>
            <WhatIfEditor
              levels={levels}
              change={whatIf.change}
              onChange={(partial) => {
                whatIf.update(partial);
                if ('parcelStartPressureHpa' in partial) setSelectedParcel(partial.parcelStartPressureHpa === undefined ? 'mixedLayer' : 'chosen');
              }}
              onReset={() => {
                whatIf.reset();
                setSelectedParcel('mixedLayer');
              }}
              original={whatIf.original}
              modified={modified}
              units={units}
              {...(onSaveModified ? { onSave: onSaveModified } : {})}
            />
          </div>
        )}
      </div>

      <section className={clsx(card, 'lg:col-span-2')} aria-labelledby={`${id}-indices`}>
        <h2 id={`${id}-indices`} className={heading}>
          Indices{whatIf.isModified ? ' (what-if)' : ''}
        </h2>
        <IndexPanel analysis={modified.analysis} units={units} chosenParcel={modified.chosenParcel} />
      </section>

      <details className={clsx(card, 'lg:col-span-2')} onToggle={(event) => setTableOpen(event.currentTarget.open)}>
        <summary className="cursor-pointer text-sm font-semibold text-ink">Data table ({levels.length} levels)</summary>
        {/* Rendered only when open: 100+ rows would otherwise be re-rendered on every what-if change. */}
        {tableOpen ? <LevelsTable levels={modified.levels} units={units} className="mt-2" /> : null}
      </details>
    </div>
  );
}
