import { z } from 'zod';
import { roleSchema } from './common';

export * from './me';


export const userSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  email: z.string(),
  role: roleSchema,
  disabled: z.boolean(),
  createdAt: z.string(),
});
export type UserSummary = z.infer<typeof userSummarySchema>;


const password = z
  .string()
  .min(10, { message: 'Use at least 10 characters for the password.' })
  .max(128, { message: 'Keep the password under 128 characters.' });

export const createUserInputSchema = z.object({
  name: z.string().trim().min(1, { message: 'A name is required.' }).max(100, { message: 'Keep the name under 100 characters.' }),
  email: z.string().trim().toLowerCase().email({ message: 'Enter a valid e-mail address.' }),
  password,
  role: roleSchema,
});
export type CreateUserInput = z.infer<typeof createUserInputSchema>;

export const updateUserInputSchema = z
  .object({
    role: roleSchema.optional(),
    disabled: z.boolean().optional(),
  })
  .refine((v) => v.role !== undefined || v.disabled !== undefined, { message: 'Change the role or the disabled flag.' });
export type UpdateUserInput = z.infer<typeof updateUserInputSchema>;
