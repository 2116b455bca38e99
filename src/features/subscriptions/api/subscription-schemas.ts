import { z } from 'zod';
import { areaGeometrySchema, hazardKinds } from '../../../../shared/contracts/outlooks';

/** Response shapes of the subscription endpoints, parsed by every fetcher so drift shows up clearly. */
export const areaOfInterestSchema = z.object({
  id: z.string(),
  name: z.string(),
  kind: z.enum(['drawn', 'county', 'state']),
  fipsCode: z.string().nullable(),
  geometry: areaGeometrySchema,
});
export type AreaOfInterest = z.infer<typeof areaOfInterestSchema>;

export const subscriptionSchema = z.object({
  id: z.string(),
  alertThreshold: z.string(),
  hazards: z.array(z.enum(hazardKinds)),
  days: z.array(z.number().int()),
  emails: z.array(z.string()),
  /** Extra addresses whose owner has not followed the confirmation link yet: they receive nothing. */
  unconfirmedEmails: z.array(z.string()).default([]),
  paused: z.boolean(),
  unsubscribed: z.boolean(),
  version: z.number().int(),
  areas: z.array(areaOfInterestSchema),
});
export type Subscription = z.infer<typeof subscriptionSchema>;

export const subscriberSchema = subscriptionSchema.extend({ name: z.string(), email: z.string() });
export type Subscriber = z.infer<typeof subscriberSchema>;

export const placeSchema = z.object({ fipsCode: z.string(), kind: z.enum(['county', 'state']), name: z.string(), stateName: z.string() });
export type Place = z.infer<typeof placeSchema>;
