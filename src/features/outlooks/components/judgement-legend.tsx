import type { SoundingJudgement } from '../../../../shared/evidence/area-report';
import { judgementSymbols } from '../../../lib/map/judgement-symbol';

const order: SoundingJudgement[] = ['backs', 'fails', 'lacks', 'inside'];

/** The legend of the judgement shapes drawn around the selected area's soundings, with counts. */
export function JudgementLegend({ counts, preview }: { counts: Record<SoundingJudgement, number>; preview: boolean }) {
  const shown = order.filter((kind) => counts[kind] > 0 || kind !== 'inside');
  return (
    <div className="text-[12px]" data-testid="judgement-legend">
      <p className="font-medium">Soundings in the selected area{preview ? ' (live preview)' : ''}</p>
      <ul className="mt-0.5 flex flex-wrap gap-x-3 gap-y-1">
        {shown.map((kind) => {
          const symbol = judgementSymbols[kind];
          return (
            <li key={kind} className="flex items-center gap-1" data-testid={`judgement-${kind}`}>
              <svg width="16" height="16" viewBox="0 0 22 22" aria-hidden="true" className="shrink-0">
                <circle cx="11" cy="11" r="4" fill="#ffffff" stroke="#172030" strokeWidth="1" />
                <path d={symbol.path} fill="none" stroke={symbol.colour} strokeWidth={symbol.width} strokeLinecap="round" strokeDasharray={symbol.dash} />
              </svg>
              <span>
                <span className="tabular-nums font-semibold">{counts[kind]}</span> {symbol.legend}
              </span>
            </li>
          );
        })}
      </ul>
    </div>
  );
}
