/** Machine-readable error codes the API may return; anything else becomes `internal`. */
export type ErrorCode =
  | 'bad_request'
  | 'validation_failed'
  | 'unauthenticated'
  | 'forbidden'
  | 'not_found'
  | 'conflict'
  | 'unprocessable'
  | 'payload_too_large'
  | 'rate_limited'
  | 'csrf_invalid'
  | 'service_unavailable'
  | 'internal';

const STATUS: Record<ErrorCode, number> = {
  bad_request: 400,
  validation_failed: 400,
  unauthenticated: 401,
  forbidden: 403,
  csrf_invalid: 403,
  not_found: 404,
  conflict: 409,
  payload_too_large: 413,
  unprocessable: 422,
  rate_limited: 429,
  internal: 500,
  service_unavailable: 503,
};

/** One field-level problem in a request body. */
export interface FieldProblem {
  path: string;
  message: string;
}

/** The one error shape of the whole API: `{ error: { code, message, fields? } }`. */
export interface ErrorBody {
  error: { code: ErrorCode; message: string; fields?: FieldProblem[] };
}

/** An error the API knows how to report. Its message is safe to show to the user. */
export class AppError extends Error {
  override readonly name = 'AppError';
  readonly status: number;

  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly fields?: FieldProblem[],
    options?: { cause?: unknown },
  ) {
    super(message, options);
    this.status = STATUS[code];
  }

  toBody(): ErrorBody {
    return {
      error: {
        code: this.code,
        message: this.message,
        ...(this.fields ? { fields: this.fields } : {}),
      },
    };
  }
}
