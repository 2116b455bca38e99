import { RiskSwatch } from '../../../components/ui/risk-swatch';
import type { LadderStep } from '../utils/issuance-format';

/** The levels drawn on the map, each as its colour with the level number and word. */
export function MapLegend({ levels, significantShown }: { levels: readonly LadderStep[]; significantShown: boolean }) {
  return (
    <div className="text-[13px]">
      <h3 className="sr-only">Map legend</h3>
      <ul aria-label="Map legend" className="flex flex-wrap items-center gap-1.5">
        {levels.map((level) => (
          <li key={level.key}>
            <RiskSwatch label={level.label} colour={level.colour} />
          </li>
        ))}
        {significantShown ? (
          <li className="flex items-center gap-1.5 text-ink-muted">
            <span aria-hidden className="inline-block h-3.5 w-6 rounded-sm border-[3px] border-[#101624] bg-panel" />
            Bold outline: significant hazard
          </li>
        ) : null}
      </ul>
    </div>
  );
}
