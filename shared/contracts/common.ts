import { z } from 'zod';

export const roles = ['forecaster', 'lead', 'subscriber', 'admin'] as const;
export const roleSchema = z.enum(roles);
export type Role = z.infer<typeof roleSchema>;

export const idParamSchema = z.string().uuid({ message: 'Must be an id (UUID).' });

export const healthSchema = z.object({ status: z.literal('ok'), database: z.literal('ok') });
export type Health = z.infer<typeof healthSchema>;
