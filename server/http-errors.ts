import type { ErrorRequestHandler, RequestHandler } from 'express';
import { isDatabaseUnavailable } from './db/unavailable';

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

/** The parts of a body-parser / raw-body error this handler reads. */
interface BodyReadError {
  status?: number;
  type?: string;
  message?: string;
  limit?: number;
  length?: number;
  charset?: string;
  encoding?: string;
}

// What went wrong reading a request body, in words a caller can act on.
function describeBodyError(err: BodyReadError, status: number): { code: string; message: string } {
  switch (err.type) {
    case 'entity.parse.failed':
      return { code: 'malformed_json', message: `The request body is not valid JSON (${err.message}). Send one JSON object with Content-Type: application/json.` };
    case 'entity.too.large':
      return { code: 'too_large', message: `The request body is ${err.length ?? 'more than'} bytes; the API reads at most ${err.limit ?? 'its limit of'} bytes. A sheet of a few hundred parts is far smaller: is it the right data?` };
    case 'charset.unsupported':
      return { code: 'unsupported_charset', message: `The request body is in charset "${err.charset}"; send JSON in UTF-8.` };
    case 'encoding.unsupported':
      return { code: 'unsupported_encoding', message: `The request body is compressed with "${err.encoding}", which the API does not read; send it uncompressed, or as gzip, deflate or br.` };
    case 'request.aborted':
      return { code: 'aborted', message: 'The request body ended before its announced length; send it again.' };
    default:
      return { code: 'bad_request', message: `The request could not be read (${String(err.message ?? 'bad request')}).${status === 400 ? ' Check its body and headers.' : ''}` };
  }
}

// The one place errors become responses: never a stack trace to the client.
export const errorHandler: ErrorRequestHandler = (err, _req, res, _next) => {
  if (err instanceof HttpError) {
    res.status(err.status).json({ error: { ...err.details, code: err.code, message: err.message, ...(err.field ? { field: err.field } : {}) } });
    return;
  }
  if (isDatabaseUnavailable(err)) {
    console.error(`database unavailable: ${(err as Error).message}`);
    res.status(503).setHeader('Retry-After', '2');
    res.json({ error: { code: 'db_unavailable', message: 'The database is not answering right now (it may be restarting), so this request may not have been carried out. Try again in a few seconds; reload first if it was a change.' } });
    return;
  }
  const status = typeof err?.status === 'number' && err.status >= 400 && err.status < 500 ? err.status : 500;
  if (status === 500) {
    console.error('server error:', err);
    res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on the server; the error is logged. Try again.' } });
    return;
  }
  res.status(status).json({ error: describeBodyError(err as BodyReadError, status) });
};
