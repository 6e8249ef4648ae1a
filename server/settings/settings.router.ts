import { Router } from 'express';
import { saveSettings, settings } from '@shared/api/settings';
import { actorOf } from '../http/access.ts';
import { mount } from '../http/endpoint.ts';
import type { ShopService } from '../shop/shop.service.ts';

/** The administrator's site settings (the winding shop's address). Mounted at /api. */
export function settingsRouter(shop: ShopService): Router {
  const router = Router();
  mount(router, settings, async () => ({ shopEmail: await shop.shopEmail() }));
  mount(router, saveSettings, async ({ body, req }) => {
    await shop.setShopEmail(actorOf(req), body.shopEmail);
    return { shopEmail: body.shopEmail };
  });
  return router;
}
