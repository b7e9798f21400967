// Listens on the database channel the triggers of drizzle/0003_realtime_notifications.sql raise,
// so every server process hears of sheet changes made outside the live path, sessions ending and
// memberships changing, whichever process (or script) made them. Each process then acts on its
// own sockets only (io.local), so nothing is delivered twice across processes.
import pg from 'pg';
import { z } from 'zod';

export const CHANNEL = 'tapline_realtime';

const NoticeSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('sheet'), projectId: z.string(), version: z.number().int() }),
  z.object({ kind: z.literal('session'), sid: z.string() }),
  z.object({ kind: z.literal('membership'), projectId: z.string(), userId: z.number().int(), role: z.enum(['viewer', 'editor', 'owner']).nullable() }),
]);

export type DatabaseNotice = z.infer<typeof NoticeSchema>;

export interface NoticeListener {
  /** stop listening and close the connection */
  close(): Promise<void>;
}

/**
 * Keep one connection LISTENing, reconnecting with back-off when it drops. `onReconnect` runs
 * after a reconnection, because notices raised while we were away are lost: the caller re-checks.
 */
export function listenForNotices(url: string, onNotice: (n: DatabaseNotice) => void, onReconnect: () => void): NoticeListener {
  let client: pg.Client | null = null;
  let closed = false;
  let delay = 250;
  let timer: ReturnType<typeof setTimeout> | null = null;
  let connectedOnce = false;

  const connect = async () => {
    if (closed) return;
    const c = new pg.Client({ connectionString: url });
    c.on('notification', (msg) => {
      if (msg.channel !== CHANNEL || !msg.payload) return;
      let data: unknown;
      try {
        data = JSON.parse(msg.payload);
      } catch {
        return;
      }
      const parsed = NoticeSchema.safeParse(data);
      if (parsed.success) onNotice(parsed.data);
    });
    c.on('error', (err) => {
      console.error(`realtime: notification connection lost: ${err.message}`);
      retry(c);
    });
    c.on('end', () => retry(c));
    try {
      await c.connect();
      await c.query(`listen ${CHANNEL}`);
      if (closed) return void (await c.end().catch(() => undefined));
      client = c;
      delay = 250;
      if (connectedOnce) onReconnect();
      connectedOnce = true;
    } catch (err) {
      console.error(`realtime: cannot listen for database notifications: ${(err as Error).message}`);
      retry(c);
    }
  };

  const retry = (c: pg.Client) => {
    if (closed || timer || (client !== null && client !== c)) return;
    client = null;
    void c.end().catch(() => undefined);
    timer = setTimeout(() => {
      timer = null;
      void connect();
    }, delay);
    delay = Math.min(delay * 2, 5000);
  };

  void connect();
  return {
    async close() {
      closed = true;
      if (timer) clearTimeout(timer);
      const c = client;
      client = null;
      await c?.end().catch(() => undefined);
    },
  };
}
