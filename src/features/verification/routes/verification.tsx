import type { QueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { Link } from 'react-router';
import type { VerificationSummary, VerificationSummaryQuery } from '../../../../shared/contracts/verification';
import { reportHazardLabels, reportHazards } from '../../../../shared/reports/storm-report';
import { aggregateByKey } from '../../../../shared/verification/aggregate';
import { buttonClasses } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { summarySearch, useVerificationSummary, verificationSummaryQuery } from '../api/get-verification-summary';
import { CsiSeries, type Series } from '../components/csi-series';
import { PerformanceDiagram } from '../components/performance-diagram';
import { ReportUpload } from '../components/report-upload';

export const verificationLoader = (queryClient: QueryClient) => async () => {
  await queryClient.ensureQueryData(verificationSummaryQuery({}));
  return null;
};

const hazardColours = ['#1f2533', '#0e6b73', '#8a4b08', '#4a63c4'];

function seriesOf(summary: VerificationSummary, hazard: VerificationSummaryQuery['hazard']): Series[] {
  if (hazard) {
    return [false, true].map((significant, i) => ({
      key: `${hazard}:${significant}`,
      label: `${significant ? 'Sig. ' : ''}${reportHazardLabels[hazard].toLowerCase()}`,
      colour: hazardColours[i] ?? '#1f2533',
      points: summary.rows.map((row) => ({ time: row.validFrom, csi: row.hazards.find((h) => h.hazard === hazard && h.significant === significant)?.scores.csi ?? null })),
    }));
  }
  const keys = [...new Set(summary.rows.flatMap((row) => row.levels.map((l) => l.levelKey)))];
  return keys.map((key) => {
    const step = summary.ladder.find((l) => l.key === key);
    return { key, label: step?.label ?? key, colour: step?.colour ?? '#1f2533', points: summary.rows.map((row) => ({ time: row.validFrom, csi: row.levels.find((l) => l.levelKey === key)?.scores.csi ?? null })) };
  });
}

/** The office's skill over time: performance diagram per level, CSI series, filters, CSV. By office and shift, never by person. */
export function VerificationPage() {
  const [query, setQuery] = useState<VerificationSummaryQuery>({});
  const summary = useVerificationSummary(query);
  const set = (patch: Partial<VerificationSummaryQuery>) => setQuery((q) => Object.fromEntries(Object.entries({ ...q, ...patch }).filter(([, v]) => v)) as VerificationSummaryQuery);
  const data = summary.data;
  const ladder = data?.ladder ?? [];
  const points = data
    ? aggregateByKey(data.rows.flatMap((row) => row.levels.map((l) => ({ key: l.levelKey, table: l.table })))).map((a) => {
        const step = ladder.find((l) => l.key === a.key);
        return { key: a.key, label: step?.label.split(' · ')[0] ?? a.key, colour: step?.colour ?? '#1f2533', successRatio: a.scores.successRatio, pod: a.scores.pod };
      })
    : [];
  const shifts = data ? aggregateByKey(data.rows.flatMap((row) => row.levels.map((l) => ({ key: `${row.shift}`, table: l.table })))) : [];

  return (
    <div className="space-y-5">
      <PageHeader
        title="Verification"
        description="How the office's outlooks verified against storm reports, scored automatically when each valid period ends. Summaries are by office and shift, never by forecaster."
        actions={
          <a className={buttonClasses('secondary')} href={`/api/verification/export.csv${summarySearch(query)}`} download>
            Download CSV
          </a>
        }
      />
      <form className="flex flex-wrap items-end gap-3" aria-label="Filters" onSubmit={(event) => event.preventDefault()}>
        <SelectField label="Day" value={query.day ?? ''} onChange={(e) => set({ day: (e.target.value || undefined) as VerificationSummaryQuery['day'] })} options={[{ value: '', label: 'All days' }, { value: '1', label: 'Day 1' }, { value: '2', label: 'Day 2' }, { value: '3', label: 'Day 3' }]} />
        <SelectField label="Level" value={query.level ?? ''} onChange={(e) => set({ level: e.target.value || undefined })} options={[{ value: '', label: 'All levels' }, ...ladder.map((l) => ({ value: l.key, label: l.label }))]} />
        <SelectField
          label="Hazard"
          value={query.hazard ?? ''}
          onChange={(e) => set({ hazard: (e.target.value || undefined) as VerificationSummaryQuery['hazard'] })}
          options={[{ value: '', label: 'Any severe report (levels)' }, ...reportHazards.map((h) => ({ value: h, label: reportHazardLabels[h] }))]}
        />
        <TextField label="From" type="date" value={query.from ?? ''} onChange={(e) => set({ from: e.target.value || undefined })} />
        <TextField label="To" type="date" value={query.to ?? ''} onChange={(e) => set({ to: e.target.value || undefined })} />
      </form>

      {summary.isPending ? <Loading label="Loading the scores…" /> : null}
      {summary.isError ? <Notice tone="error" title="The scores could not be loaded">{summary.error.message}</Notice> : null}
      {data ? (
        <>
          <div className="grid gap-5 lg:grid-cols-2">
            <section aria-labelledby="diagram-title" className="rounded-md border border-line bg-panel p-4">
              <h2 id="diagram-title" className="mb-2 text-sm font-semibold">
                Performance by level ({data.rows.length} scored issuance{data.rows.length === 1 ? '' : 's'})
              </h2>
              <PerformanceDiagram points={points} />
            </section>
            <section aria-labelledby="series-title" className="rounded-md border border-line bg-panel p-4">
              <h2 id="series-title" className="mb-2 text-sm font-semibold">
                CSI over time {query.hazard ? `— ${reportHazardLabels[query.hazard].toLowerCase()}` : 'by level'}
              </h2>
              <CsiSeries series={seriesOf(data, query.hazard)} />
              {shifts.length ? (
                <p className="mt-2 text-[13px] text-ink-muted">
                  By shift (all levels together): {shifts.map((s) => `${s.key} CSI ${s.scores.csi === null ? '—' : s.scores.csi.toFixed(2)}`).join(' · ')}
                </p>
              ) : null}
            </section>
          </div>
          <section aria-labelledby="issuances-title" className="rounded-md border border-line bg-panel p-4">
            <h2 id="issuances-title" className="mb-2 text-sm font-semibold">
              Issuances
            </h2>
            <div className="overflow-x-auto">
              <table className="w-full min-w-[30rem] text-left text-sm tabular-nums">
                <thead className="text-[13px] text-ink-muted">
                  <tr>
                    <th scope="col" className="py-1 pr-3 font-medium">Issuance</th>
                    <th scope="col" className="py-1 pr-3 font-medium">Day</th>
                    <th scope="col" className="py-1 pr-3 font-medium">Valid from (UTC)</th>
                    <th scope="col" className="py-1 pr-3 font-medium">Shift</th>
                    <th scope="col" className="py-1 font-medium">Lowest level CSI</th>
                  </tr>
                </thead>
                <tbody>
                  {data.rows.map((row) => (
                    <tr key={row.issuanceNumber} className="border-t border-line">
                      <td className="py-1 pr-3">
                        <Link className="font-medium text-accent underline" to={`/issuances/${row.issuanceNumber}`}>
                          {row.issuanceNumber}
                        </Link>
                      </td>
                      <td className="py-1 pr-3">{row.day}</td>
                      <td className="py-1 pr-3">{row.validFrom.slice(0, 16).replace('T', ' ')}</td>
                      <td className="py-1 pr-3">{row.shift}</td>
                      <td className="py-1">{row.levels[0]?.scores.csi === null || row.levels[0] === undefined ? '—' : row.levels[0].scores.csi.toFixed(2)}</td>
                    </tr>
                  ))}
                  {data.notScored.map((row) => (
                    <tr key={row.issuanceNumber} className="border-t border-line">
                      <td className="py-1 pr-3">
                        <Link className="font-medium text-accent underline" to={`/issuances/${row.issuanceNumber}`}>
                          {row.issuanceNumber}
                        </Link>
                      </td>
                      <td colSpan={4} className="py-1 text-ink-muted">
                        Not scored: {row.reason}
                      </td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </section>
        </>
      ) : null}
      <ReportUpload />
    </div>
  );
}
