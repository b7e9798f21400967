import type { RequestHandler } from 'express';
import { HttpError } from '../http-errors';

/** Routes that take a file upload instead of JSON (multipart/form-data). */
const MULTIPART_ROUTES = new Set(['/projects/import']);

// A body is present when the client says so; a DELETE or a bodyless POST (accept, restore) is fine.
function hasBody(headers: Record<string, string | string[] | undefined>): boolean {
  if (headers['transfer-encoding'] !== undefined) return true;
  const length = headers['content-length'];
  return length !== undefined && length !== '0';
}

/**
 * Refuses a request body of the wrong media type with 415 before any route reads it. Without this
 * a form post or text/plain body reaches the routes as "no body", and the answer would name a
 * missing field instead of the real mistake.
 */
export const requireBodyType: RequestHandler = (req, _res, next) => {
  if (req.method === 'GET' || req.method === 'HEAD' || req.method === 'OPTIONS' || !hasBody(req.headers)) return next();
  const multipart = MULTIPART_ROUTES.has(req.path);
  const wanted = multipart ? 'multipart/form-data' : 'application/json';
  if (req.is(wanted)) return next();
  const got = req.get('content-type') ?? 'no Content-Type';
  const hint = multipart
    ? 'Send the sheet file as multipart/form-data in the form field "file".'
    : 'Send a JSON object with the header Content-Type: application/json.';
  next(new HttpError(415, 'unsupported_media_type', `This route reads ${wanted}, but the request body is ${got}. ${hint}`));
};
