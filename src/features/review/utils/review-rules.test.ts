import { describe, expect, it } from 'vitest';
import { actionProblem, actionsFor, approvalNeedsAnotherLead } from './review-rules';

describe('review actions', () => {
  it('when a draft is returned, its author may submit it again and a lead sees no approve', () => {
    expect(actionsFor('returned', 'forecaster')).toEqual(['submit']);
    expect(actionsFor('returned', 'lead')).toEqual(['submit']);
  });

  it('when in review, a lead may approve or return and a forecaster may do nothing', () => {
    expect(actionsFor('in_review', 'lead')).toEqual(['approve', 'return']);
    expect(actionsFor('in_review', 'forecaster')).toEqual([]);
  });

  it('when approved, a lead may return or publish', () => {
    expect(actionsFor('approved', 'lead')).toEqual(['return', 'publish']);
  });

  it('when published, nobody may act on the outlook', () => {
    expect(actionsFor('published', 'lead')).toEqual([]);
  });

  it('when the lead edited the draft last, approval needs another lead', () => {
    expect(approvalNeedsAnotherLead('u1', 'u1')).toBe(true);
    expect(approvalNeedsAnotherLead('u2', 'u1')).toBe(false);
  });

  it('explains a 403 on approve as the four-eyes rule and a 409 as a stale view', () => {
    expect(actionProblem('approve', 403, 'x').title).toBe('Another lead must approve this outlook');
    expect(actionProblem('publish', 409, 'Changed.').reload).toBe(true);
  });
});
