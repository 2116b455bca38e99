import type { FeatureCollection } from 'geojson';
import { z } from 'zod';
import { err, ok, type Result } from '../../../../shared/result';
import { areaGeometrySchema, type AreaGeometry, type HazardKind } from '../../../../shared/contracts/outlooks';
import type { RiskLadder } from '../../../../shared/contracts/office';
import type { SubscriptionSettingsInput } from '../../../../shared/contracts/subscriptions';
import type { AreaOfInterest, Subscription } from '../api/subscription-schemas';

/** At most this many addresses receive a subscriber's alerts (the server enforces it too). */
export const MAX_EMAILS = 5;

/** What the alert settings form edits; the version travels separately. */
export interface AlertSettingsForm {
  alertThreshold: string;
  hazards: HazardKind[];
  days: number[];
  emails: string[];
  paused: boolean;
}

/** Where a subscription stands, which decides the banner and the main action on /alerts. */
export type SubscriptionStanding = 'unsubscribed' | 'paused' | 'no-areas' | 'active';

export function standingOf(subscription: Pick<Subscription, 'unsubscribed' | 'paused' | 'areas'>): SubscriptionStanding {
  if (subscription.unsubscribed) return 'unsubscribed';
  if (subscription.paused) return 'paused';
  if (subscription.areas.length === 0) return 'no-areas';
  return 'active';
}

/** The form's starting values; a threshold no longer on the ladder falls back to its first level. */
export function formFromSubscription(subscription: Subscription, ladder: RiskLadder): AlertSettingsForm {
  const known = ladder.some((level) => level.key === subscription.alertThreshold);
  return {
    alertThreshold: known ? subscription.alertThreshold : (ladder[0]?.key ?? subscription.alertThreshold),
    hazards: [...subscription.hazards],
    days: [...subscription.days].sort((a, b) => a - b),
    emails: [...subscription.emails],
    paused: subscription.paused,
  };
}

/** The PUT body for the form, carrying the version the form was loaded from. */
export function payloadFromForm(form: AlertSettingsForm, version: number): SubscriptionSettingsInput {
  return {
    version,
    alertThreshold: form.alertThreshold,
    hazards: [...form.hazards],
    days: [...form.days].sort((a, b) => a - b),
    emails: form.emails.map((e) => e.trim().toLowerCase()),
    paused: form.paused,
  };
}

/** Adds or removes one value, keeping the list sorted for stable payloads. */
export function toggled<T extends string | number>(list: readonly T[], value: T): T[] {
  const next = list.includes(value) ? list.filter((v) => v !== value) : [...list, value];
  return next.sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
}

const emailSchema = z.string().trim().toLowerCase().email();

/** Adds an address to the list, or says in plain words why it cannot be added. */
export function addEmail(list: readonly string[], candidate: string): Result<string[], string> {
  const parsed = emailSchema.safeParse(candidate);
  if (candidate.trim() === '') return err('Type an e-mail address first.');
  if (!parsed.success) return err(`"${candidate.trim()}" is not an e-mail address. Check it and try again.`);
  if (list.includes(parsed.data)) return err(`${parsed.data} is already on the list.`);
  if (list.length >= MAX_EMAILS) return err(`At most ${MAX_EMAILS} addresses. Remove one before adding another.`);
  return ok([...list, parsed.data]);
}

/** Removes an address; the last one stays, since alerts need somewhere to go. */
export function removeEmail(list: readonly string[], address: string): Result<string[], string> {
  if (!list.includes(address)) return ok([...list]);
  if (list.length <= 1) return err('Alerts need at least one address. Add another before removing this one.');
  return ok(list.filter((e) => e !== address));
}

/** True when the form differs from what the server holds. */
export function formChanged(form: AlertSettingsForm, saved: AlertSettingsForm): boolean {
  return JSON.stringify(payloadFromForm(form, 0)) !== JSON.stringify(payloadFromForm(saved, 0));
}

export interface AreaMapProperties {
  id: string;
  fillColour: string;
  textColour: string;
  title: string;
  badges: string[];
}

const AREA_FILL = '#e7c66b';

/** Areas of interest as map features, labelled with their names (one neutral amber fill, not a risk colour). */
export function areasOfInterestCollection(areas: readonly Pick<AreaOfInterest, 'id' | 'name' | 'geometry'>[]): FeatureCollection<AreaOfInterest['geometry'], AreaMapProperties> {
  return {
    type: 'FeatureCollection',
    features: areas.map((area) => ({
      type: 'Feature',
      properties: { id: area.id, fillColour: AREA_FILL, textColour: '#111827', title: area.name, badges: [] },
      geometry: area.geometry,
    })),
  };
}

/** "Boone County, Missouri" or "Missouri". */
export function placeLabel(place: { kind: 'county' | 'state'; name: string; stateName: string }): string {
  return place.kind === 'county' ? `${place.name}, ${place.stateName}` : place.name;
}

export const hazardChoices: readonly { key: HazardKind; label: string }[] = [
  { key: 'tornado', label: 'Tornado' },
  { key: 'hail', label: 'Large hail' },
  { key: 'wind', label: 'Damaging wind' },
  { key: 'flood', label: 'Flash flooding' },
];

/** "All hazards" for an empty list, otherwise the chosen ones in words. */
export function hazardsSummary(hazards: readonly HazardKind[]): string {
  if (hazards.length === 0) return 'All hazards';
  return hazardChoices.filter((c) => hazards.includes(c.key)).map((c) => c.label).join(', ');
}

/** A shape drawn on the map as the contract's geometry, or a message when it is not a closed polygon. */
export function areaGeometryFromShape(shape: unknown): Result<AreaGeometry, string> {
  const parsed = areaGeometrySchema.safeParse(shape);
  return parsed.success ? ok(parsed.data) : err('That shape is not a closed area. Draw it again and finish on the first corner.');
}
