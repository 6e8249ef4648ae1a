import * as z from 'zod';

/** One page of the audit log. */
export const auditPageQuerySchema = z
  .object({
    offset: z.coerce.number().int().min(0, { error: 'offset must be 0 or more' }).default(0),
    limit: z.coerce.number().int().min(1).max(200, { error: 'limit must be between 1 and 200' }).default(25),
  })
  .strict();
export type AuditPageQuery = z.infer<typeof auditPageQuerySchema>;
