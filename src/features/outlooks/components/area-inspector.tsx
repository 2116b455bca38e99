import { clsx } from 'clsx';
import { Trash2 } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import type { RiskLadder } from '../../../../shared/contracts/office';
import { hazardKinds, hazardLabels, type HazardKind } from '../../../../shared/contracts/outlooks';
import type { AreaCheck } from '../../../../shared/geometry/area-checks';
import { fixLabels, type AreaFix } from '../utils/area-fixes';
import type { DraftArea } from '../utils/outlook-document';

interface AreaInspectorProps {
  area: DraftArea;
  ladder: RiskLadder;
  checks: AreaCheck[];
  sizeKm2: number | null;
  readOnly: boolean;
  onChange: (change: Partial<Omit<DraftArea, 'id'>>, group?: string) => void;
  onFix: (fix: AreaFix) => void;
  onDelete: () => void;
}

function toggleHazard(hazards: DraftArea['hazards'], hazard: HazardKind, on: boolean): DraftArea['hazards'] {
  if (!on) return hazards.filter((h) => h.hazard !== hazard);
  if (hazards.some((h) => h.hazard === hazard)) return hazards;
  return hazardKinds.filter((k) => k === hazard || hazards.some((h) => h.hazard === k)).map((k) => hazards.find((h) => h.hazard === k) ?? { hazard: k, significant: false });
}

/** The selected area: its level from the ladder, hazards with significant flags, label and geometry findings. */
export function AreaInspector({ area, ladder, checks, sizeKm2, readOnly, onChange, onFix, onDelete }: AreaInspectorProps) {
  return (
    <div className="space-y-4">
      <fieldset disabled={readOnly}>
        <legend className="mb-1.5 text-[13px] font-semibold text-ink">Risk level</legend>
        <div className="grid gap-1">
          {ladder.map((level) => {
            const checked = level.key === area.levelKey;
            return (
              <label
                key={level.key}
                className={clsx('flex min-w-0 cursor-pointer items-center gap-2 rounded-md border px-2 py-1 text-[13px]', checked ? 'border-ink ring-1 ring-ink' : 'border-line hover:border-line-strong')}
              >
                <input type="radio" name={`level-${area.id}`} className="size-3.5 shrink-0 accent-[#172030]" checked={checked} onChange={() => onChange({ levelKey: level.key })} />
                <span aria-hidden className="h-4 w-6 shrink-0 rounded-sm ring-1 ring-black/20 ring-inset" style={{ backgroundColor: level.colour }} />
                <span className="shrink-0 font-semibold">{level.label}</span>
                <span className="ml-auto min-w-0 truncate text-[12px] text-ink-faint" title={level.meaning}>
                  {level.meaning}
                </span>
              </label>
            );
          })}
        </div>
      </fieldset>

      <fieldset disabled={readOnly}>
        <legend className="mb-1.5 text-[13px] font-semibold text-ink">Hazards</legend>
        <div className="grid gap-1">
          {hazardKinds.map((kind) => {
            const flag = area.hazards.find((h) => h.hazard === kind);
            return (
              <div key={kind} className="flex items-center gap-3 text-[13px]">
                <label className="flex w-36 items-center gap-2">
                  <input type="checkbox" checked={flag !== undefined} onChange={(event) => onChange({ hazards: toggleHazard(area.hazards, kind, event.target.checked) })} />
                  {hazardLabels[kind]}
                </label>
                <label className={clsx('flex items-center gap-1.5', flag === undefined && 'opacity-50')}>
                  <input
                    type="checkbox"
                    aria-label={`${hazardLabels[kind]} significant`}
                    disabled={flag === undefined}
                    checked={flag?.significant ?? false}
                    onChange={(event) => onChange({ hazards: area.hazards.map((h) => (h.hazard === kind ? { ...h, significant: event.target.checked } : h)) })}
                  />
                  significant
                </label>
              </div>
            );
          })}
        </div>
        <p className="mt-1 text-[12px] text-ink-faint">Significant: tornado EF2+, hail 5 cm+, gusts 120 km/h+. Shown as a bold inner outline and a badge.</p>
      </fieldset>

      <TextField label="Area label" value={area.label} maxLength={80} disabled={readOnly} placeholder="e.g. Lower river valley" onChange={(event) => onChange({ label: event.target.value }, `label-${area.id}`)} />

      <div>
        <h3 className="mb-1 text-[13px] font-semibold text-ink">Geometry checks</h3>
        {sizeKm2 !== null ? <p className="mb-1 text-[12px] text-ink-muted">{Math.round(sizeKm2).toLocaleString('en-US')} km²</p> : null}
        {checks.length === 0 ? (
          <p className="text-[13px] text-ok">No geometry findings.</p>
        ) : (
          <ul className="space-y-1.5" aria-label="Geometry findings">
            {checks.map((check) => (
              <li key={check.code} className={clsx('rounded-md border px-2 py-1.5 text-[13px]', check.severity === 'error' ? 'border-danger/30 bg-danger-soft' : 'border-warning-line bg-warning-soft')}>
                <p>{check.message}</p>
                {check.fix && !readOnly ? (
                  <Button size="sm" variant="secondary" className="mt-1" onClick={() => check.fix && onFix(check.fix)}>
                    {fixLabels[check.fix]}
                  </Button>
                ) : null}
              </li>
            ))}
          </ul>
        )}
      </div>

      {!readOnly ? (
        <Button variant="ghost" size="sm" onClick={onDelete}>
          <Trash2 aria-hidden className="size-4" /> Delete area
        </Button>
      ) : null}
    </div>
  );
}
