// Which cloud projects are open for live co-editing in this tab. While one is, its sheet source's
// save does not PATCH the sheet (that would race the live operations): a save means "wait until
// the server has every change made here".
import type { SyncClient } from '../../shared/sync';

const sessions = new Map<string, SyncClient>();

/** Longest a save waits for the server to acknowledge everything, ms. */
const SAVE_WAIT_MS = 15_000;

/**
 * Autosave pause of a live project, ms. Its edits are already on their way to the server as
 * operations, so "saving" only waits for their acknowledgements: a REST-length pause (1.2 s) would
 * show "Unsaved changes" for a change the server has long stored.
 */
export const LIVE_AUTOSAVE_DELAY_MS = 100;

export function registerLiveSession(projectId: string, client: SyncClient): () => void {
  sessions.set(projectId, client);
  return () => {
    if (sessions.get(projectId) === client) sessions.delete(projectId);
  };
}

/**
 * For the cloud sheet source: null when the project is not edited live in this tab (save through
 * the REST API as before); otherwise a save that resolves with the server version once every
 * change made here is stored, or fails with a message the editor shows.
 */
export function liveSaveFor(projectId: string): (() => Promise<{ version: number }>) | null {
  const client = sessions.get(projectId);
  if (!client || client.status === 'closed') return null;
  return async () => {
    if (client.status === 'offline')
      throw new Error('Offline: your changes are kept in this tab and sent when the connection returns.');
    let timer: ReturnType<typeof setTimeout> | undefined;
    const late = new Promise<never>((_, reject) => {
      timer = setTimeout(() => reject(new Error('Not yet stored: the server has not confirmed your latest changes; they are kept and sent again.')), SAVE_WAIT_MS);
    });
    try {
      await Promise.race([client.whenIdle(), late]);
    } finally {
      clearTimeout(timer);
    }
    return { version: client.version };
  };
}
