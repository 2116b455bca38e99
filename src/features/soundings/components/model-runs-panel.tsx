import { ChevronLeft, ChevronRight, Trash2 } from 'lucide-react';
import { useState } from 'react';
import { Link } from 'react-router';
import type { ModelRunSummary } from '../../../../shared/contracts/model-runs';
import type { Role } from '../../../../shared/contracts/common';
import { hasRole, subscriberOverseerRoles } from '../../../../shared/workflow/roles';
import { Button } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { Panel } from '../../../components/ui/panel';
import type { UnitFormatters } from '../../../hooks/use-units';
import { formatTimestampUtc } from '../../../utils/time';
import { formFailureFrom } from '../../../utils/form';
import { GRID_PAGE_SIZE, useDeleteModelRun, useModelRuns, useRunSoundings } from '../api/model-runs';
import { figureDefinitions, libraryFigureKeys } from '../utils/sounding-figures';

/** How a run is named in the filter and the list: model, cycle and forecast hour. */
export function runLabel(run: ModelRunSummary): string {
  return `${run.model} ${formatTimestampUtc(run.cycleTime)} +${run.forecastHour} h`;
}

const kilobytes = (bytes: number) => `${(bytes / 1024).toFixed(bytes < 10_240 ? 1 : 0)} KB`;

interface ModelRunsPanelProps {
  /** The run the library is filtered to (its grid soundings are listed), or undefined. */
  runId: string | undefined;
  onRunChange: (runId: string | undefined) => void;
  role: Role | undefined;
  units: UnitFormatters;
}

/**
 * The library's model runs: a filter that lists one run's grid soundings, and the list of runs
 * with their counts, state and size (lead forecasters and administrators may delete a run).
 */
