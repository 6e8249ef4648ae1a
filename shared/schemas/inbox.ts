import * as z from 'zod';

export const inboxItemSchema = z.object({
  kind: z.enum(['review', 'release', 'returned', 'build']),
  label: z.string(),
  designId: z.number().int(),
  revisionId: z.number().int().optional(),
  orderId: z.number().int().optional(),
  since: z.string(),
});
export type InboxItem = z.infer<typeof inboxItemSchema>;
export const inboxResponseSchema = z.object({ items: z.array(inboxItemSchema) });
