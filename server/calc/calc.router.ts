import { Router } from 'express';
import { coreLossRequestSchema, evaluateRequestSchema, operatingPointRequestSchema, searchRequestSchema } from '@shared/schemas/calc';
import { requireSignIn } from '../http/access.ts';
import { parseBody } from '../http/validate.ts';
import type { CalcService } from './calc.service.ts';

/** Stateless calculations; every signed-in role may use them. */
export function calcRouter(calc: CalcService): Router {
  const router = Router();
  router.use(requireSignIn);

  router.post('/operating-point', (req, res) => {
    res.json(calc.operatingPoint(parseBody(operatingPointRequestSchema, req)));
  });

  router.post('/core-loss', (req, res) => {
    res.json(calc.coreLoss(parseBody(coreLossRequestSchema, req)));
  });

  router.post('/search', async (req, res) => {
    res.json(await calc.search(parseBody(searchRequestSchema, req)));
  });

  router.post('/evaluate', async (req, res) => {
    const withFrequencySweep = req.query['sweep'] === 'frequency';
    res.json(await calc.evaluate(parseBody(evaluateRequestSchema, req), { withFrequencySweep }));
  });

  return router;
}
