import type { RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';

import type { Config } from '../../config';
import { AppError } from '../../errors/app-error';

/**
 * A per-address limiter for one sensitive route (own counter each: sign-in, register, reset),
 * kept in this application's memory. Answers 429 `rate_limited` with IETF draft-8
 * `RateLimit`/`RateLimit-Policy` headers and `Retry-After`.
 */
export function authRateLimit(config: Config, what: string): RequestHandler {
  return rateLimit({
    windowMs: config.AUTH_RATE_WINDOW_MS,
    limit: config.AUTH_RATE_LIMIT,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    identifier: what,
    handler: (_req, _res, next, options) => {
      const seconds = Math.ceil(options.windowMs / 1000);
      next(
        new AppError(
          'rate_limited',
          `Too many ${what} requests from this address; try again within ${seconds} s`,
        ),
      );
    },
  });
}
