import express, { Router, type Request, type Response } from 'express';
import { createHash } from 'node:crypto';
import { escapeHtml } from '../../html';
import { authorizePage, type AuthorizeParams } from './authorize-page';
import { fakeAccount, isValidLogin } from './directory';
import { FakeGrants } from './grants';

/** Client credentials the app and its fake provider agree on (nothing secret: development only). */
export const FAKE_CLIENT = { id: 'tapline-fake-client', secret: 'tapline-fake-secret' } as const;

export const CALLBACK_PATH = '/auth/github/callback';

function str(v: unknown): string | undefined {
  return typeof v === 'string' ? v : undefined;
}

/** Only our own callback path is accepted, and the redirect stays on this origin (no open redirect). */
function callbackTarget(redirectUri: string | undefined): string | null {
  if (!redirectUri) return null;
  try {
    const u = new URL(redirectUri, 'http://placeholder.invalid');
    return u.pathname === CALLBACK_PATH ? CALLBACK_PATH : null;
  } catch {
    return null;
  }
}

function bearer(req: Request): string | undefined {
  const m = /^(?:token|bearer)\s+(\S+)$/i.exec(req.get('authorization') ?? '');
  return m?.[1];
}

/**
 * A local stand-in for the OAuth provider, mounted under /fake-oauth/ when no hosted OAuth app is
 * configured: authorize (a page, or `?login=NAME` to approve at once), access_token, user, user/emails.
 */
export function fakeProviderRouter(): Router {
  const grants = new FakeGrants();
  const r = Router();

  r.get('/authorize', (req: Request, res: Response) => {
    const params: AuthorizeParams = {
      clientId: str(req.query.client_id) ?? '',
      redirectUri: str(req.query.redirect_uri) ?? '',
      state: str(req.query.state),
      scope: str(req.query.scope),
    };
    const target = callbackTarget(params.redirectUri);
    if (params.clientId !== FAKE_CLIENT.id || !target) {
      res.status(400).type('html').send(`<p>Bad authorize request: unknown client_id or a redirect_uri other than ${escapeHtml(CALLBACK_PATH)}.</p>`);
      return;
    }
    res.setHeader('Cache-Control', 'no-store');
    const login = str(req.query.login)?.trim();
    if (login === undefined || login === '') {
      res.type('html').send(authorizePage(params));
      return;
    }
    if (!isValidLogin(login)) {
      res.status(400).type('html').send(authorizePage(params, `"${login}" is not a valid login: use letters, digits and inner hyphens (at most 39).`));
      return;
    }
    const code = grants.issueCode(fakeAccount(login).login, params.clientId, target);
    const q = new URLSearchParams({ code, ...(params.state ? { state: params.state } : {}) });
    res.redirect(302, `${target}?${q}`);
  });

  r.post('/access_token', express.urlencoded({ extended: false, limit: '10kb' }), express.json({ limit: '10kb' }), (req, res) => {
    const b = (req.body ?? {}) as Record<string, unknown>;
    if (str(b.client_id) !== FAKE_CLIENT.id || str(b.client_secret) !== FAKE_CLIENT.secret) {
      res.status(401).json({ error: 'incorrect_client_credentials', error_description: 'The client_id and/or client_secret passed are incorrect.' });
      return;
    }
    // Compared by path: the origin is this same app (and supertest gives every request its own port).
    const redirect = str(b.redirect_uri);
    const token = grants.redeem(str(b.code) ?? '', FAKE_CLIENT.id, redirect === undefined ? undefined : callbackTarget(redirect) ?? '');
    if (!token) {
      res.status(400).json({ error: 'bad_verification_code', error_description: 'The code passed is incorrect or expired.' });
      return;
    }
    res.json({ access_token: token, token_type: 'bearer', scope: 'user:email' });
  });

  const signedIn = (req: Request, res: Response) => {
    const login = grants.loginForToken(bearer(req) ?? '');
    if (!login) res.status(401).json({ message: 'Bad credentials' });
    return login;
  };

  r.get('/user', (req, res) => {
    const login = signedIn(req, res);
    if (login) res.json(fakeAccount(login));
  });

  r.get('/user/emails', (req, res) => {
    const login = signedIn(req, res);
    if (login) res.json([{ email: fakeAccount(login).email, primary: true, verified: true, visibility: 'public' }]);
  });

  r.get('/avatars/:file', (req, res) => {
    const login = req.params.file.replace(/\.svg$/, '');
    const hue = createHash('sha256').update(login).digest()[0] * 360 / 256;
    const initials = escapeHtml(login.replace(/[^A-Za-z0-9]/g, '').slice(0, 2).toUpperCase() || '?');
    res.type('image/svg+xml').set('Cache-Control', 'public, max-age=86400').send(
      `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 64 64"><rect width="64" height="64" rx="32" fill="hsl(${hue.toFixed(0)} 45% 45%)"/>` +
        `<text x="32" y="41" font-family="sans-serif" font-size="26" fill="#fff" text-anchor="middle">${initials}</text></svg>`,
    );
  });

  return r;
}
