import type { FeatureCollection, Point } from 'geojson';
import { useMemo, useState } from 'react';
import { useParams } from 'react-router';
import { ButtonLink } from '../../../components/ui/button';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { RiskSwatch } from '../../../components/ui/risk-swatch';
import { useOffice } from '../../../hooks/use-office';
import { AreaEditorMap } from '../../../lib/map/area-editor-map';
import type { PointProperties } from '../../../lib/map/point-map';
import { hazardKinds, hazardLabels } from '../../../../shared/contracts/outlooks';
import { formatTimestampUtc } from '../../../utils/time';
import { useRevision } from '../../../api/outlooks/get-revision';
import { DiscussionPreview } from '../components/discussion-editor';
import { ladderLevel } from '../../../../shared/workflow/levels';
import { areaFeatures } from '../utils/area-display';
import { formatPeriod } from '../utils/valid-period';

const noPoints: FeatureCollection<Point, PointProperties> = { type: 'FeatureCollection', features: [] };

/** `/outlooks/:outlookId/revisions/:revisionId`: one saved revision, read-only. */
export function OutlookRevisionPage() {
  const { outlookId = '', revisionId = '' } = useParams();
  const revision = useRevision(revisionId);
  const office = useOffice();
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const areas = useMemo(
    () => (revision.data?.snapshot.areas ?? []).map((area, index) => ({ id: area.id ?? `area-${index}`, levelKey: area.levelKey, hazards: area.hazards, geometry: area.geometry, label: area.label })),
    [revision.data],
  );
  const features = useMemo(() => areaFeatures(areas, office.data?.riskLadder ?? []), [areas, office.data]);

  if (revision.isError || office.isError) {
    return (
      <Notice tone="error" title="We could not open this revision">
        {(revision.error ?? office.error)?.message}
      </Notice>
    );
  }
  if (!revision.data || !office.data) return <Loading label="Opening the revision…" />;
  const { snapshot } = revision.data;
  const ladder = office.data.riskLadder;

  return (
    <>
      <PageHeader
        title={`Revision ${revision.data.revisionNumber} (read only)`}
        description={`Saved by ${revision.data.authorName ?? 'an unknown author'}, ${formatTimestampUtc(revision.data.createdAt)}. Valid ${formatPeriod(snapshot.validFrom, snapshot.validUntil, 'UTC')}.`}
        actions={
          <ButtonLink to={`/outlooks/${outlookId}`} variant="secondary">
            Back to the workspace
          </ButtonLink>
        }
      />
      <div className="grid grid-cols-[minmax(0,1fr)] items-start gap-4 xl:grid-cols-[minmax(0,1fr)_24rem]">
        <AreaEditorMap
          label="Revision map"
          className="h-[60dvh] min-h-96"
          region={office.data.region}
          areas={features}
          selectedId={selectedId}
          points={noPoints}
          layers={{ counties: true, soundings: false, areas: true }}
          mode="select"
          onSelect={setSelectedId}
        />
        <div className="space-y-4 rounded-lg border border-line bg-panel p-4">
          <div>
            <h2 className="text-[13px] font-semibold text-ink-muted">Headline</h2>
            <p className="text-sm font-semibold">{snapshot.headline || 'No headline'}</p>
          </div>
          <div>
            <h2 className="mb-1 text-[13px] font-semibold text-ink-muted">Risk areas</h2>
            <ul className="space-y-1">
              {areas.map((area) => {
                const level = ladderLevel(ladder, area.levelKey);
                return (
                  <li key={area.id} className="text-[13px]">
                    <RiskSwatch label={level.label} colour={level.colour} /> {area.label}
                    {area.hazards.length ? <span className="block text-[12px] text-ink-muted">{area.hazards.map((h) => `${hazardLabels[h.hazard]}${h.significant ? ' (significant)' : ''}`).join(', ')}</span> : null}
                  </li>
                );
              })}
            </ul>
          </div>
          <div>
            <h2 className="mb-1 text-[13px] font-semibold text-ink-muted">Discussion</h2>
            <DiscussionPreview markdown={snapshot.discussion} />
          </div>
          {hazardKinds.some((k) => snapshot.hazardNotes[k]) ? (
            <dl className="text-[13px]">
              {hazardKinds.map((k) =>
                snapshot.hazardNotes[k] ? (
                  <div key={k} className="mb-1">
                    <dt className="font-semibold">{hazardLabels[k]}</dt>
                    <dd className="text-ink-muted">{snapshot.hazardNotes[k]}</dd>
                  </div>
                ) : null,
              )}
            </dl>
          ) : null}
        </div>
      </div>
    </>
  );
}
