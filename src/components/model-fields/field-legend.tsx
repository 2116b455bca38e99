import type { ModelField } from '../../../shared/contracts/model-fields';
import type { Units } from '../../../shared/contracts/users';
import { bandLabel, runName } from './field-display';

/**
 * The key of a model field on the map: each band's colour and range in the person's units,
 * the run it came from, and a note that breaks and colours are our own choice.
 */
export function FieldLegend({ field, units }: { field: ModelField; units: Units }) {
  return (
    <figure aria-label={`Field key: ${field.label}`} className="rounded-lg border border-line bg-panel px-3 py-2.5">
      <figcaption className="mb-1.5 text-[13px] font-semibold text-ink">
        {field.label} · {runName(field.run)}
      </figcaption>
      <ul className="space-y-0.5 text-[12px] text-ink tabular-nums">
        {[...field.bands].reverse().map((band) => (
          <li key={band.index} className="flex items-center gap-2">
            <span aria-hidden="true" className="inline-block h-3 w-5 rounded-sm ring-1 ring-black/10" style={{ background: band.colour }} />
            {bandLabel(band.from, band.to, field.sense, field.quantity, field.unit, units)}
          </li>
        ))}
      </ul>
      <p className="mt-1.5 text-[12px] text-ink-muted">
        {field.valuedPoints.toLocaleString('en-US')} grid points{field.stride > 1 ? `, drawn from every ${field.stride}th point` : ''}. Band breaks and colours are Stormdraft's own choice.
      </p>
    </figure>
  );
}
