import { z } from 'zod';
import { MAX_VERTICES_PER_AREA_OF_INTEREST } from '../geometry/limits';
import { boundedAreaGeometrySchema, hazardKinds } from './outlooks';
import { versionSchema } from './primitives';

export const subscriptionSettingsInputSchema = z.object({
  version: versionSchema,
  alertThreshold: z.string().min(1, { message: 'Choose the lowest level you want to hear about.' }),
  /** Empty means every hazard. */
  hazards: z.array(z.enum(hazardKinds, { message: 'Hazard must be tornado, hail, wind or flood.' })).max(4),
  days: z.array(z.number().int().min(1).max(3, { message: 'Days are 1, 2 or 3.' })).min(1, { message: 'Choose at least one outlook day.' }).max(3),
  emails: z.array(z.string().trim().toLowerCase().email({ message: 'Enter valid e-mail addresses.' })).min(1, { message: 'Give at least one e-mail address.' }).max(5, { message: 'At most 5 addresses.' }),
  paused: z.boolean(),
});
export type SubscriptionSettingsInput = z.infer<typeof subscriptionSettingsInputSchema>;

export const areaOfInterestInputSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('drawn'), name: z.string().trim().min(1, { message: 'Name the area.' }).max(80), geometry: boundedAreaGeometrySchema(MAX_VERTICES_PER_AREA_OF_INTEREST, 'This area') }),
  z.object({ kind: z.enum(['county', 'state']), fipsCode: z.string().regex(/^\d{2}(\d{3})?$/, { message: 'A FIPS code has 2 (state) or 5 (county) digits.' }) }),
]);
export type AreaOfInterestInput = z.infer<typeof areaOfInterestInputSchema>;

export const placeQuerySchema = z.object({
  q: z.string().trim().min(2, { message: 'Type at least 2 letters.' }).max(60),
  kind: z.enum(['county', 'state']).optional(),
});
