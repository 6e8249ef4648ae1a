import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Role } from '@shared/schemas/auth';
import { forbidden, unauthorized } from './errors.ts';

/** The signed-in user as the server sees it on each request (loaded fresh from the database). */
export interface Actor {
  id: number;
  username: string;
  displayName: string;
  role: Role;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // passport's req.user: declaration merging needs an interface
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends Actor {}
  }
}

// Refusals are passed on as errors; the error middleware writes each one to the audit log.
export const requireSignIn: RequestHandler = (req, _res, next) => {
  if (!req.user) return next(unauthorized());
  next();
};

export function requireRole(...roles: Role[]): RequestHandler {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (!req.user) return next(unauthorized());
    if (!roles.includes(req.user.role)) {
      return next(forbidden(`This needs the role ${roles.join(' or ')}; you are signed in as ${req.user.role}.`));
    }
    next();
  };
}

export function actorOf(req: Request): Actor {
  if (!req.user) throw unauthorized();
  return req.user;
}

const READS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Runs before the CSRF check: a write (outside sign-in and sign-out) from someone not signed in is a 401, so a
 * write after the session ended says "sign in again" rather than failing the CSRF check with a 403.
 */
export const signedInForWrites: RequestHandler = (req, _res, next) => {
  if (READS.has(req.method) || req.user || req.path.startsWith('/auth/')) return next();
  next(unauthorized('Your session has ended. Sign in again.'));
};
