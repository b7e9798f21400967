// Says so when the live connection drops (edits are kept and sent later) and when it returns.
import type { Collaboration } from './useCollaboration';

export function ConnectionBanner({ collab }: { collab: Collaboration }) {
  const offline = collab.status === 'offline';
  const closed = collab.status === 'closed';
  if (!offline && !closed && !collab.recovered) return null;
  const tone = offline || closed ? 'border-caution/70' : 'border-ok/70';
  return (
    <div className="absolute inset-x-0 top-2 z-30 flex justify-center px-4">
      <div role="status" aria-live="polite" data-testid="collab-banner" data-state={collab.status} className={`rounded border ${tone} bg-panel px-3 py-1 text-[12px] shadow-md`}>
        {offline
          ? 'Connection lost. Your changes are kept in this tab and sent when it returns.'
          : closed
            ? 'Live editing has ended for this sheet (see the message above). Reload to open it again.'
            : 'Back online: everyone’s changes are in.'}
      </div>
    </div>
  );
}
