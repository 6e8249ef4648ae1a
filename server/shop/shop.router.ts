import { Router } from 'express';
import { getOrder, listOrders, orderSheetPdf, predictionReport, recordUnit, voidUnit } from '@shared/api/shop';
import { actorOf } from '../http/access.ts';
import { mount } from '../http/endpoint.ts';
import type { ShopService } from './shop.service.ts';

/** Mounted at /api. Build orders: read by everyone in the shop permission; units recorded by winders, voided by their recorder or a reviewer. */
export function shopRouter(shop: ShopService): Router {
  const router = Router();
  mount(router, listOrders, ({ query }) => shop.listOrders(query.status === 'all' ? undefined : query.status, query.designId));
  mount(router, getOrder, ({ params, req }) => shop.order(actorOf(req), params.id));
  mount(router, orderSheetPdf, async ({ params, res }) => {
    const { fileName, pdf } = await shop.sheetPdf(params.id);
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
    res.send(pdf);
  });
  mount(router, recordUnit, ({ params, body, req }) => shop.recordUnit(actorOf(req), params.id, body));
  mount(router, voidUnit, ({ params, body, req }) => shop.voidUnit(actorOf(req), params.id, body));
  mount(router, predictionReport, () => shop.predictionReport());
  return router;
}
