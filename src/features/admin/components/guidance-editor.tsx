import { useId } from 'react';
import { textColourOn } from '../../../../shared/contracts/office';
import { hazardKinds, type HazardKind } from '../../../../shared/contracts/risk-areas';
import type { Units } from '../../../../shared/contracts/users';
import { guidanceFigures, hazardFormLabel, hazardIngredients } from '../../../../shared/evidence/guidance';
import { keyFigureKeys, type KeyFigureKey } from '../../../../shared/sounding/key-figures';
import { Button } from '../../../components/ui/button';
import { FieldError, inputClasses } from '../../../components/ui/field';
import {
  displayUnit,
  emptyRuleSetDraft,
  newRuleDraft,
  setPath,
  type GuidanceDraft,
  type HazardForm,
  type HazardSetKey,
  type RuleSetDraft,
} from '../utils/guidance-draft';
import type { EditableLevel } from '../utils/risk-ladder-edits';

interface SetEditorProps {
  /** "Level 3 · Numerous", "significant tornado". */
  name: string;
  /** Error path prefix, e.g. guidance.levels.level3. */
  path: string;
  value: RuleSetDraft;
  onChange: (next: RuleSetDraft) => void;
  errors: Record<string, string>;
  units: Units;
  /** Figures offered first in the figure list (a hazard's ingredients). */
  suggested: readonly KeyFigureKey[];
  swatch?: { colour: string } | undefined;
}

const boundOptions = [
  { value: 'min', label: 'at least' },
  { value: 'max', label: 'at most' },
] as const;

/** One level's or one hazard form's rules: add, change or remove rules, the minimum share and count. */
function RuleSetEditor({ name, path, value, onChange, errors, units, suggested, swatch }: SetEditorProps) {
  const id = useId();
  const others = keyFigureKeys.filter((key) => !suggested.includes(key));
  const setRule = (index: number, patch: Partial<RuleSetDraft['rules'][number]>) =>
    onChange({ ...value, rules: value.rules.map((rule, i) => (i === index ? { ...rule, ...patch } : rule)) });
  const setError = errors[`${path}.rules`] ?? errors[path];
  const shareError = errors[`${path}.minimumSharePercent`];
  const countError = errors[`${path}.minimumCount`];
  return (
    <fieldset className="min-w-0 rounded-md border border-line p-3">
      <legend className="px-1 text-[14px] font-semibold">
        {swatch ? (
          <span className="rounded px-1.5 py-0.5" style={{ background: swatch.colour, color: textColourOn(swatch.colour) }}>
            {name}
          </span>
        ) : (
          <span className="capitalize">{name}</span>
        )}
      </legend>
      {value.rules.length === 0 ? <p className="text-[13px] text-ink-muted">No rules: any sounding inside counts as backing {name}.</p> : null}
      <ol className="space-y-2">
        {value.rules.map((rule, index) => {
          const rulePath = `${path}.rules.${index}`;
          const figureError = errors[`${rulePath}.figure`];
          const valueError = errors[`${rulePath}.value`] ?? errors[`${rulePath}.bound`];
          const ruleLabel = `${name}, rule ${index + 1}`;
          return (
            <li key={rule.key} className="flex flex-wrap items-end gap-2">
              <div className="min-w-[11rem] flex-1">
                <label htmlFor={`${id}-${rule.key}-figure`} className="mb-0.5 block text-[12px] text-ink-muted">
                  Figure <span className="sr-only">({ruleLabel})</span>
                </label>
                <select
                  id={`${id}-${rule.key}-figure`}
                  className={inputClasses}
                  value={rule.figure}
                  aria-invalid={figureError ? true : undefined}
                  onChange={(event) => {
                    const figure = keyFigureKeys.find((key) => key === event.target.value);
                    if (figure) setRule(index, { figure, storedSi: null });
                  }}
                >
                  {suggested.length > 0 ? (
                    <optgroup label="Ingredients of this hazard">
                      {suggested.map((key) => (
                        <option key={key} value={key}>
                          {guidanceFigures[key].label}
                        </option>
                      ))}
                    </optgroup>
                  ) : null}
                  <optgroup label={suggested.length > 0 ? 'Other key figures' : 'Key figures'}>
                    {others.map((key) => (
                      <option key={key} value={key}>
                        {guidanceFigures[key].label}
                      </option>
                    ))}
                  </optgroup>
                </select>
                {figureError ? <FieldError>{figureError}</FieldError> : null}
              </div>
              <div className="w-28">
                <label htmlFor={`${id}-${rule.key}-bound`} className="mb-0.5 block text-[12px] text-ink-muted">
                  Bound <span className="sr-only">({ruleLabel})</span>
                </label>
                <select
                  id={`${id}-${rule.key}-bound`}
                  className={inputClasses}
                  value={rule.bound}
                  onChange={(event) => setRule(index, { bound: event.target.value === 'max' ? 'max' : 'min' })}
                >
                  {boundOptions.map((option) => (
                    <option key={option.value} value={option.value}>
                      {option.label}
                    </option>
                  ))}
                </select>
              </div>
              <div className="w-36">
                <label htmlFor={`${id}-${rule.key}-value`} className="mb-0.5 block text-[12px] text-ink-muted">
                  Value{displayUnit(rule.figure, units) ? ` (${displayUnit(rule.figure, units)})` : ''} <span className="sr-only">({ruleLabel})</span>
                </label>
                <input
                  id={`${id}-${rule.key}-value`}
                  className={inputClasses}
                  inputMode="decimal"
                  value={rule.text}
                  aria-invalid={valueError ? true : undefined}
                  aria-describedby={valueError ? `${id}-${rule.key}-value-error` : undefined}
                  onChange={(event) => setRule(index, { text: event.target.value, storedSi: null })}
                />
              </div>
              <Button type="button" variant="ghost" size="sm" aria-label={`Remove ${ruleLabel}`} onClick={() => onChange({ ...value, rules: value.rules.filter((_, i) => i !== index) })}>
                Remove
              </Button>
              {valueError ? (
                <p id={`${id}-${rule.key}-value-error`} className="basis-full text-[13px] font-medium text-danger">
                  {valueError}
                </p>
              ) : null}
            </li>
          );
        })}
      </ol>
      {setError ? <FieldError>{setError}</FieldError> : null}
      <div className="mt-3 flex flex-wrap items-end gap-3">
        <Button type="button" variant="secondary" size="sm" onClick={() => onChange({ ...value, rules: [...value.rules, newRuleDraft(suggested[0] ?? 'mlCape')] })}>
          Add a rule to {name}
        </Button>
        <div className="w-36">
          <label htmlFor={`${id}-share`} className="mb-0.5 block text-[12px] text-ink-muted">
            Minimum share (%) <span className="sr-only">for {name}</span>
          </label>
          <input
            id={`${id}-share`}
            className={inputClasses}
            inputMode="decimal"
            placeholder="50"
            value={value.shareText}
            aria-invalid={shareError ? true : undefined}
            onChange={(event) => onChange({ ...value, shareText: event.target.value })}
          />
          {shareError ? <FieldError>{shareError}</FieldError> : null}
        </div>
        <div className="w-36">
          <label htmlFor={`${id}-count`} className="mb-0.5 block text-[12px] text-ink-muted">
            Minimum soundings <span className="sr-only">for {name}</span>
          </label>
          <input
            id={`${id}-count`}
            className={inputClasses}
            inputMode="numeric"
            value={value.countText}
            aria-invalid={countError ? true : undefined}
            onChange={(event) => onChange({ ...value, countText: event.target.value })}
          />
          {countError ? <FieldError>{countError}</FieldError> : null}
        </div>
      </div>
    </fieldset>
  );
}

