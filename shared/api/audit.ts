import { auditPageResponseSchema } from '@shared/schemas/auth';
import { auditPageQuerySchema } from '@shared/schemas/audit';
import { defineEndpoint } from './endpoint';

export const auditPage = defineEndpoint({
  method: 'GET',
  path: '/admin/audit',
  access: 'admin',
  query: auditPageQuerySchema,
  answer: auditPageResponseSchema,
  summary: 'Audit log, newest first, paged',
});
