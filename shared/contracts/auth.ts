import { z } from 'zod';

/**
 * Payloads of the sign-in, self-registration and password-reset forms. better-auth serves the
 * endpoints under /api/auth; these schemas give the client forms (and any server hook that wants
 * them) the same rules and user-facing messages.
 */

const email = z.string().trim().toLowerCase().email({ message: 'Enter a valid e-mail address.' });

export const newPasswordSchema = z
  .string()
  .min(10, { message: 'Use at least 10 characters for the password.' })
  .max(128, { message: 'Keep the password under 128 characters.' });

export const signInInputSchema = z.object({
  email,
  password: z.string().min(1, { message: 'Enter your password.' }),
});
export type SignInInput = z.infer<typeof signInInputSchema>;

/** Self-registration always creates a subscriber account; staff accounts are made by an admin. */
export const registerInputSchema = z.object({
  name: z.string().trim().min(1, { message: 'A name is required.' }).max(100, { message: 'Keep the name under 100 characters.' }),
  email,
  password: newPasswordSchema,
});
export type RegisterInput = z.infer<typeof registerInputSchema>;

export const forgotPasswordInputSchema = z.object({ email });
export type ForgotPasswordInput = z.infer<typeof forgotPasswordInputSchema>;

export const resetPasswordInputSchema = z
  .object({
    newPassword: newPasswordSchema,
    confirmPassword: z.string(),
  })
  .refine((v) => v.newPassword === v.confirmPassword, {
    message: 'The two passwords do not match.',
    path: ['confirmPassword'],
  });
export type ResetPasswordInput = z.infer<typeof resetPasswordInputSchema>;
