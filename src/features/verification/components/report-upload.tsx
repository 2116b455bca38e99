import { useId, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useUploadStormReports } from '../api/upload-storm-reports';

/** Add storm reports from files (our CSV or GeoJSON points); each file is checked and stored on its own. */
export function ReportUpload() {
  const inputId = useId();
  const [files, setFiles] = useState<File[]>([]);
  const upload = useUploadStormReports();
  return (
    <section aria-labelledby={`${inputId}-title`} className="rounded-md border border-line bg-panel p-4">
      <h2 id={`${inputId}-title`} className="text-sm font-semibold">
        Add storm reports
      </h2>
      <p className="mt-1 text-[13px] text-ink-muted">
        CSV with a header row (time_utc, latitude, longitude, hazard, and optionally hail_cm, gust_kmh, gust_measured, ef_rating, source, remark) or GeoJSON points. Reports of the same
        hazard within 5 km and 15 minutes of one already stored are merged. Late reports re-score issuances whose period ended in the last three days.
      </p>
      <form
        className="mt-3 flex flex-wrap items-end gap-3"
        onSubmit={(event) => {
          event.preventDefault();
          if (files.length) upload.mutate(files);
        }}
      >
        <div>
          <label htmlFor={inputId} className="mb-1 block text-[13px] font-medium">
            Report files
          </label>
          <input id={inputId} type="file" multiple accept=".csv,.geojson,.json,text/csv,application/geo+json" onChange={(event) => setFiles([...(event.target.files ?? [])])} className="text-sm" />
        </div>
        <Button type="submit" busy={upload.isPending} disabled={files.length === 0}>
          Upload reports
        </Button>
      </form>
      {upload.isError ? <Notice tone="error" title="The upload failed" className="mt-3">{upload.error.message}</Notice> : null}
      {upload.data ? (
        <ul className="mt-3 space-y-2">
          {upload.data.files.map((file) =>
            file.ok ? (
              <li key={file.fileName}>
                <Notice tone="success" title={file.fileName}>
                  {file.stored} report{file.stored === 1 ? '' : 's'} stored, {file.merged} merged as duplicates{file.rescored.length ? `; scored again: ${file.rescored.join(', ')}` : ''}.
                </Notice>
              </li>
            ) : (
              <li key={file.fileName}>
                <Notice tone="error" title={file.fileName}>
                  {file.error.message}
                  {file.error.issues?.length ? (
                    <ul className="mt-1 list-disc pl-5">
                      {file.error.issues.slice(0, 20).map((issue) => (
                        <li key={`${issue.path}:${issue.message}`}>
                          {issue.path}: {issue.message}
                        </li>
                      ))}
                    </ul>
                  ) : null}
                </Notice>
              </li>
            ),
          )}
        </ul>
      ) : null}
    </section>
  );
}
