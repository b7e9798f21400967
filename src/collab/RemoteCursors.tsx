// Other people's pointers and selections, drawn over the canvas in its coordinates (pan and zoom
// follow the view), each with the person's name and colour; they fade when the person leaves.
import { useViewport } from '@xyflow/react';
import { useStore } from 'zustand';
import type { KnownPeer } from '../../shared/sync';
import type { EditorStore } from '../editor/store/editorStore';
import { peerColor } from './peerColors';

/** Half the side of the outline drawn around a part someone has selected, canvas units. */
const OUTLINE = 34;

export function RemoteCursors({ editor, peers }: { editor: EditorStore; peers: KnownPeer[] }) {
  const { x, y, zoom } = useViewport();
  const parts = useStore(editor.store, (s) => s.doc.parts);
  const at = (p: { x: number; y: number }) => ({ left: p.x * zoom + x, top: p.y * zoom + y });
  return (
    <div className="pointer-events-none absolute inset-0 z-10 overflow-hidden" aria-hidden="true">
      {peers.map((peer) => {
        const color = peerColor(peer.user.id);
        const fade = { opacity: peer.leftAt === null ? 1 : 0, transition: 'opacity 1.2s' };
        const name = peer.user.name ?? peer.user.login;
        return (
          <div key={peer.clientId} style={fade} data-testid="collab-peer-layer" data-login={peer.user.login}>
            {parts
              .filter((p) => p.position && peer.selection.parts.includes(p.id))
              .map((p) => (
                <div
                  key={p.id}
                  className="absolute rounded border-2 border-dashed"
                  data-testid="collab-remote-selection"
                  style={{ ...at({ x: p.position!.x - OUTLINE, y: p.position!.y - OUTLINE }), width: 2 * OUTLINE * zoom, height: 2 * OUTLINE * zoom, borderColor: color }}
                />
              ))}
            {peer.cursor && (
              <div className="absolute" style={{ ...at(peer.cursor), transition: 'left 80ms linear, top 80ms linear' }} data-testid="collab-cursor">
                <svg width="14" height="18" viewBox="0 0 14 18" className="-translate-x-px -translate-y-px">
                  <path d="M1 1 L1 15 L5 11 L8 17 L10 16 L7 10 L13 10 Z" fill={color} stroke="white" strokeWidth="1" />
                </svg>
                <span className="absolute left-3 top-4 whitespace-nowrap rounded px-1 text-[10px] font-medium text-white" style={{ backgroundColor: color }}>
                  {name}
                </span>
              </div>
            )}
          </div>
        );
      })}
    </div>
  );
}
