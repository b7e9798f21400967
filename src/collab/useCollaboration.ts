// `useCollaboration(editor, sourceKey)`: live co-editing for the sheet open in the editor, when it
// is a cloud project ("cloud-<uuid>"); does nothing for other sheets.
import { useCallback, useEffect, useRef, useState } from 'react';
import { parseSheet } from '../../shared/sheet';
import { SyncClient, type KnownPeer, type Point, type Role, type SyncStatus } from '../../shared/sync';
import type { EditorStore } from '../editor/store/editorStore';
import { notify } from '../editor/notices';
import { bindEditor } from './editorBinding';
import { registerLiveSession } from './liveSessions';
import { SocketTransport } from './socketTransport';

export interface Collaboration {
  /** 'off' for sheets that are not cloud projects */
  status: SyncStatus | 'off';
  /** was offline and came back (the banner says so for a moment) */
  recovered: boolean;
  peers: KnownPeer[];
  role: Role | null;
  /** tell the others where this user's pointer is on the canvas (canvas units), or null when it left */
  reportCursor(point: Point | null): void;
}

/** How long a closed sheet keeps its socket to send edits not yet acknowledged, ms. */
const CLOSE_WAIT_MS = 5000;

const CLOUD_KEY = /^cloud-([0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12})$/i;

/** The project id behind a sheet source key, or null when it is not a cloud project. */
export function projectIdOfSource(sourceKey: string): string | null {
  return CLOUD_KEY.exec(sourceKey)?.[1].toLowerCase() ?? null;
}

export function useCollaboration(editor: EditorStore, sourceKey: string): Collaboration {
  const projectId = projectIdOfSource(sourceKey);
  const [status, setStatus] = useState<SyncStatus | 'off'>(projectId ? 'connecting' : 'off');
  const [recovered, setRecovered] = useState(false);
  const [peers, setPeers] = useState<KnownPeer[]>([]);
  const [role, setRole] = useState<Role | null>(null);
  const clientRef = useRef<SyncClient | null>(null);

  useEffect(() => {
    if (!projectId) return;
    const transport = new SocketTransport();
    const client = new SyncClient({ projectId, transport, validate: (d) => parseSheet(d).ok });
    clientRef.current = client;
    const binding = bindEditor(editor, client);
    const unregister = registerLiveSession(projectId, client);
    let wasOffline = false;
    let recoveredTimer: ReturnType<typeof setTimeout> | undefined;
    const offs = [
      client.on('status', (s) => {
        setStatus(s);
        if (s === 'offline') wasOffline = true;
        if (s === 'live' && wasOffline) {
          wasOffline = false;
          setRecovered(true);
          clearTimeout(recoveredTimer);
          recoveredTimer = setTimeout(() => setRecovered(false), 4000);
        }
      }),
      client.on('peers', setPeers),
      client.on('role', setRole),
      client.on('notice', (n) => notify(n.message, n.kind === 'role' ? 'info' : 'error')),
      transport.listen({ refused: (r) => notify(r.message, 'error') }),
    ];
    client.start().then(
      () => setRole(client.role),
      (e: unknown) => notify(e instanceof Error ? e.message : String(e), 'error'),
    );
    return () => {
      for (const off of offs) off();
      clearTimeout(recoveredTimer);
      unregister();
      binding.dispose();
      clientRef.current = null;
      // Closing the sheet: let the last edits reach the server before the socket goes.
      const late = new Promise((resolve) => setTimeout(resolve, CLOSE_WAIT_MS));
      void Promise.race([client.whenIdle(), late]).finally(() => {
        client.stop();
        transport.close();
      });
    };
  }, [editor, projectId]);

  const reportCursor = useCallback((point: Point | null) => clientRef.current?.updatePresence({ cursor: point }), []);
  return { status, recovered, peers, role, reportCursor };
}
