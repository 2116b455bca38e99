import { describe, expect, it } from 'vitest';
import { outlookStates } from '../contracts/outlooks';
import { availableActions, checkTransition, isEditableState, type TransitionSubject } from './transitions';

const subject = (over: Partial<TransitionSubject>): TransitionSubject => ({ state: 'draft', role: 'forecaster', userId: 'u1', reviewEditorIds: [], allowSelfApproval: false, ...over });

describe('workflow actions offered (the client buttons and the server check are this one function)', () => {
  it('when a draft is returned, its author may submit it again and a lead sees no approve', () => {
    expect(availableActions(subject({ state: 'returned', role: 'forecaster' }))).toEqual(['submit']);
    expect(availableActions(subject({ state: 'returned', role: 'lead' }))).toEqual(['submit']);
  });

  it('when in review, a lead who did not edit it may approve or return and a forecaster may do nothing', () => {
    expect(availableActions(subject({ state: 'in_review', role: 'lead', reviewEditorIds: ['u2'] }))).toEqual(['approve', 'return']);
    expect(availableActions(subject({ state: 'in_review', role: 'forecaster' }))).toEqual([]);
  });

  it('when approved, a lead may return or publish; when published, nobody may act', () => {
    expect(availableActions(subject({ state: 'approved', role: 'lead' }))).toEqual(['return', 'publish']);
    expect(availableActions(subject({ state: 'published', role: 'lead' }))).toEqual([]);
  });

  it('when an admin or subscriber asks, the role is refused whatever the state', () => {
    expect(checkTransition('approve', subject({ state: 'in_review', role: 'admin' }))).toMatchObject({ allowed: false, reason: 'role' });
    expect(checkTransition('submit', subject({ role: 'subscriber' }))).toMatchObject({ allowed: false, reason: 'role' });
  });
});

describe('four-eyes rule (#11 item 4)', () => {
  it('when the lead edited any revision of the version under review, approval is refused, even if someone else saved last', () => {
    const verdict = checkTransition('approve', subject({ state: 'in_review', role: 'lead', userId: 'lead-a', reviewEditorIds: ['lead-a', 'forecaster-b'] }));
    expect(verdict).toMatchObject({ allowed: false, reason: 'four-eyes' });
  });

  it('when the office allows self-approval, the editor may approve and the verdict says the rule was relaxed', () => {
    expect(checkTransition('approve', subject({ state: 'in_review', role: 'lead', userId: 'lead-a', reviewEditorIds: ['lead-a'], allowSelfApproval: true }))).toEqual({ allowed: true, fourEyesRelaxed: true });
  });

  it('when the lead did not edit the version under review, approval is clear', () => {
    expect(checkTransition('approve', subject({ state: 'in_review', role: 'lead', userId: 'lead-a', reviewEditorIds: ['forecaster-b'] }))).toEqual({ allowed: true, fourEyesRelaxed: false });
  });
});

describe('editable states', () => {
  it('drafts and returned drafts are edited; approved, in review and published are not', () => {
    expect(outlookStates.filter((s) => isEditableState(s))).toEqual(['draft', 'returned']);
  });
});
