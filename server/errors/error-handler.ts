import type { ErrorRequestHandler, RequestHandler } from 'express';

import { AppError } from './app-error';

/** Logger the error middleware reports to (console in production, silent in tests). */
export interface ErrorLog {
  error(message: string, err: unknown): void;
}

/**
 * Turns any throwable into an `AppError`. Known framework errors (body-parser's JSON and size
 * errors) keep their meaning; everything else becomes `internal` with a generic message, so no
 * stack, SQL or driver text ever reaches a client.
 */
export function normalizeError(err: unknown): AppError {
  if (err instanceof AppError) return err;
  const e = err as { type?: string; status?: number; statusCode?: number } | null;
  if (e?.type === 'entity.too.large')
    return new AppError('payload_too_large', 'Request body is too large');
  if (e?.type === 'entity.parse.failed')
    return new AppError('bad_request', 'Request body is not valid JSON');
  if (e?.type === 'charset.unsupported' || e?.type === 'encoding.unsupported') {
    return new AppError('bad_request', 'Unsupported request encoding');
  }
  return new AppError('internal', 'Internal server error', undefined, { cause: err });
}

/** The one error middleware, registered last. */
export function errorHandler(log: ErrorLog): ErrorRequestHandler {
  return (err, _req, res, next) => {
    const appError = normalizeError(err);
    if (appError.code === 'internal') log.error('[http] unhandled error', appError.cause ?? err);
    if (res.headersSent) return next(err);
    res.status(appError.status).json(appError.toBody());
  };
}

/** 404 in the API's error shape for unknown `/api` routes. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError('not_found', `No API route ${req.method} ${req.path}`));
};
