import { Router } from 'express';
import { inbox } from '@shared/api/inbox';
import { actorOf } from '../http/access.ts';
import { mount } from '../http/endpoint.ts';
import type { ReviewService } from './review.service.ts';

/** Mounted at /api. */
export function inboxRouter(review: ReviewService): Router {
  const router = Router();
  mount(router, inbox, ({ req }) => review.inbox(actorOf(req)));
  return router;
}
