import { Navigate, useSearchParams } from 'react-router-dom';
import { signInHref, useAuthProviders, useMe } from '../cloud/session';
import { buttonClass, ErrorNote, Loading, quietButtonClass } from '../cloud/ui';

const PROBLEMS: Record<string, string> = {
  cancelled: 'Sign-in was cancelled at the provider. Try again when you are ready.',
  state: 'The sign-in took too long or was started in another tab. Start it again from here.',
  provider: 'The sign-in provider did not confirm who you are. Try again; if it keeps failing, the OAuth app settings may be wrong (see the README).',
  failed: 'Signing in failed on our side. Try again in a moment.',
};

/** `/sign-in`: start OAuth; with the local fake provider, also one-click demo people. */
export function SignInPage() {
  const [params] = useSearchParams();
  const returnTo = params.get('returnTo') ?? '/projects';
  const error = params.get('error');
  const me = useMe();
  const providers = useAuthProviders();
  if (me.data) return <Navigate to={returnTo.startsWith('/') && !returnTo.startsWith('//') ? returnTo : '/projects'} replace />;
  return (
    <div className="mx-auto max-w-xl px-6 py-12">
      <h1 className="text-2xl font-semibold">Sign in to Tapline</h1>
      <p className="mt-2 text-ink-muted">Signing in keeps your sheets in cloud projects that colleagues can open with the role you give them.</p>
      {error ? <p role="alert" className="mt-4 rounded border border-caution/50 px-3 py-2 text-sm">{PROBLEMS[error] ?? PROBLEMS.failed}</p> : null}
      {providers.isPending ? <Loading what="sign-in options" /> : null}
      <ErrorNote error={providers.error} />
      {providers.data ? (
        <div className="mt-6 space-y-4">
          <a className={`${buttonClass} inline-block`} href={signInHref(returnTo)}>
            {providers.data.mode === 'github' ? 'Sign in with GitHub' : 'Sign in (local test provider)'}
          </a>
          {providers.data.mode === 'fake' ? (
            <div className="rounded border border-rule bg-panel p-4 text-sm">
              <p>No hosted OAuth app is configured, so a local stand-in answers. Continue as a demo person (demo data):</p>
              <ul className="mt-2 flex flex-wrap gap-2">
                {providers.data.demoLogins.map((login) => (
                  <li key={login}><a className={quietButtonClass} href={signInHref(returnTo, login)}>{login}</a></li>
                ))}
              </ul>
            </div>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
