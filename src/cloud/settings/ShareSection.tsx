import { useState } from 'react';
import { useSetShare } from '../projectQueries';
import { cloudPaths } from '../routeIds';
import type { ProjectDetail } from '../types';
import { ErrorNote, Section } from '../ui';

export function ShareSection({ project }: { project: ProjectDetail }) {
  const share = useSetShare(project.id);
  // The box follows the click at once (a controlled box would spring back until the cache moves);
  // the page re-keys this section when the server's answer changes `share.enabled`.
  const [enabled, setEnabled] = useState(project.share?.enabled ?? false);
  const token = project.share?.token;
  const url = token ? `${window.location.origin}${cloudPaths.shared(token)}` : null;
  return (
    <Section title="Read-only share link" id="share">
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" checked={enabled} disabled={share.isPending} onChange={(e) => {
          const on = e.target.checked;
          setEnabled(on);
          share.mutate(on, { onError: () => setEnabled(!on) });
        }} />
        Anyone with the link can view and solve this sheet (no sign-in, no editing)
      </label>
      {enabled && url && !share.isPending ? (
        <p className="mt-2 text-sm">
          <input readOnly aria-label="Share link" className="w-full rounded border border-rule bg-sunken px-2 py-1 font-mono text-xs" value={url} onFocus={(e) => e.target.select()} />
          <span className="text-ink-muted">Turning the link off makes this address stop working; turning it on again makes a new one.</span>
        </p>
      ) : null}
      <ErrorNote error={share.error} title="Share link not changed" />
    </Section>
  );
}
