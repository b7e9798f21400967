import { escapeHtml, page } from '../../html';
import { demoLogins, fakeAccount } from './directory';

export interface AuthorizeParams {
  clientId: string;
  redirectUri: string;
  state?: string;
  scope?: string;
}

function hiddenFields(p: AuthorizeParams): string {
  const fields: [string, string | undefined][] = [
    ['client_id', p.clientId],
    ['redirect_uri', p.redirectUri],
    ['state', p.state],
    ['scope', p.scope],
  ];
  return fields
    .filter(([, v]) => v !== undefined)
    .map(([k, v]) => `<input type="hidden" name="${k}" value="${escapeHtml(v as string)}">`)
    .join('');
}

/** The fake provider's consent page: pick a demo person or type any login. */
export function authorizePage(p: AuthorizeParams, error?: string): string {
  const hidden = hiddenFields(p);
  const people = demoLogins()
    .map((login) => {
      const a = fakeAccount(login);
      return `<li><form method="get" action="/fake-oauth/authorize">${hidden}<input type="hidden" name="login" value="${escapeHtml(a.login)}">
<button type="submit" data-login="${escapeHtml(a.login)}">Continue as ${escapeHtml(a.name)} (${escapeHtml(a.login)})</button></form></li>`;
    })
    .join('');
  const cancel = new URLSearchParams({ error: 'access_denied', ...(p.state ? { state: p.state } : {}) });
  return page(
    'Fake sign-in provider',
    `<h1>Sign in to Tapline (local fake provider)</h1>
<p class="note">No hosted OAuth app is configured, so this development stand-in answers instead of GitHub.
Anyone can sign in as anyone here: it is for development and tests only.</p>
${error ? `<p role="alert"><strong>${escapeHtml(error)}</strong></p>` : ''}
<h2>Demo people (demo data)</h2><ul>${people}</ul>
<h2>Or type a login</h2>
<form method="get" action="/fake-oauth/authorize">${hidden}
<label>Login <input name="login" required pattern="[A-Za-z0-9][A-Za-z0-9\\-]{0,38}" autocomplete="off"></label>
<button type="submit">Continue</button></form>
<p><a href="/auth/github/callback?${escapeHtml(cancel.toString())}">Cancel</a></p>`,
  );
}