export function ModelRunsPanel({ runId, onRunChange, role, units }: ModelRunsPanelProps) {
  const runs = useModelRuns();
  const deleteRun = useDeleteModelRun();
  const [problem, setProblem] = useState<string | null>(null);
  const mayDelete = role !== undefined && hasRole(role, subscriberOverseerRoles);
  const list = runs.data ?? [];
  if (runs.isPending) return <Loading label="Loading model runs…" />;
  if (runs.isError) return <Notice tone="error" title="We could not load the model runs">{runs.error.message}</Notice>;
  if (list.length === 0) return null;
  const selected = list.find((run) => run.id === runId);

  return (
    <Panel title="Model runs" description="Grid soundings from model files, one run per model, cycle and forecast hour. Pick a run to list its soundings.">
      <div className="space-y-3">
        <div className="flex flex-wrap items-center gap-2">
          <label htmlFor="library-run" className="text-[13px] text-ink-muted">
            Run
          </label>
          <select
            id="library-run"
            className="rounded-md border border-line-strong bg-panel px-2 py-1 text-sm text-ink"
            value={runId ?? ''}
            onChange={(event) => onRunChange(event.target.value === '' ? undefined : event.target.value)}
          >
            <option value="">Uploaded soundings (no run)</option>
            {list.map((run) => (
              <option key={run.id} value={run.id}>
                {runLabel(run)} · {run.soundingCount} soundings
              </option>
            ))}
          </select>
        </div>
        {problem ? <Notice tone="error">{problem}</Notice> : null}
        <table className="w-full text-left text-[13px]">
          <caption className="sr-only">Model runs</caption>
          <thead className="text-ink-muted">
            <tr>
              <th scope="col" className="py-1 pr-3 font-medium">Run</th>
              <th scope="col" className="py-1 pr-3 font-medium">Valid</th>
              <th scope="col" className="py-1 pr-3 text-right font-medium">Soundings</th>
              <th scope="col" className="py-1 pr-3 font-medium">State</th>
              <th scope="col" className="py-1 pr-3 text-right font-medium">Stored</th>
              {mayDelete ? <th scope="col" className="py-1 font-medium"><span className="sr-only">Actions</span></th> : null}
            </tr>
          </thead>
          <tbody>
            {list.map((run) => (
              <tr key={run.id} className="border-t border-line">
                <td className="py-1 pr-3">{runLabel(run)}</td>
                <td className="py-1 pr-3">{formatTimestampUtc(run.validTime)}</td>
                <td className="py-1 pr-3 text-right tabular-nums">{run.soundingCount}</td>
                <td className="py-1 pr-3">{run.state === 'failed' ? `failed: ${run.failure ?? 'no reason given'}` : run.state}</td>
                <td className="py-1 pr-3 text-right tabular-nums">
                  {kilobytes(run.storedBytes)}
                  {run.bytesPerSounding !== null ? <span className="text-ink-faint"> ({run.bytesPerSounding} B each)</span> : null}
                </td>
                {mayDelete ? (
                  <td className="py-1">
                    <Button
                      size="sm"
                      variant="ghost"
                      busy={deleteRun.isPending && deleteRun.variables === run.id}
                      aria-label={`Delete run ${runLabel(run)}`}
                      onClick={() => {
                        if (!window.confirm(`Delete ${runLabel(run)} and its ${run.soundingCount} grid soundings?`)) return;
                        setProblem(null);
                        deleteRun.mutate(run.id, {
                          onSuccess: () => (run.id === runId ? onRunChange(undefined) : undefined),
                          onError: (error) => setProblem(formFailureFrom(error).message),
                        });
                      }}
                    >
                      <Trash2 aria-hidden className="size-3.5" />
                    </Button>
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
        {selected ? <RunSoundings run={selected} units={units} /> : null}
      </div>
    </Panel>
  );
}

/** One run's grid soundings, a page at a time, each opening on its own page. */
function RunSoundings({ run, units }: { run: ModelRunSummary; units: UnitFormatters }) {
  const [offset, setOffset] = useState(0);
  const page = useRunSoundings(run.id, offset);
  if (page.isPending) return <Loading label="Loading the run's soundings…" />;
  if (page.isError) return <Notice tone="error" title="We could not load the run's soundings">{page.error.message}</Notice>;
  const { total, items } = page.data;
  return (
    <div className="space-y-2">
      <table className="w-full text-left text-[13px]">
        <caption className="text-left text-sm font-semibold text-ink">Grid soundings of {runLabel(run)}</caption>
        <thead className="text-ink-muted">
          <tr>
            <th scope="col" className="py-1 pr-3 font-medium">Point</th>
            <th scope="col" className="py-1 pr-3 font-medium">Position</th>
            {libraryFigureKeys.map((key) => (
              <th key={key} scope="col" className="py-1 pr-3 text-right font-medium">
                {figureDefinitions[key].label} <span className="text-ink-faint">{figureDefinitions[key].unit(units)}</span>
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {items.map((item) => (
            <tr key={item.id} className="border-t border-line">
              <td className="py-1 pr-3">
                <Link className="text-accent underline-offset-2 hover:underline" to={`/soundings/grid/${encodeURIComponent(item.id)}`}>
                  {item.pointIndex}
                </Link>
              </td>
              <td className="py-1 pr-3 tabular-nums">
                {item.latitude.toFixed(2)}, {item.longitude.toFixed(2)}
              </td>
              {libraryFigureKeys.map((key) => (
                <td key={key} className="py-1 pr-3 text-right tabular-nums">
                  {figureDefinitions[key].value(item.keyFigures[key] ?? null, units)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      <nav aria-label="Pages of grid soundings" className="flex items-center justify-between text-[13px] text-ink-muted">
        <p>
          {total === 0 ? 0 : offset + 1}–{Math.min(offset + GRID_PAGE_SIZE, total)} of {total} grid soundings
        </p>
        <div className="flex items-center gap-2">
          <Button size="sm" variant="secondary" disabled={offset === 0} onClick={() => setOffset(Math.max(0, offset - GRID_PAGE_SIZE))}>
            <ChevronLeft aria-hidden className="size-3.5" />
            Previous
          </Button>
          <Button size="sm" variant="secondary" disabled={offset + GRID_PAGE_SIZE >= total} onClick={() => setOffset(offset + GRID_PAGE_SIZE)}>
            Next
            <ChevronRight aria-hidden className="size-3.5" />
          </Button>
        </div>
      </nav>
    </div>
  );
}
