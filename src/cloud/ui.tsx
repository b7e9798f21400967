// Small pieces shared by the cloud pages. User text (titles, names, labels) is only ever rendered
// as React text, which escapes it: never through dangerouslySetInnerHTML.
import type { ReactNode } from 'react';
import { Link, useLocation } from 'react-router-dom';
import { errorMessage } from '../lib/api';
import { signInHref, useMe } from './session';
import type { Me, Role } from './types';

export function ErrorNote({ error, title }: { error: unknown; title?: string }) {
  if (!error) return null;
  return (
    <p role="alert" className="mt-2 rounded border border-danger/40 bg-danger/5 px-3 py-2 text-sm text-danger">
      {title ? <strong>{title}: </strong> : null}
      {errorMessage(error)}
    </p>
  );
}

export function Loading({ what }: { what: string }) {
  return <p className="p-6 text-ink-muted" aria-live="polite">Loading {what}…</p>;
}

const ROLE_STYLE: Record<Role, string> = {
  owner: 'bg-accent text-accent-ink',
  editor: 'bg-sunken text-ink',
  viewer: 'border border-rule text-ink-muted',
};

export function RoleBadge({ role }: { role: Role }) {
  return <span className={`rounded px-1.5 py-0.5 text-xs font-medium ${ROLE_STYLE[role]}`}>{role}</span>;
}

const rtf = new Intl.RelativeTimeFormat(undefined, { numeric: 'auto' });
const STEPS: [Intl.RelativeTimeFormatUnit, number][] = [['year', 31536000], ['month', 2592000], ['week', 604800], ['day', 86400], ['hour', 3600], ['minute', 60]];

/** "3 minutes ago", with the exact time in the tooltip. */
export function When({ iso }: { iso: string }) {
  const t = Date.parse(iso);
  const s = (t - Date.now()) / 1000;
  const step = STEPS.find(([, size]) => Math.abs(s) >= size);
  const text = step ? rtf.format(Math.round(s / step[1]), step[0]) : 'just now';
  return <time dateTime={iso} title={new Date(t).toLocaleString()}>{text}</time>;
}

export function Section({ title, children, id }: { title: string; children: ReactNode; id?: string }) {
  return (
    <section aria-labelledby={id} className="rounded border border-rule bg-panel p-4">
      <h2 id={id} className="text-lg font-semibold">{title}</h2>
      <div className="mt-3">{children}</div>
    </section>
  );
}

export const buttonClass = 'rounded bg-accent px-3 py-1.5 text-sm font-medium text-accent-ink disabled:opacity-50';
export const quietButtonClass = 'rounded border border-rule px-3 py-1.5 text-sm hover:bg-sunken disabled:opacity-50';
export const inputClass = 'rounded border border-rule bg-paper px-2 py-1.5 text-sm';

/** Renders children for a signed-in user; otherwise a prompt to sign in that comes back here. */
export function RequireSignIn({ children }: { children: (me: Me) => ReactNode }) {
  const me = useMe();
  const { pathname, search } = useLocation();
  if (me.isPending) return <Loading what="your account" />;
  if (me.error) return <div className="p-6"><ErrorNote error={me.error} /></div>;
  if (!me.data) {
    return (
      <div className="mx-auto max-w-xl px-6 py-12">
        <h1 className="text-2xl font-semibold">Sign in to see your projects</h1>
        <p className="mt-2 text-ink-muted">Cloud projects belong to signed-in people. Local sheets and the examples work without an account.</p>
        <div className="mt-4 flex gap-3">
          <a className={buttonClass} href={signInHref(pathname + search)}>Sign in</a>
          <Link className={quietButtonClass} to="/sheets/local">Open a local sheet</Link>
        </div>
      </div>
    );
  }
  return <>{children(me.data)}</>;
}
