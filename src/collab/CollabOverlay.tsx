// Everything co-editing draws over the canvas: who is here, their pointers and selections, and
// the connection banner. Rendered inside the canvas's container (it tracks the pointer there).
import { useEffect, useRef } from 'react';
import { useReactFlow } from '@xyflow/react';
import type { EditorStore } from '../editor/store/editorStore';
import { ConnectionBanner } from './ConnectionBanner';
import { PeerAvatars } from './PeerAvatars';
import { RemoteCursors } from './RemoteCursors';
import type { Collaboration } from './useCollaboration';

export function CollabOverlay({ editor, collab }: { editor: EditorStore; collab: Collaboration }) {
  const ref = useRef<HTMLDivElement>(null);
  const rf = useReactFlow();
  const { reportCursor } = collab;
  const live = collab.status !== 'off';

  useEffect(() => {
    const area = ref.current?.parentElement;
    if (!area || !live) return;
    const move = (e: PointerEvent) => reportCursor(rf.screenToFlowPosition({ x: e.clientX, y: e.clientY }));
    const leave = () => reportCursor(null);
    area.addEventListener('pointermove', move);
    area.addEventListener('pointerleave', leave);
    return () => {
      area.removeEventListener('pointermove', move);
      area.removeEventListener('pointerleave', leave);
    };
  }, [rf, reportCursor, live]);

  if (!live) return null;
  return (
    <div ref={ref} className="contents">
      <RemoteCursors editor={editor} peers={collab.peers} />
      <div className="pointer-events-auto absolute right-3 top-2 z-30">
        <PeerAvatars peers={collab.peers} />
      </div>
      <ConnectionBanner collab={collab} />
    </div>
  );
}
