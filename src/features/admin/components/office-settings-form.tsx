import { useQueryClient } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { Panel } from '../../../components/ui/panel';
import { officeQueryOptions } from '../../../hooks/use-office';
import { useUnits } from '../../../hooks/use-units';
import { isApiError, type FieldErrors } from '../../../lib/api-client';
import { officeSettingsInputSchema, type OfficeSettings, type OfficeSettingsInput } from '../../../../shared/contracts/office';
import { formFailureFrom, parseForm } from '../../../utils/form';
import { readClock } from '../../../utils/time';
import { useUpdateOffice } from '../api/update-office';
import { toEditableLadder, toRiskLadder, type EditableLevel } from '../utils/risk-ladder-edits';
import { draftToGuidance, guidanceToDraft, type GuidanceDraft } from '../utils/guidance-draft';
import { GuidanceEditor } from './guidance-editor';
import { RiskLadderEditor } from './risk-ladder-editor';

type RegionSide = 'west' | 'south' | 'east' | 'north';
const regionSides: { side: RegionSide; label: string; hint: string }[] = [
  { side: 'west', label: 'West', hint: 'Longitude, ° (negative is west)' },
  { side: 'south', label: 'South', hint: 'Latitude, °' },
  { side: 'east', label: 'East', hint: 'Longitude, °' },
  { side: 'north', label: 'North', hint: 'Latitude, °' },
];

function timeZoneNames(): string[] {
  try {
    return Intl.supportedValuesOf('timeZone');
  } catch {
    return [];
  }
}

const zones = timeZoneNames();

/** Region sides are typed as text; an empty or non-numeric side gets a message of its own. */
function regionFromText(text: Record<RegionSide, string>): { values: Record<RegionSide, number>; errors: FieldErrors } {
  const errors: FieldErrors = {};
  const values = { west: 0, south: 0, east: 0, north: 0 };
  for (const { side, label } of regionSides) {
    const value = Number(text[side].trim());
    if (text[side].trim() === '' || !Number.isFinite(value)) errors[`region.${side}`] = `${label} must be a number of degrees.`;
    else values[side] = value;
  }
  return { values, errors };
}

/** Fields without a place of their own in the form are listed at the top. */
function unplacedErrors(errors: FieldErrors): string[] {
  const placed = /^(name|timeZone|region\.(west|south|east|north)|riskLadder(\.\d+\.(key|label|colour|meaning))?|guidance\.(levels\.[^.]+|hazards\.[^.]+\.[^.]+)(\.rules(\.\d+\.(figure|bound|value))?|\.minimumSharePercent|\.minimumCount)?)$/;
  return Object.entries(errors)
    .filter(([path]) => !placed.test(path))
    .map(([path, message]) => (path === '' ? message : `${path}: ${message}`));
}

interface OfficeSettingsFormProps {
  office: OfficeSettings;
  /** Called after a save or a reload, so the page can remount the form on the server's values. */
  onReset: (reason: 'saved' | 'reloaded') => void;
}

