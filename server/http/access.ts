import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Role } from '@shared/schemas/auth';
import { AppError, forbidden, unauthorized } from './errors.ts';

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
    // passport's req.user
    interface User extends Actor {}
  }
}

export type DenialRecorder = (req: Request, err: AppError) => void;

/** The app puts a recorder in app.locals.recordDenial so every refusal reaches the audit log. */
function deny(req: Request, next: NextFunction, err: AppError): void {
  (req.app.locals['recordDenial'] as DenialRecorder | undefined)?.(req, err);
  next(err);
}

export const requireSignIn: RequestHandler = (req, _res, next) => {
  if (!req.user) return deny(req, next, unauthorized());
  next();
};

export function requireRole(...roles: Role[]): RequestHandler {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (!req.user) return deny(req, next, unauthorized());
    if (!roles.includes(req.user.role)) {
      return deny(req, next, forbidden(`This needs the role ${roles.join(' or ')}; you are signed in as ${req.user.role}.`));
    }
    next();
  };
}

export function actorOf(req: Request): Actor {
  if (!req.user) throw unauthorized();
  return req.user;
}
