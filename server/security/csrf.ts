import { Router, type RequestHandler } from 'express';
import { csrfSync } from 'csrf-sync';
import { HttpError } from '../http-errors';

const MUTATING = new Set(['POST', 'PATCH', 'PUT', 'DELETE']);

export const CSRF_HEADER = 'x-csrf-token';

/**
 * Synchroniser-token CSRF protection (csrf-sync): the token lives in the session and must come
 * back in the X-CSRF-Token header of every mutating request. A cross-site form or fetch can make
 * the browser send the cookie, but cannot read the token.
 */
export function createCsrf(): { tokenRouter: Router; protect: RequestHandler } {
  const { generateToken, isRequestValid } = csrfSync({
    getTokenFromRequest: (req) => req.get(CSRF_HEADER),
  });

  const tokenRouter = Router();
  tokenRouter.get('/csrf', (req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json({ token: generateToken(req) });
  });

  const protect: RequestHandler = (req, _res, next) => {
    if (!MUTATING.has(req.method)) return next();
    if (req.session && isRequestValid(req)) return next();
    next(new HttpError(403, 'csrf_invalid', 'Missing or stale X-CSRF-Token header: fetch GET /api/csrf for this session and send its token with the request.'));
  };
  return { tokenRouter, protect };
}
