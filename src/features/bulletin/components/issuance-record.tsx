import { supportResultLabels } from '../../../../shared/evidence/support-check';
import type { Issuance } from '../api/issuance-schema';
import { stepFor } from '../utils/issuance-format';

/** The permanent page's record of an issuance: the evidence at publication and who wrote, approved and published it. */
export function IssuanceRecord({ issuance }: { issuance: Issuance }) {
  const snapshot = issuance.snapshot;
  const ladder = snapshot.riskLadder;
  return (
    <>
      <section aria-labelledby={`evidence-${issuance.number}`} className="rounded-md border border-line bg-panel p-4">
        <h3 id={`evidence-${issuance.number}`} className="mb-2 text-sm font-semibold">
          Evidence at publication
        </h3>
        {snapshot.evidence.length === 0 ? (
          <p className="text-sm text-ink-muted">No evidence summary was recorded.</p>
        ) : (
          <table className="w-full text-left text-sm">
            <thead className="text-[13px] text-ink-muted">
              <tr>
                <th className="py-1 pr-3 font-medium">Area</th>
                <th className="py-1 pr-3 font-medium">Soundings inside</th>
                <th className="py-1 font-medium">Support check</th>
              </tr>
            </thead>
            <tbody>
              {snapshot.evidence.map((row) => {
                const area = snapshot.areas.find((a) => a.id === row.areaId);
                return (
                  <tr key={row.areaId} className="border-t border-line align-top">
                    <td className="py-1.5 pr-3">
                      {stepFor(ladder, row.levelKey).label}
                      {area?.label ? <span className="text-ink-muted"> — {area.label}</span> : null}
                    </td>
                    <td className="py-1.5 pr-3">{row.count}</td>
                    <td className="py-1.5">
                      <span className="font-medium">{supportResultLabels[row.support.result]}</span>
                      {row.support.reasons.length ? <span className="block text-[13px] text-ink-muted">{row.support.reasons.join('; ')}</span> : null}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        )}
      </section>
      <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-3 gap-y-0.5 text-sm">
        <dt className="text-ink-muted">Office</dt>
        <dd>{snapshot.office.name}</dd>
        <dt className="text-ink-muted">Written by</dt>
        <dd>{snapshot.authorName ?? '—'}</dd>
        <dt className="text-ink-muted">Approved by</dt>
        <dd>{snapshot.approverName ?? '—'}</dd>
        <dt className="text-ink-muted">Published by</dt>
        <dd>{snapshot.publisherName ?? '—'}</dd>
      </dl>
    </>
  );
}
