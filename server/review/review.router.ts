import { Router } from 'express';
import { approveRevision, releaseRevision, returnRevision, revisionTimeline, submitRevision } from '@shared/api/review';
import { actorOf } from '../http/access.ts';
import { mount } from '../http/endpoint.ts';
import type { ReviewService } from './review.service.ts';

/** Mounted at /api. Review and release of design revisions; the service enforces who may do what in which state. */
export function reviewRouter(review: ReviewService): Router {
  const router = Router();
  mount(router, revisionTimeline, ({ params }) => review.timeline(params.id));
  mount(router, submitRevision, ({ params, body, req }) => review.submit(actorOf(req), params.id, body.comment));
  mount(router, approveRevision, ({ params, body, req }) => review.approve(actorOf(req), params.id, body.comment));
  mount(router, returnRevision, ({ params, body, req }) => review.returnToDraft(actorOf(req), params.id, body.comment));
  mount(router, releaseRevision, ({ params, body, req }) => review.release(actorOf(req), params.id, body.quantity, body.comment));
  return router;
}
