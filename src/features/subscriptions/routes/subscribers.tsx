import type { QueryClient } from '@tanstack/react-query';
import type { FeatureCollection, Point } from 'geojson';
import { Users } from 'lucide-react';
import { useMemo, useState } from 'react';
import { EmptyState } from '../../../components/ui/empty-state';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { RiskSwatch } from '../../../components/ui/risk-swatch';
import { officeQueryOptions, useOffice } from '../../../hooks/use-office';
import { AreaEditorMap } from '../../../lib/map/area-editor-map';
import type { PointProperties } from '../../../lib/map/point-map';
import { subscribersQueryOptions, useSubscribers } from '../api/get-subscribers';
import { areasOfInterestCollection, hazardsSummary, standingOf } from '../utils/alert-settings';

export const subscribersLoader = (queryClient: QueryClient) => () =>
  Promise.all([queryClient.prefetchQuery(subscribersQueryOptions()), queryClient.prefetchQuery(officeQueryOptions())]);

const noPoints: FeatureCollection<Point, PointProperties> = { type: 'FeatureCollection', features: [] };
const standingWords = { unsubscribed: 'Unsubscribed', paused: 'Paused', 'no-areas': 'No areas', active: 'Receiving' } as const;

/** Who receives outlook e-mails, for leads and admins: count, table and every area of interest on one map. */
export function SubscribersPage() {
  const subscribers = useSubscribers();
  const office = useOffice();
  const [selectedId, setSelectedId] = useState<string | null>(null);

  const features = useMemo(
    () => areasOfInterestCollection((subscribers.data?.subscribers ?? []).flatMap((s) => s.areas.map((a) => ({ id: a.id, name: `${a.name} (${s.name})`, geometry: a.geometry })))),
    [subscribers.data],
  );

  return (
    <>
      <PageHeader
        title="Subscribers"
        description={subscribers.data ? `${subscribers.data.count} subscriber${subscribers.data.count === 1 ? '' : 's'} receive outlook e-mails for their areas of interest.` : 'Emergency managers who receive outlook e-mails.'}
      />
      {subscribers.isPending || office.isPending ? <Loading label="Loading subscribers…" /> : null}
      {subscribers.isError ? (
        <Notice tone="error" title="We could not load the subscribers">
          {subscribers.error.message}
        </Notice>
      ) : null}
      {subscribers.data && subscribers.data.count === 0 ? (
        <EmptyState icon={<Users aria-hidden className="size-5" />} title="No subscribers yet.">
          Emergency managers appear here once they register and open My alerts. An admin can also create subscriber accounts on the Users page.
        </EmptyState>
      ) : null}
      {subscribers.data && subscribers.data.count > 0 && office.data ? (
        <div className="space-y-4">
          <AreaEditorMap
            label="Subscribers' areas of interest"
            className="h-[45dvh] min-h-72"
            region={office.data.region}
            areas={features}
            selectedId={selectedId}
            points={noPoints}
            layers={{ counties: true, soundings: false, areas: true }}
            mode="select"
            onSelect={setSelectedId}
          />
          <div className="relative overflow-x-auto rounded-lg border border-line bg-panel">
            <table className="w-full min-w-[36rem] text-left text-sm">
              <caption className="sr-only">Subscribers</caption>
              <thead className="border-b border-line bg-sunken text-[13px] text-ink-muted">
                <tr>
                  <th className="px-3 py-2 font-medium">Name</th>
                  <th className="px-3 py-2 font-medium">E-mail</th>
                  <th className="px-3 py-2 font-medium">Alert threshold</th>
                  <th className="px-3 py-2 font-medium">Hazards · days</th>
                  <th className="px-3 py-2 font-medium">Areas of interest</th>
                  <th className="px-3 py-2 font-medium">Status</th>
                </tr>
              </thead>
              <tbody className="divide-y divide-line">
                {subscribers.data.subscribers.map((s) => {
                  const level = office.data.riskLadder.find((l) => l.key === s.alertThreshold);
                  return (
                    <tr key={s.id}>
                      <td className="px-3 py-2 font-medium">{s.name}</td>
                      <td className="px-3 py-2">
                        {s.email}
                        {s.emails.some((e) => e !== s.email) ? <span className="block text-[12px] text-ink-muted">Alerts to {s.emails.join(', ')}</span> : null}
                      </td>
                      <td className="px-3 py-2">{level ? <RiskSwatch label={level.label} colour={level.colour} /> : s.alertThreshold}</td>
                      <td className="px-3 py-2 text-[13px]">
                        {hazardsSummary(s.hazards)} · Day {s.days.join(', ')}
                      </td>
                      <td className="px-3 py-2 text-[13px]">
                        {s.areas.length === 0 ? (
                          <span className="text-ink-muted">None</span>
                        ) : (
                          s.areas.map((a, index) => (
                            <span key={a.id}>
                              {index > 0 ? ', ' : null}
                              <button type="button" className="hover:underline" onClick={() => setSelectedId(a.id)}>
                                {a.name}
                              </button>
                            </span>
                          ))
                        )}
                      </td>
                      <td className="px-3 py-2 text-[13px]">{standingWords[standingOf(s)]}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        </div>
      ) : null}
    </>
  );
}
