// Real server processes for the multi-process tests: `tsx server/main.ts` on a port of its own,
// all against the same test database, as they would run behind a load balancer.
import { spawn, type ChildProcess } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '../..');

/** A free loopback port (closed again before it is returned). */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const port = (srv.address() as net.AddressInfo).port;
      srv.close(() => resolve(port));
    });
  });
}

export interface ServerProcess {
  url: string;
  port: number;
  child: ChildProcess;
  /** what it printed, for failure messages */
  output(): string;
  /** SIGTERM and wait for the exit */
  stop(): Promise<void>;
  /** SIGKILL and wait for the exit (no shutdown code runs) */
  kill(): Promise<void>;
}

/** Start `server/main.ts` and wait until /api/health answers. */
export async function startServerProcess(databaseUrl: string, port?: number, env: Record<string, string> = {}): Promise<ServerProcess> {
  const p = port ?? (await freePort());
  // `node --import tsx` rather than the tsx CLI: the CLI runs the program in a grandchild process,
  // which a SIGKILL of the child would leave running.
  // TAPLINE_SERVER_NODE_ARGS: extra node flags for profiling, e.g. "--cpu-prof --cpu-prof-dir=/tmp/prof".
  const extra = (process.env.TAPLINE_SERVER_NODE_ARGS ?? '').split(' ').filter(Boolean);
  const child = spawn(process.execPath, [...extra, '--import', 'tsx', 'server/main.ts'], {
    cwd: root,
    env: {
      ...process.env,
      DATABASE_URL: databaseUrl,
      PORT: String(p),
      HOST: '127.0.0.1',
      NODE_ENV: 'test',
      RATE_LIMIT_SIGNIN: '10000',
      TAPLINE_STATIC_DIR: path.join(root, '.local', 'no-client'),
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stdout!.on('data', (d) => (out += d));
  child.stderr!.on('data', (d) => (out += d));
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  const url = `http://127.0.0.1:${p}`;
  const until = Date.now() + 30_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server process exited at start:\n${out}`);
    try {
      const res = await fetch(`${url}/api/health`);
      if (res.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > until) {
      child.kill('SIGKILL');
      throw new Error(`server process did not answer in 30 s:\n${out}`);
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  return {
    url,
    port: p,
    child,
    output: () => out,
    async stop() {
      if (child.exitCode === null) child.kill('SIGTERM');
      await exited;
    },
    async kill() {
      if (child.exitCode === null) child.kill('SIGKILL');
      await exited;
    },
  };
}