export function OfficeSettingsForm({ office, onReset }: OfficeSettingsFormProps) {
  const queryClient = useQueryClient();
  const updateOffice = useUpdateOffice();
  const [name, setName] = useState(office.name);
  const [timeZone, setTimeZone] = useState(office.timeZone);
  const [region, setRegion] = useState<Record<RegionSide, string>>({
    west: String(office.region.west),
    south: String(office.region.south),
    east: String(office.region.east),
    north: String(office.region.north),
  });
  const [rows, setRows] = useState<EditableLevel[]>(() => toEditableLadder(office.riskLadder));
  const { units } = useUnits();
  // The draft is built once in the units shown when the form opened, so they cannot drift under typed values.
  const [guidanceUnits] = useState(units);
  const [guidance, setGuidance] = useState<GuidanceDraft>(() => guidanceToDraft(office.guidance, guidanceUnits));
  const [allowSelfApproval, setAllowSelfApproval] = useState(office.allowSelfApproval);
  // The version this editor started from. Background refetches must not move it, or a save
  // would silently overwrite someone else's change instead of answering 409.
  const [baseVersion, setBaseVersion] = useState(office.version);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [conflict, setConflict] = useState(false);
  const [resolving, setResolving] = useState(false);

  function collect(version: number): OfficeSettingsInput | null {
    const regionParsed = regionFromText(region);
    const parsed = parseForm(officeSettingsInputSchema, {
      name,
      timeZone,
      region: regionParsed.values,
      riskLadder: toRiskLadder(rows),
      guidance: draftToGuidance(
        guidance,
        rows.map((r) => r.key),
        guidanceUnits,
      ),
      allowSelfApproval,
      version,
    });
    const fieldErrors = { ...(parsed.ok ? {} : parsed.error), ...regionParsed.errors };
    if (Object.keys(fieldErrors).length > 0 || !parsed.ok) {
      setErrors(fieldErrors);
      setFormError('Some fields need attention. The messages are next to them.');
      return null;
    }
    return parsed.value;
  }

  function save(version: number) {
    setFormError(null);
    const input = collect(version);
    if (input === null) return;
    setErrors({});
    updateOffice.mutate(input, {
      onSuccess: () => {
        setConflict(false);
        onReset('saved');
      },
      onError: (error) => {
        if (isApiError(error) && error.code === 'CONFLICT') {
          setConflict(true);
          return;
        }
        const failure = formFailureFrom(error);
        setErrors(failure.fields);
        setFormError(failure.message);
      },
    });
  }

  function handleSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    save(baseVersion);
  }

  async function reload() {
    setResolving(true);
    try {
      await queryClient.fetchQuery({ ...officeQueryOptions(), staleTime: 0 });
      onReset('reloaded');
    } catch (error) {
      setFormError(formFailureFrom(error).message);
    } finally {
      setResolving(false);
    }
  }

  /** Keeps this editor's values and saves them over the newer version. */
  async function keepMine() {
    setResolving(true);
    try {
      const latest = await queryClient.fetchQuery({ ...officeQueryOptions(), staleTime: 0 });
      setConflict(false);
      setBaseVersion(latest.version);
      save(latest.version);
    } catch (error) {
      setFormError(formFailureFrom(error).message);
    } finally {
      setResolving(false);
    }
  }

  const extraErrors = unplacedErrors(errors);
  const localTime = zones.includes(timeZone) ? readClock(new Date(), timeZone) : null;

  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-5" aria-label="Office settings">
      {conflict ? (
        <Notice
          tone="warning"
          title="Changed by someone else since you opened it"
          actions={
            <>
              <Button size="sm" variant="secondary" onClick={() => void reload()} disabled={resolving}>
                Reload
              </Button>
              <Button size="sm" onClick={() => void keepMine()} disabled={resolving} busy={updateOffice.isPending}>
                Keep mine
              </Button>
            </>
          }
        >
          Reload to see their version and lose your edits here, or keep yours and save it over theirs.
        </Notice>
      ) : null}
      {formError ? (
        <Notice tone="error" title={formError}>
          {extraErrors.length > 0 ? (
            <ul className="list-disc pl-4">
              {extraErrors.map((message) => (
                <li key={message}>{message}</li>
              ))}
            </ul>
          ) : null}
        </Notice>
      ) : null}

      <Panel title="Office" description="Shown in the status strip, on the public bulletin and in every e-mail.">
        <div className="grid gap-4 md:grid-cols-2">
          <TextField label="Office name" name="name" value={name} onChange={(e) => setName(e.target.value)} error={errors.name} />
          <div>
            <TextField
              label="Time zone"
              name="timeZone"
              list="time-zone-names"
              value={timeZone}
              onChange={(e) => setTimeZone(e.target.value)}
              error={errors.timeZone}
              hint={localTime ? `Local time there now: ${localTime.time} ${localTime.zone}` : 'An IANA name such as America/Chicago.'}
            />
            <datalist id="time-zone-names">
              {zones.map((zone) => (
                <option key={zone} value={zone} />
              ))}
            </datalist>
          </div>
        </div>
      </Panel>

      <Panel title="Region" description="The bounding box of the office's area, in decimal degrees. Maps open on it.">
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
          {regionSides.map(({ side, label, hint }) => (
            <TextField
              key={side}
              label={label}
              name={`region.${side}`}
              inputMode="decimal"
              value={region[side]}
              onChange={(e) => setRegion((current) => ({ ...current, [side]: e.target.value }))}
              error={errors[`region.${side}`]}
              hint={hint}
            />
          ))}
        </div>
      </Panel>

      <Panel
        title="Risk ladder"
        description="The levels forecasters grade risk areas with, lowest first. Always labelled with the level number and word, never colour alone."
      >
        <RiskLadderEditor
          rows={rows}
          errors={errors}
          onChange={(next) => {
            setRows(next);
            setErrors((current) => Object.fromEntries(Object.entries(current).filter(([path]) => !path.startsWith('riskLadder'))));
          }}
        />
      </Panel>

      <Panel title="Support-check guidance" description="The rules each sounding inside an area must meet, all at once, to back the area's level and each hazard flagged on it.">
        <GuidanceEditor levels={rows} value={guidance} onChange={setGuidance} errors={errors} units={guidanceUnits} />
      </Panel>

      <Panel title="Review" description="Who may approve a draft.">
        <label className="flex items-start gap-2 text-[14px]">
          <input type="checkbox" className="mt-1" checked={allowSelfApproval} onChange={(event) => setAllowSelfApproval(event.target.checked)} />
          <span>
            Let a lead approve a draft they edited last (one-person night shift). Every such approval is recorded in the outlook's audit trail. Leave this off to keep the four-eyes rule.
          </span>
        </label>
      </Panel>

      <div className="sticky bottom-0 flex items-center gap-3 border-t border-line bg-canvas py-3">
        <Button type="submit" busy={updateOffice.isPending}>
          {updateOffice.isPending ? 'Saving…' : 'Save settings'}
        </Button>
        <span className="text-[13px] text-ink-muted">Editing version {baseVersion}</span>
      </div>
    </form>
  );
}
