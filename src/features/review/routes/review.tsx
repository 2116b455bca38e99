import type { QueryClient } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { PageHeader } from '../../../components/ui/page-header';
import { Panel } from '../../../components/ui/panel';
import { RiskSwatch } from '../../../components/ui/risk-swatch';
import { useMe } from '../../../hooks/use-me';
import { useOffice } from '../../../hooks/use-office';
import { formatTimestampUtc } from '../../../utils/time';
import { bulletinQuery, useBulletin } from '../../../api/issuances/get-bulletin';
import { outlookEvidenceQuery, useOutlookEvidence } from '../../../api/outlooks/get-outlook-evidence';
import { outlookQuery, useOutlook } from '../../../api/outlooks/get-outlook';
import { useRevision } from '../../../api/outlooks/get-revision';
import { revisionsQuery, useRevisions } from '../../../api/outlooks/get-revisions';
import { authoringRoles, hasRole, reviewingRoles } from '../../../../shared/workflow/roles';
import { outlookStateLabels } from '../../../../shared/workflow/states';
import { availableActions, checkTransition, type TransitionSubject } from '../../../../shared/workflow/transitions';
import { AuditTrail } from '../components/audit-trail';
import { ChangeSummary } from '../components/change-summary';
import { CommentThread } from '../components/comment-thread';
import { ReviewActions } from '../components/review-actions';
import { RiskAreaMap } from '../../../lib/map/risk-area-map';
import { SupportResults } from '../components/support-results';
import { diffOutlookAreas } from '../utils/outlook-diff';
import { chooseBaseline } from '../utils/review-baseline';
import { reviewMapAreas } from '../utils/review-map-areas';

export const reviewLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) => {
    const outlookId = params.outlookId;
    if (outlookId) {
      void queryClient.prefetchQuery(outlookQuery(outlookId));
      void queryClient.prefetchQuery(outlookEvidenceQuery(outlookId));
      void queryClient.prefetchQuery(revisionsQuery(outlookId));
    }
    void queryClient.prefetchQuery(bulletinQuery());
    return Promise.resolve();
  };

