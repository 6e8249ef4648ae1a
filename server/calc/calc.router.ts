import { Router } from 'express';
import { coreLoss, evaluate, operatingPoint, search } from '@shared/api/calc';
import { mount } from '../http/endpoint.ts';
import type { CalcService } from './calc.service.ts';

/** Stateless calculations; every signed-in role may use them. Mounted at /api. */
export function calcRouter(calc: CalcService): Router {
  const router = Router();
  mount(router, operatingPoint, ({ body }) => calc.operatingPoint(body));
  mount(router, coreLoss, ({ body }) => calc.coreLoss(body));
  // Searches run in a worker thread, which also encodes (and compresses) the answer: the main thread only passes the
  // bytes on (res.end, not res.send: no ETag hashed over them for a POST nobody revalidates).
  mount(router, search, async ({ body, req, res }) => {
    const started = performance.now();
    const gzip = req.acceptsEncodings('gzip') === 'gzip';
    const bytes = await calc.searchAnswer(body, { gzip });
    // The search's own time on the server (queue, worker, engine, encoding), for browser tools and the bench.
    res.setHeader('Server-Timing', `search;desc="queue, engine and encoding";dur=${(performance.now() - started).toFixed(1)}`);
    res.type('json').vary('Accept-Encoding').setHeader('Content-Length', bytes.byteLength);
    if (gzip) res.setHeader('Content-Encoding', 'gzip');
    res.end(bytes);
  });
  mount(router, evaluate, ({ body, query }) => calc.evaluate(body, { sweep: query.sweep }));
  return router;
}
