import { Router } from 'express';
import { outbox as outboxList, outboxAttachment } from '@shared/api/outbox';
import { mount } from '../http/endpoint.ts';
import type { OutboxService } from './outbox.service.ts';

/** Mounted at /api. */
export function outboxRouter(outbox: OutboxService): Router {
  const router = Router();
  mount(router, outboxList, () => outbox.list());
  mount(router, outboxAttachment, async ({ params, res }) => {
    const { fileName, contentType, content } = await outbox.attachment(params.id, params.index - 1);
    res.setHeader('Content-Type', contentType);
    // The server picks the download name; characters outside a safe set are replaced.
    res.setHeader('Content-Disposition', `attachment; filename="${fileName.replace(/[^A-Za-z0-9._-]/g, '_')}"`);
    res.send(content);
  });
  return router;
}
