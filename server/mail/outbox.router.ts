import { Router } from 'express';
import { shopSettingsSchema } from '@shared/schemas/review';
import { actorOf, requireRole } from '../http/access.ts';
import { parseBody, parseIdParam } from '../http/validate.ts';
import type { ShopService } from '../shop/shop.service.ts';
import type { OutboxService } from './outbox.service.ts';

export function outboxRouter(outbox: OutboxService): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/', async (_req, res) => {
    res.json(await outbox.list());
  });
  router.get('/:id/attachments/:index', async (req, res) => {
    const { fileName, contentType, content } = await outbox.attachment(parseIdParam(req), parseIdParam(req, 'index') - 1);
    res.setHeader('Content-Type', contentType);
    // The server picks the download name; characters outside a safe set are replaced.
    res.setHeader('Content-Disposition', `attachment; filename="${fileName.replace(/[^A-Za-z0-9._-]/g, '_')}"`);
    res.send(content);
  });
  return router;
}

export function settingsRouter(shop: ShopService): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/', async (_req, res) => {
    res.json({ shopEmail: await shop.shopEmail() });
  });
  router.put('/', async (req, res) => {
    const { shopEmail } = parseBody(shopSettingsSchema, req);
    await shop.setShopEmail(actorOf(req), shopEmail);
    res.json({ shopEmail });
  });
  return router;
}
