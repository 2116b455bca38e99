import { useState, type FormEvent } from 'react';
import { updateSoundingMetadataInputSchema, type SoundingSummary } from '../../../../shared/contracts/soundings';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { useUpdateSoundingMetadata } from '../api/update-sounding-metadata';

/** What a stored sounding still needs before it counts as evidence (empty: nothing). */
export function missingEvidenceFields(sounding: Pick<SoundingSummary, 'stationId' | 'latitude' | 'longitude' | 'validTime'>): string[] {
  const missing: string[] = [];
  if (sounding.stationId === '') missing.push('station');
  if (sounding.latitude === null) missing.push('latitude');
  if (sounding.longitude === null) missing.push('longitude');
  if (sounding.validTime === null) missing.push('valid time');
  return missing;
}

/**
 * The metadata form of a sounding: station, position, valid time and source. Shown to authors
 * when the upload lacked any of them; the server checks the role (uploader or lead).
 */
export function SoundingMetadataForm({ sounding }: { sounding: SoundingSummary }) {
  const update = useUpdateSoundingMetadata();
  const [values, setValues] = useState({
    station: sounding.stationId,
    name: sounding.stationName,
    latitude: sounding.latitude === null ? '' : String(sounding.latitude),
    longitude: sounding.longitude === null ? '' : String(sounding.longitude),
    validTime: sounding.validTime ?? '',
    source: sounding.source,
  });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const missing = missingEvidenceFields(sounding);
  if (missing.length === 0) return null;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = updateSoundingMetadataInputSchema.safeParse({
      ...values,
      latitude: values.latitude === '' ? undefined : Number(values.latitude),
      longitude: values.longitude === '' ? undefined : Number(values.longitude),
    });
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((issue) => [String(issue.path[0] ?? 'form'), issue.message])));
      return;
    }
    setErrors({});
    update.mutate({ soundingId: sounding.id, input: parsed.data });
  };
  const set = (key: keyof typeof values) => (event: { target: { value: string } }) => setValues({ ...values, [key]: event.target.value });
  return (
    <section aria-labelledby="sounding-metadata-title" className="mb-4 rounded-md border border-line bg-panel px-3.5 py-3 text-sm">
      <h2 id="sounding-metadata-title" className="font-semibold text-ink">
        Not yet evidence: {missing.join(', ')} missing
      </h2>
      <p className="mt-1 text-[13px] text-ink-muted">Fill these in so the sounding counts in outlook evidence.</p>
      <form onSubmit={submit} className="mt-2 grid grid-cols-2 gap-2 sm:grid-cols-3" noValidate>
        <TextField label="Station" value={values.station} onChange={set('station')} error={errors.station} />
        <TextField label="Station name" value={values.name} onChange={set('name')} error={errors.name} />
        <TextField label="Latitude (°N)" inputMode="decimal" value={values.latitude} onChange={set('latitude')} error={errors.latitude} />
        <TextField label="Longitude (°E)" inputMode="decimal" value={values.longitude} onChange={set('longitude')} error={errors.longitude} />
        <TextField label="Valid time (UTC, e.g. 2027-04-18T18:00:00Z)" value={values.validTime} onChange={set('validTime')} error={errors.validTime} />
        <SelectField
          label="Source"
          value={values.source}
          onChange={set('source')}
          options={[
            { value: 'observed', label: 'Observed' },
            { value: 'model', label: 'Model' },
            { value: 'unknown', label: 'Unknown' },
          ]}
        />
        <div className="col-span-full flex items-center gap-3">
          <Button type="submit" size="sm" busy={update.isPending}>
            Save details
          </Button>
          {update.isError ? <span className="text-[13px] font-medium text-danger">{update.error.message}</span> : null}
        </div>
      </form>
    </section>
  );
}
