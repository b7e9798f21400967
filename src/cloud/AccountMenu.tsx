// The header's account corner: who is signed in, and sign-in / sign-out.
import { useQueryClient } from '@tanstack/react-query';
import { useLocation, useNavigate } from 'react-router-dom';
import { bindCloudQueryClient } from './registerCloudSources';
import { signInHref, useMe, useSignOut } from './session';
import { ErrorNote } from './ui';

export function AccountMenu() {
  // Hands the app's QueryClient to the cloud sheet sources (see registerCloudSources.ts).
  bindCloudQueryClient(useQueryClient());
  const me = useMe();
  const signOut = useSignOut();
  const navigate = useNavigate();
  const { pathname, search } = useLocation();
  if (me.isPending) return null;
  if (!me.data) {
    return <a href={signInHref(pathname === '/sign-in' ? '/projects' : pathname + search)} className="rounded px-2 py-1 text-sm text-ink-muted hover:text-ink">Sign in</a>;
  }
  const u = me.data;
  return (
    <div className="flex items-center gap-2 text-sm">
      {u.avatarUrl ? <img src={u.avatarUrl} alt="" className="h-6 w-6 rounded-full" /> : null}
      <span data-testid="signed-in-as" title={u.email ?? undefined}>{u.name ?? u.login}</span>
      <button
        type="button"
        className="rounded px-2 py-1 text-ink-muted hover:text-ink"
        disabled={signOut.isPending}
        onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate('/') })}
      >
        Sign out
      </button>
      {signOut.error ? <ErrorNote error={signOut.error} /> : null}
    </div>
  );
}
