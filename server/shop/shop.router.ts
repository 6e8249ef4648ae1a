import { Router } from 'express';
import * as z from 'zod';
import { unitMeasurementSchema } from '@shared/schemas/review';
import { actorOf, requireRole, requireSignIn } from '../http/access.ts';
import { parseBody, parseIdParam, parseQuery } from '../http/validate.ts';
import type { ShopService } from './shop.service.ts';

const ordersQuery = z.object({ status: z.enum(['open', 'complete', 'all']).default('open') }).strict();

/** Build orders: everyone signed in may read them and their sheets; only winders record units. */
export function shopRouter(shop: ShopService): Router {
  const router = Router();
  router.use(requireSignIn);

  router.get('/orders', async (req, res) => {
    const { status } = parseQuery(ordersQuery, req);
    res.json({ orders: await shop.listOrders(status === 'all' ? undefined : status) });
  });

  router.get('/orders/:id', async (req, res) => {
    res.json(await shop.order(parseIdParam(req)));
  });

  router.get('/orders/:id/sheet.pdf', async (req, res) => {
    const { fileName, pdf } = await shop.sheetPdf(parseIdParam(req));
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
    res.send(pdf);
  });

  router.post('/orders/:id/units', requireRole('winder'), async (req, res) => {
    const measurement = parseBody(unitMeasurementSchema, req);
    res.status(201).json(await shop.recordUnit(actorOf(req), parseIdParam(req), measurement));
  });

  router.get('/prediction-report', requireRole('engineer', 'reviewer', 'admin'), async (_req, res) => {
    res.json(await shop.predictionReport());
  });

  return router;
}
