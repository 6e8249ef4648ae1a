import { Router } from 'express';
import { coreLoss, evaluate, operatingPoint, search } from '@shared/api/calc';
import { mount } from '../http/endpoint.ts';
import type { CalcService } from './calc.service.ts';

/** Stateless calculations; every signed-in role may use them. Mounted at /api. */
export function calcRouter(calc: CalcService): Router {
  const router = Router();
  mount(router, operatingPoint, ({ body }) => calc.operatingPoint(body));
  mount(router, coreLoss, ({ body }) => calc.coreLoss(body));
  // Searches run in a worker thread, which also encodes the answer: the main thread only passes the bytes on
  // (res.end, not res.send: no ETag hashed over ~200 KB for a POST nobody revalidates).
  mount(router, search, async ({ body, res }) => {
    const json = await calc.searchAnswer(body);
    res.type('json').setHeader('Content-Length', json.byteLength);
    res.end(json);
  });
  mount(router, evaluate, ({ body, query }) => calc.evaluate(body, { withFrequencySweep: query.sweep === 'frequency' }));
  return router;
}
