import { z } from 'zod';
import { roleSchema } from './common';

/** Who is signed in and their display preferences (GET /api/me): every page reads it, so it stays small. */

export const unitsSchema = z.object({
  temperature: z.enum(['C', 'F'], { message: 'Temperature unit must be C or F.' }),
  height: z.enum(['m', 'ft'], { message: 'Height unit must be m or ft.' }),
  speed: z.enum(['kt', 'ms', 'mph'], { message: 'Speed unit must be kt, ms or mph.' }),
});
export type Units = z.infer<typeof unitsSchema>;
export const defaultUnits: Units = { temperature: 'C', height: 'm', speed: 'kt' };

export const preferencesSchema = z.object({ units: unitsSchema });
export type Preferences = z.infer<typeof preferencesSchema>;

export const meSchema = z.object({
  user: z.object({ id: z.string(), name: z.string(), email: z.string(), role: roleSchema }),
  preferences: preferencesSchema,
});
export type Me = z.infer<typeof meSchema>;
