import { textColourOn, thresholdParameterKeys, type ThresholdParameterKey } from '../../../../shared/contracts/office';
import type { EditableLevel } from '../utils/risk-ladder-edits';

/** Thresholds as the editor holds them: text per level key and parameter ('' = no threshold). */
export type GuidanceText = Record<string, Partial<Record<ThresholdParameterKey, string>>>;

const columns: Record<ThresholdParameterKey, { label: string; unit: string }> = {
  mlCape: { label: 'MLCAPE', unit: 'J/kg' },
  muCape: { label: 'MUCAPE', unit: 'J/kg' },
  bulkShear0to6kmMs: { label: '0–6 km shear', unit: 'm/s' },
  srh0to1km: { label: '0–1 km SRH', unit: 'm²/s²' },
  stp: { label: 'STP', unit: '' },
  scp: { label: 'SCP', unit: '' },
};

/** A table of minimum medians per level: the support check compares each area's evidence with its row. */
export function GuidanceEditor({ levels, value, onChange, errors }: { levels: EditableLevel[]; value: GuidanceText; onChange: (next: GuidanceText) => void; errors: Record<string, string> }) {
  return (
    <div className="relative overflow-x-auto">
      <table className="w-full text-[13px] tabular-nums">
        <caption className="sr-only">Guidance thresholds: the median each level should reach</caption>
        <thead>
          <tr className="text-left text-ink-muted">
            <th scope="col" className="py-1 pr-3 font-medium">
              Level
            </th>
            {thresholdParameterKeys.map((key) => (
              <th key={key} scope="col" className="py-1 pr-3 font-medium">
                {columns[key].label}
                {columns[key].unit ? <span className="font-normal"> ({columns[key].unit})</span> : null}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {levels.map((level) => (
            <tr key={level.key} className="border-t border-line">
              <th scope="row" className="py-1.5 pr-3 text-left font-normal">
                <span className="rounded px-1.5 py-0.5" style={{ background: level.colour, color: textColourOn(level.colour) }}>
                  {level.label || level.key}
                </span>
              </th>
              {thresholdParameterKeys.map((key) => {
                const error = errors[`guidanceThresholds.${level.key}.${key}`];
                return (
                  <td key={key} className="py-1.5 pr-3">
                    <input
                      type="number"
                      min={0}
                      step="any"
                      inputMode="decimal"
                      aria-label={`${columns[key].label} expected for ${level.label || level.key}`}
                      aria-invalid={error ? true : undefined}
                      className="w-24 rounded border border-line bg-panel px-2 py-1 focus-visible:outline-2 focus-visible:outline-accent"
                      value={value[level.key]?.[key] ?? ''}
                      onChange={(event) => onChange({ ...value, [level.key]: { ...value[level.key], [key]: event.target.value } })}
                    />
                    {error ? <p className="mt-0.5 text-[12px] text-danger">{error}</p> : null}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-[12px] text-ink-muted">Leave a cell empty for no threshold. The support check is advisory: it never blocks saving or publishing.</p>
    </div>
  );
}

/** Stored thresholds → editor text. */
export function guidanceToText(guidance: Record<string, Partial<Record<ThresholdParameterKey, number>>>): GuidanceText {
  return Object.fromEntries(Object.entries(guidance).map(([level, values]) => [level, Object.fromEntries(Object.entries(values).map(([k, v]) => [k, String(v)]))]));
}

/** Editor text → thresholds for the levels still on the ladder (empty cells dropped; non-numbers kept for the schema to report). */
export function textToGuidance(text: GuidanceText, levelKeys: string[]): Record<string, Partial<Record<ThresholdParameterKey, number>>> {
  const result: Record<string, Partial<Record<ThresholdParameterKey, number>>> = {};
  for (const level of levelKeys) {
    const row: Partial<Record<ThresholdParameterKey, number>> = {};
    for (const key of thresholdParameterKeys) {
      const raw = text[level]?.[key]?.trim();
      if (raw) row[key] = Number(raw);
    }
    result[level] = row;
  }
  return result;
}
