// Who else has the sheet open: one avatar per person (several tabs of one person count once),
// fading out when they leave.
import type { KnownPeer } from '../../shared/sync';
import { initials, peerColor } from './peerColors';

export function PeerAvatars({ peers }: { peers: KnownPeer[] }) {
  const people = new Map<number, { peer: KnownPeer; here: boolean }>();
  for (const p of peers) {
    const seen = people.get(p.user.id);
    people.set(p.user.id, { peer: seen?.here ? seen.peer : p, here: (seen?.here ?? false) || p.leftAt === null });
  }
  if (!people.size) return null;
  return (
    <ul className="flex items-center gap-1" aria-label="Also on this sheet" data-testid="collab-peers">
      {[...people.values()].map(({ peer, here }) => {
        const name = peer.user.name ?? peer.user.login;
        return (
          <li
            key={peer.user.id}
            title={`${name} (${peer.role})${here ? '' : ' — left'}`}
            data-login={peer.user.login}
            data-here={here}
            className="flex h-7 w-7 items-center justify-center overflow-hidden rounded-full border-2 text-[11px] font-semibold text-white shadow-sm transition-opacity duration-1000"
            style={{ backgroundColor: peerColor(peer.user.id), borderColor: peerColor(peer.user.id), opacity: here ? 1 : 0.15 }}
          >
            {peer.user.avatarUrl ? <img src={peer.user.avatarUrl} alt="" className="h-full w-full object-cover" /> : initials(name)}
            <span className="sr-only">{name}</span>
          </li>
        );
      })}
    </ul>
  );
}
