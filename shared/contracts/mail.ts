import { z } from 'zod';

export const caughtMailSummarySchema = z.object({
  id: z.string(),
  from: z.string(),
  to: z.string(),
  subject: z.string(),
  receivedAt: z.string(),
});
export type CaughtMailSummary = z.infer<typeof caughtMailSummarySchema>;

export const caughtMailSchema = caughtMailSummarySchema.extend({
  html: z.string().nullable(),
  text: z.string().nullable(),
  headers: z.record(z.string(), z.string()),
});
export type CaughtMail = z.infer<typeof caughtMailSchema>;
