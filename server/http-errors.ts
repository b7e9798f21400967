import type { ErrorRequestHandler, RequestHandler } from 'express';

/** An error with an HTTP status and a stable code, rendered as `{ error: { code, message, field? } }`. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly field?: string,
    /** Extra members of the error object, e.g. `issues` of a bad sheet or `currentVersion` of a conflict. */
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
  }
}

export const notFoundApi: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, 'not_found', `No API route ${req.method} ${req.path}`));
};

// The one place errors become responses: never a stack trace to the client.
export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  if (err instanceof HttpError) {
    res.status(err.status).json({ error: { ...err.details, code: err.code, message: err.message, ...(err.field ? { field: err.field } : {}) } });
    return;
  }
  const status = typeof err?.status === 'number' && err.status >= 400 && err.status < 500 ? err.status : 500;
  if (status === 500) console.error('server error:', err);
  const code = err?.type === 'entity.parse.failed' ? 'malformed_json' : err?.type === 'entity.too.large' ? 'too_large' : status === 500 ? 'internal' : 'bad_request';
  const message = status === 500 ? 'Something went wrong on the server; the error is logged. Try again.' : String(err?.message ?? 'Bad request');
  res.status(status).json({ error: { code, message } });
};
