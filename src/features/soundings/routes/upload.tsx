import { useState } from 'react';
import { ButtonLink } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import type { UploadResponse } from '../../../../shared/contracts/soundings';
import { formFailureFrom } from '../../../utils/form';
import { useUploadSoundings } from '../api/upload-soundings';
import { UploadDropZone } from '../components/upload-drop-zone';
import { UploadResults } from '../components/upload-results';
import { batchCount, planUpload, type RefusedFile } from '../utils/upload-checks';

interface Outcome {
  response: UploadResponse | null;
  refused: RefusedFile[];
}

function summary({ response, refused }: Outcome): string {
  const accepted = response?.accepted ?? 0;
  const rejected = (response?.rejected ?? 0) + refused.length;
  const files = (n: number) => `${n} ${n === 1 ? 'file' : 'files'}`;
  if (rejected === 0) return `${files(accepted)} stored.`;
  if (accepted === 0) return `Nothing stored: ${files(rejected)} rejected. Fix the lines listed below and upload those files again.`;
  return `${files(accepted)} stored, ${files(rejected)} rejected. Fix the rejected files and upload them again; the stored ones stay.`;
}

export function SoundingUploadPage() {
  const upload = useUploadSoundings();
  const [outcome, setOutcome] = useState<Outcome | null>(null);
  const [sending, setSending] = useState(0);

  function handleFiles(files: File[]) {
    const plan = planUpload(files);
    setOutcome({ response: null, refused: plan.refused });
    if (plan.send.length === 0) return;
    setSending(plan.send.length);
    upload.mutate(plan.send, { onSuccess: (response) => setOutcome({ response, refused: plan.refused }) });
  }

  return (
    <>
      <PageHeader
        title="Upload soundings"
        description="Bring observed balloon soundings and model forecast soundings into the library. Each file is checked on its own; accepted files open on the diagram."
        actions={
          <ButtonLink to="/soundings" variant="secondary">
            Sounding library
          </ButtonLink>
        }
      />
      <div className="max-w-4xl space-y-4">
        <UploadDropZone onFiles={handleFiles} busy={upload.isPending} />
        {upload.isPending ? (
          <Notice title={`Uploading ${sending} ${sending === 1 ? 'file' : 'files'}…`}>
            {batchCount(sending) > 1 ? `Sent in ${batchCount(sending)} batches; results appear when all are checked.` : 'Results appear when every file is checked.'}
          </Notice>
        ) : null}
        {upload.isError ? (
          <Notice tone="error" title="The upload did not go through">
            {formFailureFrom(upload.error).message}
          </Notice>
        ) : null}
        {outcome && !upload.isPending && (outcome.response !== null || outcome.refused.length > 0) ? (
          <section aria-labelledby="upload-results-title" className="space-y-2">
            <h2 id="upload-results-title" className="text-sm font-semibold text-ink">
              Results
            </h2>
            <p className="text-sm text-ink-muted" role="status">
              {summary(outcome)}
            </p>
            <UploadResults results={outcome.response?.results ?? []} refused={outcome.refused} />
          </section>
        ) : null}
        <details className="rounded-lg border border-line bg-panel px-4 py-3 text-[13px] text-ink-muted">
          <summary className="cursor-pointer font-medium text-ink">The exchange-CSV format</summary>
          <p className="mt-2">
            Header lines start with <code>#</code> and give <code>station</code>, <code>name</code>, <code>latitude</code>, <code>longitude</code>,{' '}
            <code>elevation_m</code>, <code>valid</code> (ISO 8601, UTC) and <code>source</code> (<code>observed</code> or <code>model</code>). Then a row of column names such as{' '}
            <code>pressure_hPa, height_m, temperature_C, dewpoint_C, wind_direction_deg, wind_speed_kt</code>, and one row per level, from the surface up. Pressure, temperature and wind columns may also be given in other units (for example <code>temperature_F</code>, <code>wind_speed_ms</code>).
          </p>
        </details>
      </div>
    </>
  );
}
