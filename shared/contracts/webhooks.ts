import { z } from 'zod';

/** Events sent to webhook endpoints (Standard Webhooks payload `type`). */
export const webhookEventTypes = ['issuance.published', 'issuance.amended', 'issuance.withdrawn'] as const;
export type WebhookEventType = (typeof webhookEventTypes)[number];

export const webhookUrlMaxLength = 2048;
export const webhookDescriptionMaxLength = 200;
/** How many endpoints one account may register. */
export const webhookEndpointsPerOwner = 10;

export const createWebhookEndpointInputSchema = z.strictObject({
  url: z
    .string({ message: 'Enter the endpoint address.' })
    .trim()
    .min(1, { message: 'Enter the endpoint address.' })
    .max(webhookUrlMaxLength, { message: `Keep the address under ${webhookUrlMaxLength} characters.` })
    .refine((value) => URL.canParse(value), { message: 'Enter a full address, e.g. https://alerts.example.org/stormdraft.' }),
  description: z.string().trim().max(webhookDescriptionMaxLength, { message: `Keep the description under ${webhookDescriptionMaxLength} characters.` }).default(''),
});
export type CreateWebhookEndpointInput = z.infer<typeof createWebhookEndpointInputSchema>;

export const webhookEndpointSchema = z.object({
  id: z.string(),
  url: z.string(),
  description: z.string(),
  active: z.boolean(),
  ownerEmail: z.string(),
  createdAt: z.string(),
});
export type WebhookEndpoint = z.infer<typeof webhookEndpointSchema>;

export const webhookEndpointListSchema = z.object({ endpoints: z.array(webhookEndpointSchema) });

/** The answer to a registration: the only time the signing secret is shown. */
export const createdWebhookEndpointSchema = z.object({ endpoint: webhookEndpointSchema, secret: z.string() });
export type CreatedWebhookEndpoint = z.infer<typeof createdWebhookEndpointSchema>;

export const webhookDeliverySchema = z.object({
  id: z.string(),
  eventType: z.string(),
  issuanceNumber: z.string(),
  messageId: z.string(),
  status: z.enum(['queued', 'delivering', 'delivered', 'failed']),
  attempts: z.number(),
  lastStatusCode: z.number().nullable(),
  lastError: z.string().nullable(),
  nextAttemptAt: z.string(),
  deliveredAt: z.string().nullable(),
  createdAt: z.string(),
});
export type WebhookDelivery = z.infer<typeof webhookDeliverySchema>;
export const webhookDeliveryListSchema = z.object({ deliveries: z.array(webhookDeliverySchema) });