/** A lead's review of one outlook: draft beside the current issuance, changes, evidence, thread, actions. */
export function ReviewPage() {
  const outlookId = useParams().outlookId ?? '';
  const me = useMe();
  const office = useOffice();
  const outlook = useOutlook(outlookId);
  const evidence = useOutlookEvidence(outlookId);
  const current = useBulletin();
  const revisions = useRevisions(outlookId);
  const previousRevisionId = revisions.data?.revisions[1]?.id ?? null;
  const previousRevision = useRevision(previousRevisionId);

  if (outlook.isError) {
    return (
      <>
        <PageHeader title="Review outlook" />
        <Notice tone="error" title="The outlook could not be loaded">
          {outlook.error.message} <Link to="/review" className="text-accent hover:underline">Back to the review queue.</Link>
        </Notice>
      </>
    );
  }
  if (!outlook.data || !office.data || !me.data) return <Loading label="Opening the outlook…" />;

  const draft = outlook.data;
  const ladder = office.data.riskLadder;
  const region = office.data.region;
  const baseline = chooseBaseline(draft, current.data?.issuances ?? [], previousRevision.data ?? null);
  const diff = diffOutlookAreas(baseline.areas, draft.areas, ladder.map((l) => l.key));
  const subject: TransitionSubject = { state: draft.state, role: me.data.user.role, userId: me.data.user.id, reviewEditorIds: draft.reviewEditorIds, allowSelfApproval: office.data.allowSelfApproval };
  const actions = availableActions(subject);
  const approval = checkTransition('approve', subject);
  const fourEyesNote = !approval.allowed && approval.reason === 'four-eyes' ? approval.message : null;
  const isLead = hasRole(me.data.user.role, reviewingRoles);
  const canComment = hasRole(me.data.user.role, authoringRoles);
  const levelsShown = ladder.filter((l) => draft.areas.some((a) => a.levelKey === l.key) || baseline.areas.some((a) => a.levelKey === l.key));

  return (
    <>
      <PageHeader
        title={`Review: Day ${draft.day} outlook`}
        description={draft.headline || 'No headline yet.'}
        actions={
          <Link to={`/outlooks/${draft.id}`} className="text-sm text-accent hover:underline">
            Open in the workspace
          </Link>
        }
      />
      <dl className="mb-4 flex flex-wrap gap-x-5 gap-y-1 text-sm" aria-label="Outlook status">
        <div>
          <dt className="inline text-ink-muted">State: </dt>
          <dd className="inline font-semibold" data-testid="outlook-state">
            {outlookStateLabels[draft.state]}
          </dd>
        </div>
        <div>
          <dt className="inline text-ink-muted">Valid: </dt>
          <dd className="inline">
            {formatTimestampUtc(draft.validFrom)} – {formatTimestampUtc(draft.validUntil)}
          </dd>
        </div>
        <div>
          <dt className="inline text-ink-muted">Last edited by: </dt>
          <dd className="inline">{draft.lastEditedByName ?? '—'}</dd>
        </div>
        <div>
          <dt className="inline text-ink-muted">Version: </dt>
          <dd className="inline">{draft.version}</dd>
        </div>
      </dl>
      {!isLead ? (
        <Notice tone="info" className="mb-4" title="Read-only for forecasters">
          Leads return, approve and publish. You can read the review, comment, and submit your draft when it is ready.
        </Notice>
      ) : null}

      <div className="grid grid-cols-[minmax(0,1fr)] gap-4 xl:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="space-y-4">
          <div className="grid grid-cols-[minmax(0,1fr)] gap-3 md:grid-cols-2">
            <figure className="space-y-1">
              <figcaption className="text-[13px] font-semibold">This draft</figcaption>
              <RiskAreaMap label="Map of the draft under review" bounds={region} areas={reviewMapAreas(draft.areas, ladder)} className="h-80 rounded-md border border-line" />
            </figure>
            <figure className="space-y-1">
              <figcaption className="text-[13px] font-semibold">
                {baseline.kind === 'issuance' && baseline.issuanceNumber ? (
                  <>
                    Current:{' '}
                    <Link to={`/issuances/${baseline.issuanceNumber}`} className="text-accent hover:underline">
                      issuance {baseline.issuanceNumber}
                    </Link>
                  </>
                ) : baseline.kind === 'revision' ? (
                  `Previous: ${baseline.name}`
                ) : (
                  'Nothing to compare with (first draft, no current issuance for this day)'
                )}
              </figcaption>
              <RiskAreaMap label={`Map of ${baseline.name}`} bounds={region} areas={reviewMapAreas(baseline.areas, ladder)} className="h-80 rounded-md border border-line" />
            </figure>
          </div>
          <ul aria-label="Map legend" className="flex flex-wrap gap-1.5">
            {levelsShown.map((level) => (
              <li key={level.key}>
                <RiskSwatch label={level.label} colour={level.colour} />
              </li>
            ))}
          </ul>

          <Panel title="Change summary" description={`Compared with ${baseline.name}.`}>
            <ChangeSummary diff={diff} ladder={ladder} baselineName={baseline.name} />
          </Panel>

          <Panel title="Support check" description="Each sounding inside an area against every rule of its level and of each hazard flagged on it, as the server checked them (a published outlook: against the guidance stored with its issuance).">
            {evidence.isError ? <Notice tone="error">{evidence.error.message}</Notice> : null}
            {evidence.data ? <SupportResults reports={evidence.data.areas} areas={draft.areas} ladder={ladder} /> : <Loading label="Checking the evidence…" />}
          </Panel>

          <Panel title="Discussion">
            <p className="text-sm whitespace-pre-wrap">{draft.discussion || 'No discussion written.'}</p>
          </Panel>
        </div>

        <div className="space-y-4">
          <Panel title="Decision">
            <ReviewActions outlook={draft} actions={actions} fourEyesNote={fourEyesNote} />
          </Panel>
          <Panel title="Comments">
            <CommentThread outlookId={draft.id} areas={draft.areas} ladder={ladder} canComment={canComment} />
          </Panel>
          <Panel title="Audit trail">
            <AuditTrail outlookId={draft.id} />
          </Panel>
        </div>
      </div>
    </>
  );
}
