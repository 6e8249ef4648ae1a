import type { Request } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { Config } from '../config.ts';
import { AppError } from '../http/errors.ts';
import { nameKey } from '../http/name-key.ts';

/** How many times the per-address-and-account limit an account may fail from all addresses together. */
export const ACCOUNT_LIMIT_FACTOR = 5;

const accountOf = (req: Request) => nameKey(typeof req.body?.username === 'string' ? req.body.username : '');

/**
 * Failed sign-ins are counted twice (successes never count):
 * - per address and account: `signInLimit` failures for one account from one address block that pair for the
 *   window — other accounts behind the same shared address keep signing in;
 * - per account: `ACCOUNT_LIMIT_FACTOR × signInLimit` failures from all addresses together block that account for
 *   the window, so guessing from many addresses is throttled too.
 */
export function createSignInLimiters(config: Config) {
  const minutes = Math.ceil(config.signInWindowMs / 60_000);
  const limiter = (limit: number, key: (req: Request) => string, who: string) =>
    rateLimit({
      windowMs: config.signInWindowMs,
      limit,
      skipSuccessfulRequests: true,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      keyGenerator: key,
      handler: (_req, _res, next) => {
        next(new AppError(429, 'rate_limited', `Too many failed sign-ins ${who}. Wait ${minutes} minutes and try again.`));
      },
    });
  return [
    limiter(config.signInLimit, (req) => `${ipKeyGenerator(req.ip ?? '')}|${accountOf(req)}`, 'for this account from this address'),
    limiter(config.signInLimit * ACCOUNT_LIMIT_FACTOR, (req) => accountOf(req), 'for this account'),
  ];
}
