import { Router } from 'express';
import { coreLoss, evaluate, operatingPoint, search } from '@shared/api/calc';
import { mount } from '../http/endpoint.ts';
import type { CalcService } from './calc.service.ts';

/** Stateless calculations; every signed-in role may use them. Mounted at /api. */
export function calcRouter(calc: CalcService): Router {
  const router = Router();
  mount(router, operatingPoint, ({ body }) => calc.operatingPoint(body));
  mount(router, coreLoss, ({ body }) => calc.coreLoss(body));
  mount(router, search, ({ body }) => calc.search(body));
  mount(router, evaluate, ({ body, query }) => calc.evaluate(body, { withFrequencySweep: query.sweep === 'frequency' }));
  return router;
}
