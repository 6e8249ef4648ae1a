import type { Request, RequestHandler, Response, Router } from 'express';
import type { AnswerInputOf, Endpoint, ParsedInput } from '@shared/api/endpoint';
import { PERMISSIONS } from '@shared/api/permissions';
import { requireRole, requireSignIn } from './access.ts';
import { parseWith } from './validate.ts';

export interface HandlerContext<E extends Endpoint> extends ParsedInput<E> {
  req: Request;
  res: Response;
}

/**
 * What a handler gives back: the answer (sent as JSON with the declared status), or nothing when it wrote
 * the response itself (files). A handler may set another status first (`res.status(503)`).
 */
export type EndpointHandler<E extends Endpoint> = (
  context: HandlerContext<E>,
) => Promise<AnswerInputOf<E> | void> | AnswerInputOf<E> | void;

/** The role check an endpoint's permission asks for; refusals go to the error middleware, which audits them. */
export function accessCheck(endpoint: Endpoint): RequestHandler[] {
  const access = PERMISSIONS[endpoint.access];
  if (access === 'anyone') return [];
  if (access === 'signedIn') return [requireSignIn];
  return [requireRole(...access)];
}

/**
 * Registers a declared endpoint on a router mounted at /api: its role check, then each declared request
 * part parsed with its schema (a 400 naming each field), then the handler, whose answer is sent as JSON.
 * `before` runs after the role check and before parsing (a multipart upload, say).
 */
export function mount<E extends Endpoint>(router: Router, endpoint: E, handler: EndpointHandler<E>, before: RequestHandler[] = []): void {
  const method = endpoint.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
  router[method](endpoint.path, ...accessCheck(endpoint), ...before, async (req: Request, res: Response) => {
    const input = {
      params: endpoint.params ? parseWith(endpoint.params, req.params) : undefined,
      query: endpoint.query ? parseWith(endpoint.query, req.query) : undefined,
      // Express 5 leaves req.body undefined when no body was sent.
      body: endpoint.body ? parseWith(endpoint.body, req.body ?? {}) : undefined,
    } as ParsedInput<E>;
    const answer = await handler({ ...input, req, res });
    if (res.headersSent) return;
    if (res.statusCode === 200 && endpoint.status) res.status(endpoint.status);
    if (res.statusCode === 204) res.end();
    else res.json(answer);
  });
}
