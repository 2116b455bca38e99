import { useState } from 'react';
import { MAX_EVIDENCE_RUNS } from '../../../shared/contracts/model-fields';
import { useEvidenceRuns, useUpdateEvidenceRuns } from '../../api/model-fields/evidence-runs';
import { runName } from './field-display';

/**
 * Which model runs feed the outlook's evidence: a tick per run valid in the outlook period.
 * With nothing ticked the newest runs valid in the period feed it (the default). Each change is
 * stored at once with the version loaded; a conflicting change by someone else is reported.
 */
export function EvidenceRunPicker({ outlookId, editable }: { outlookId: string; editable: boolean }) {
  const selection = useEvidenceRuns(outlookId);
  const update = useUpdateEvidenceRuns(outlookId);
  const [problem, setProblem] = useState<string | null>(null);
  // The pick being stored, shown at once so a tick does not wait for the server.
  const [pending, setPending] = useState<string[] | null>(null);
  if (selection.isError) return <p className="text-[13px] text-danger">The model runs could not be loaded: {selection.error.message}</p>;
  if (!selection.data) return <p className="text-[13px] text-ink-muted">Loading model runs…</p>;
  const { mode, runs, available, version } = selection.data;
  const chosen = new Set(pending ?? (mode === 'chosen' ? runs.map((r) => r.id) : []));
  const toggle = (runId: string, on: boolean) => {
    const next = on ? [...chosen, runId] : [...chosen].filter((id) => id !== runId);
    setProblem(null);
    setPending(next);
    update.mutate({ version, runIds: next }, { onError: (error) => setProblem(error.message), onSettled: () => setPending(null) });
  };
  return (
    <fieldset className="space-y-1.5 text-[13px]" aria-busy={update.isPending || undefined}>
      <legend className="font-semibold">Model runs in the evidence</legend>
      <p className="text-[12px] text-ink-muted">
        {mode === 'default'
          ? `None picked: the newest runs valid in the outlook period feed the evidence (at most ${MAX_EVIDENCE_RUNS}).`
          : `Picked by the author (at most ${MAX_EVIDENCE_RUNS}).`}{' '}
        Now: {runs.length ? runs.map(runName).join('; ') : 'no model run'}.
      </p>
      {available.length === 0 ? <p className="text-[12px] text-ink-muted">No ready model run is valid in the outlook period.</p> : null}
      <ul className="space-y-0.5">
        {available.map((run) => (
          <li key={run.id}>
            <label className="flex items-center gap-1.5">
              <input
                type="checkbox"
                checked={chosen.has(run.id)}
                disabled={!editable || update.isPending || (!chosen.has(run.id) && chosen.size >= MAX_EVIDENCE_RUNS)}
                onChange={(event) => toggle(run.id, event.target.checked)}
              />
              {runName(run)} <span className="text-ink-muted">· valid {run.validTime.slice(11, 16)} UTC · {run.soundingCount.toLocaleString('en-US')} soundings</span>
            </label>
          </li>
        ))}
      </ul>
      {problem ? (
        <p role="alert" className="text-[12px] text-danger">
          {problem}
        </p>
      ) : null}
    </fieldset>
  );
}
