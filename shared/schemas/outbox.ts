import * as z from 'zod';

/** A mail the local fake SMTP server caught, as the admin outbox lists it. */
export const capturedMessageSchema = z.object({
  id: z.number().int(),
  receivedAt: z.string(),
  from: z.string().nullable(),
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  /** `index` counts from 1, as the attachment route takes it. */
  attachments: z.array(z.object({ index: z.number().int(), fileName: z.string(), contentType: z.string(), size: z.number() })),
});
export type CapturedMessage = z.infer<typeof capturedMessageSchema>;

/** One attempt of the app to deliver a release mail. */
export const mailDeliverySchema = z.object({
  id: z.number().int(),
  orderId: z.number().int().nullable(),
  recipient: z.string(),
  subject: z.string(),
  status: z.enum(['pending', 'sent', 'failed']),
  attempts: z.number().int(),
  lastError: z.string().nullable(),
  createdAt: z.string(),
  sentAt: z.string().nullable(),
});
export type MailDelivery = z.infer<typeof mailDeliverySchema>;

export const outboxResponseSchema = z.object({ messages: z.array(capturedMessageSchema), deliveries: z.array(mailDeliverySchema) });
export type OutboxResponse = z.infer<typeof outboxResponseSchema>;
