import { ArrowDown, ArrowUp, Plus, RotateCcw, Trash2 } from 'lucide-react';
import { useId } from 'react';
import { Button } from '../../../components/ui/button';
import { FieldError, inputClasses } from '../../../components/ui/field';
import { RiskSwatch } from '../../../components/ui/risk-swatch';
import type { FieldErrors } from '../../../lib/api-client';
import {
  addLevel,
  defaultEditableLadder,
  isHexColour,
  moveLevel,
  removeLevel,
  updateLevel,
  type EditableLevel,
} from '../utils/risk-ladder-edits';

interface RiskLadderEditorProps {
  rows: readonly EditableLevel[];
  onChange: (rows: EditableLevel[]) => void;
  /** Field errors keyed like the server's issues: `riskLadder`, `riskLadder.2.colour`. */
  errors?: FieldErrors;
}

function LevelRow({
  row,
  index,
  count,
  rows,
  onChange,
  errors,
}: {
  row: EditableLevel;
  index: number;
  count: number;
  rows: readonly EditableLevel[];
  onChange: (rows: EditableLevel[]) => void;
  errors: FieldErrors;
}) {
  const id = useId();
  const name = row.label.trim() || `level ${index + 1}`;
  const error = (field: string) => errors[`riskLadder.${index}.${field}`];
  const set = (field: keyof EditableLevel, value: string) => onChange(updateLevel(rows, index, { [field]: value }));

  return (
    <li className="grid grid-cols-[2rem_minmax(0,1fr)_auto] gap-3 border-b border-line px-3 py-3 last:border-b-0" aria-label={`Risk level ${index + 1}: ${name}`}>
      <span className="pt-6 text-sm font-semibold text-ink-muted">{index + 1}</span>
      <div className="grid gap-2 sm:grid-cols-[8rem_minmax(0,1fr)_10rem]">
        <div>
          <label htmlFor={`${id}-key`} className="mb-1 block text-[12px] font-medium text-ink-muted">
            Key
          </label>
          <input id={`${id}-key`} className={inputClasses} value={row.key} onChange={(e) => set('key', e.target.value)} aria-invalid={error('key') ? true : undefined} />
          {error('key') ? <FieldError>{error('key')}</FieldError> : null}
        </div>
        <div>
          <label htmlFor={`${id}-label`} className="mb-1 block text-[12px] font-medium text-ink-muted">
            Label
          </label>
          <input id={`${id}-label`} className={inputClasses} value={row.label} onChange={(e) => set('label', e.target.value)} aria-invalid={error('label') ? true : undefined} />
          {error('label') ? <FieldError>{error('label')}</FieldError> : null}
        </div>
        <div>
          <label htmlFor={`${id}-hex`} className="mb-1 block text-[12px] font-medium text-ink-muted">
            Colour
          </label>
          <div className="flex gap-1.5">
            <input
              type="color"
              aria-label={`Colour picker for ${name}`}
              className="h-8 w-9 shrink-0 cursor-pointer rounded border border-line-strong bg-panel p-0.5"
              value={isHexColour(row.colour) ? row.colour.toLowerCase() : '#000000'}
              onChange={(e) => set('colour', e.target.value)}
            />
            <input
              id={`${id}-hex`}
              className={`${inputClasses} font-mono`}
              value={row.colour}
              maxLength={7}
              spellCheck={false}
              onChange={(e) => set('colour', e.target.value.trim())}
              aria-invalid={error('colour') ? true : undefined}
            />
          </div>
          {error('colour') ? <FieldError>{error('colour')}</FieldError> : null}
        </div>
        <div className="sm:col-span-2">
          <label htmlFor={`${id}-meaning`} className="mb-1 block text-[12px] font-medium text-ink-muted">
            Meaning
          </label>
          <input id={`${id}-meaning`} className={inputClasses} value={row.meaning} onChange={(e) => set('meaning', e.target.value)} aria-invalid={error('meaning') ? true : undefined} />
          {error('meaning') ? <FieldError>{error('meaning')}</FieldError> : null}
        </div>
        <div className="flex items-end pb-1">
          <RiskSwatch label={row.label.trim() || `Level ${index + 1}`} colour={row.colour} />
        </div>
      </div>
      <div className="flex flex-col gap-1 pt-5">
        <Button size="sm" variant="ghost" aria-label={`Move ${name} up`} disabled={index === 0} onClick={() => onChange(moveLevel(rows, index, -1))}>
          <ArrowUp aria-hidden className="size-4" />
        </Button>
        <Button size="sm" variant="ghost" aria-label={`Move ${name} down`} disabled={index === count - 1} onClick={() => onChange(moveLevel(rows, index, 1))}>
          <ArrowDown aria-hidden className="size-4" />
        </Button>
        <Button size="sm" variant="ghost" aria-label={`Remove ${name}`} disabled={count === 1} onClick={() => onChange(removeLevel(rows, index))}>
          <Trash2 aria-hidden className="size-4" />
        </Button>
      </div>
    </li>
  );
}

/** Edits the office's risk ladder: lowest risk first, darker colours for higher levels. */
export function RiskLadderEditor({ rows, onChange, errors = {} }: RiskLadderEditorProps) {
  const ladderError = errors.riskLadder;
  return (
    <div className="space-y-3">
      <div aria-label="Preview of the risk ladder" role="group" className="rounded-md border border-line bg-sunken p-3">
        <p className="mb-2 text-[12px] font-semibold tracking-wide text-ink-muted uppercase">Preview, lowest to highest</p>
        <ol className="flex flex-wrap gap-1.5">
          {rows.map((row, index) => (
            <li key={row.rowId}>
              <RiskSwatch label={row.label.trim() || `Level ${index + 1}`} colour={row.colour} />
            </li>
          ))}
        </ol>
      </div>
      {ladderError ? <FieldError>{ladderError}</FieldError> : null}
      <ol className="rounded-md border border-line bg-panel">
        {rows.map((row, index) => (
          <LevelRow key={row.rowId} row={row} index={index} count={rows.length} rows={rows} onChange={onChange} errors={errors} />
        ))}
      </ol>
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" size="sm" onClick={() => onChange(addLevel(rows))} disabled={rows.length >= 12}>
          <Plus aria-hidden className="size-4" />
          Add level
        </Button>
        <Button variant="ghost" size="sm" onClick={() => onChange(defaultEditableLadder())}>
          <RotateCcw aria-hidden className="size-4" />
          Reset to defaults
        </Button>
      </div>
    </div>
  );
}
