import { describe, expect, it } from 'vitest';
import { defaultRiskLadder } from '../../../../shared/contracts/office';
import { subscriptionSettingsInputSchema } from '../../../../shared/contracts/subscriptions';
import type { Subscription } from '../api/subscription-schemas';
import { addEmail, formChanged, formFromSubscription, hazardsSummary, payloadFromForm, placeLabel, removeEmail, standingOf, toggled } from './alert-settings';

const subscription: Subscription = {
  id: 's1',
  alertThreshold: 'level2',
  hazards: ['wind', 'hail'],
  days: [2, 1],
  emails: ['em@county.test'],
  unconfirmedEmails: [],
  paused: false,
  unsubscribed: false,
  version: 3,
  areas: [],
};

describe('alert settings form ↔ payload', () => {
  it('when a subscription is loaded and saved unchanged, then the payload passes the shared schema with the same version', () => {
    const form = formFromSubscription(subscription, defaultRiskLadder);
    const payload = payloadFromForm(form, subscription.version);
    expect(subscriptionSettingsInputSchema.safeParse(payload).success).toBe(true);
    expect(payload).toEqual({ version: 3, alertThreshold: 'level2', hazards: ['wind', 'hail'], days: [1, 2], emails: ['em@county.test'], paused: false });
  });

  it('when the threshold is no longer on the ladder, then the form starts at the lowest level', () => {
    expect(formFromSubscription({ ...subscription, alertThreshold: 'gone' }, defaultRiskLadder).alertThreshold).toBe('thunder');
  });

  it('when a value is toggled, then it is added or removed and the list stays sorted', () => {
    expect(toggled([3, 1], 2)).toEqual([1, 2, 3]);
    expect(toggled(['wind', 'hail'], 'wind')).toEqual(['hail']);
  });

  it('when only the order of days differs, then the form is not changed', () => {
    const saved = formFromSubscription(subscription, defaultRiskLadder);
    expect(formChanged({ ...saved, days: [2, 1] }, saved)).toBe(false);
    expect(formChanged({ ...saved, paused: true }, saved)).toBe(true);
  });
});

describe('e-mail list', () => {
  it('when a valid new address is added, then it is trimmed and lower-cased', () => {
    expect(addEmail(['a@x.test'], '  B@X.test ')).toEqual({ ok: true, value: ['a@x.test', 'b@x.test'] });
  });

  it('when the address is invalid, a duplicate, or the list is full, then it says why', () => {
    expect(addEmail([], 'not-an-address')).toMatchObject({ ok: false });
    expect(addEmail([], '')).toEqual({ ok: false, error: 'Type an e-mail address first.' });
    expect(addEmail(['a@x.test'], 'A@x.test')).toEqual({ ok: false, error: 'a@x.test is already on the list.' });
    const full = ['1@x.test', '2@x.test', '3@x.test', '4@x.test', '5@x.test'];
    expect(addEmail(full, '6@x.test')).toMatchObject({ ok: false, error: expect.stringContaining('At most 5') });
  });

  it('when the last address is removed, then it is refused', () => {
    expect(removeEmail(['a@x.test'], 'a@x.test')).toMatchObject({ ok: false });
    expect(removeEmail(['a@x.test', 'b@x.test'], 'a@x.test')).toEqual({ ok: true, value: ['b@x.test'] });
  });
});

describe('standing and labels', () => {
  it('when unsubscribed, that wins over paused and missing areas', () => {
    expect(standingOf({ unsubscribed: true, paused: true, areas: [] })).toBe('unsubscribed');
    expect(standingOf({ unsubscribed: false, paused: true, areas: [] })).toBe('paused');
    expect(standingOf({ unsubscribed: false, paused: false, areas: [] })).toBe('no-areas');
  });

  it('names places and hazards in words', () => {
    expect(placeLabel({ kind: 'county', name: 'Boone County', stateName: 'Missouri' })).toBe('Boone County, Missouri');
    expect(placeLabel({ kind: 'state', name: 'Missouri', stateName: 'Missouri' })).toBe('Missouri');
    expect(hazardsSummary([])).toBe('All hazards');
    expect(hazardsSummary(['wind', 'tornado'])).toBe('Tornado, Damaging wind');
  });
});