const hazardForms: HazardForm[] = ['ordinary', 'significant'];

/** Where each hazard ingredient comes from, for the editor's help. */
function IngredientHelp() {
  return (
    <details className="rounded-md border border-line p-3 text-[13px]">
      <summary className="cursor-pointer font-medium">Where these ingredients come from</summary>
      <p className="mt-2 text-ink-muted">
        The rule values shipped with the demo office are invented: tune them to your office's climate. The ingredients themselves rest on published work:
      </p>
      <dl className="mt-2 space-y-2">
        {hazardKinds.map((hazard) => (
          <div key={hazard}>
            <dt className="font-medium capitalize">{hazardFormLabel(hazard, false)}</dt>
            <dd>
              <ul className="list-disc pl-5 text-ink-muted">
                {hazardIngredients[hazard].map((figure) => (
                  <li key={figure}>
                    <span className="text-ink">{guidanceFigures[figure].label}</span>: {guidanceFigures[figure].basis}
                  </li>
                ))}
              </ul>
            </dd>
          </div>
        ))}
      </dl>
    </details>
  );
}

interface GuidanceEditorProps {
  levels: EditableLevel[];
  value: GuidanceDraft;
  onChange: (next: GuidanceDraft) => void;
  errors: Record<string, string>;
  units: Units;
}

/**
 * The office guidance: rules per level and per hazard form. A sounding backs a level (or a
 * hazard) when it meets every rule at once; the support check counts the soundings that do.
 */
export function GuidanceEditor({ levels, value, onChange, errors, units }: GuidanceEditorProps) {
  const setLevel = (key: string, next: RuleSetDraft) => onChange({ ...value, levels: { ...value.levels, [key]: next } });
  const setHazard = (key: HazardSetKey, next: RuleSetDraft) => onChange({ ...value, hazards: { ...value.hazards, [key]: next } });
  return (
    <div className="space-y-4">
      <p className="text-[13px] text-ink-muted">
        A sounding backs a level when it meets every rule of the level at once. An area is supported when at least the minimum number of its soundings have every value the rules use
        and at least the minimum share of those back the level (half when left empty). Values are in your display units. The support check is advisory: it never blocks saving or
        publishing. Publishing stores these rules with the issuance.
      </p>
      <IngredientHelp />
      <section aria-label="Rules per level" className="grid gap-3 lg:grid-cols-2">
        {levels.map((level) => (
          <RuleSetEditor
            key={level.key}
            name={level.label || level.key}
            path={setPath('level', level.key)}
            value={value.levels[level.key] ?? emptyRuleSetDraft()}
            onChange={(next) => setLevel(level.key, next)}
            errors={errors}
            units={units}
            suggested={[]}
            swatch={{ colour: level.colour }}
          />
        ))}
      </section>
      <section aria-label="Rules per hazard" className="grid gap-3 lg:grid-cols-2">
        {hazardKinds.flatMap((hazard: HazardKind) =>
          hazardForms.map((form) => {
            const key: HazardSetKey = `${hazard}.${form}`;
            return (
              <RuleSetEditor
                key={key}
                name={hazardFormLabel(hazard, form === 'significant')}
                path={setPath('hazard', key)}
                value={value.hazards[key] ?? emptyRuleSetDraft()}
                onChange={(next) => setHazard(key, next)}
                errors={errors}
                units={units}
                suggested={hazardIngredients[hazard]}
              />
            );
          }),
        )}
      </section>
    </div>
  );
}
