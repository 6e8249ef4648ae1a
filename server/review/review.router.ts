import { Router } from 'express';
import { releaseRequestSchema, returnRequestSchema, transitionRequestSchema } from '@shared/schemas/review';
import { actorOf, requireRole, requireSignIn } from '../http/access.ts';
import { parseBody, parseIdParam } from '../http/validate.ts';
import type { ReviewService } from './review.service.ts';

/** Review and release of design revisions; the service enforces who may do what in which state. */
export function reviewRouter(review: ReviewService): Router {
  const router = Router();
  router.use(requireSignIn);

  router.get('/:id/timeline', async (req, res) => {
    res.json(await review.timeline(parseIdParam(req)));
  });

  router.post('/:id/submit', requireRole('engineer', 'reviewer'), async (req, res) => {
    const { comment } = parseBody(transitionRequestSchema, req);
    res.json(await review.submit(actorOf(req), parseIdParam(req), comment));
  });

  router.post('/:id/approve', requireRole('reviewer'), async (req, res) => {
    const { comment } = parseBody(transitionRequestSchema, req);
    res.json(await review.approve(actorOf(req), parseIdParam(req), comment));
  });

  router.post('/:id/return', requireRole('reviewer'), async (req, res) => {
    const { comment } = parseBody(returnRequestSchema, req);
    res.json(await review.returnToDraft(actorOf(req), parseIdParam(req), comment));
  });

  router.post('/:id/release', requireRole('reviewer'), async (req, res) => {
    const { quantity, comment } = parseBody(releaseRequestSchema, req);
    res.json(await review.release(actorOf(req), parseIdParam(req), quantity, comment));
  });

  return router;
}
