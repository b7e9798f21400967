// A throw-away PostgreSQL cluster for fault tests: its own data folder in the system temp folder,
// a free loopback port, no Unix socket, trust authentication. It can be stopped and started under
// a running server and is removed afterwards. Never the shared test cluster: stopping that would
// break every other test file running at the same time. Runs the server binaries as the
// `postgres` user when we are root (they refuse to run as root), as scripts/lib/pg.mjs does.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { freePort } from './realtime-processes';

const isRoot = process.getuid?.() === 0;

function binDir(): string {
  const root = '/usr/lib/postgresql';
  const versions = fs.existsSync(root) ? fs.readdirSync(root).filter((v) => fs.existsSync(path.join(root, v, 'bin', 'initdb'))) : [];
  versions.sort((a, b) => Number(b) - Number(a));
  if (!versions.length) throw new Error('No PostgreSQL server binaries under /usr/lib/postgresql (npm test installs them).');
  return path.join(root, versions[0], 'bin');
}

function run(bin: string, cmd: string, args: string[]): void {
  const full = path.join(bin, cmd);
  const [c, a] = isRoot ? ['runuser', ['-u', 'postgres', '--', full, ...args]] : [full, args];
  const r = spawnSync(c, a, { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(' ')} failed: ${(r.stderr || r.stdout).trim().split('\n').slice(-3).join(' ')}`);
}

export interface ThrowawayCluster {
  port: number;
  /** a URL of a database on it (created by `createDatabase`) */
  url(db: string): string;
  createDatabase(name: string): Promise<void>;
  /** `immediate` is a crash (no checkpoint; WAL recovery at the next start) */
  stop(mode?: 'fast' | 'immediate'): void;
  start(): void;
  /** stop if running and delete the folder */
  destroy(): void;
}

/** initdb into a fresh temp folder and start it on a free loopback port. */
export async function startThrowawayCluster(): Promise<ThrowawayCluster> {
  const bin = binDir();
  const base = fs.mkdtempSync(path.join(os.tmpdir(), 'tapline-fault-pg-'));
  const data = path.join(base, 'data');
  const log = path.join(base, 'server.log');
  if (isRoot) spawnSync('chown', ['postgres:postgres', base]);
  fs.chmodSync(base, 0o700);
  const port = await freePort();
  run(bin, 'initdb', ['-D', data, '-U', 'postgres', '--auth=trust', '--encoding=UTF8', '--locale=C.UTF-8', '--no-sync']);
  const opts = `-c listen_addresses=127.0.0.1 -c port=${port} -c unix_socket_directories= -c max_connections=50`;
  let running = false;
  const cluster: ThrowawayCluster = {
    port,
    url: (db) => `postgres://postgres@127.0.0.1:${port}/${db}`,
    async createDatabase(name) {
      const c = new pg.Client({ connectionString: cluster.url('postgres') });
      await c.connect();
      await c.query(`create database "${name}"`);
      await c.end();
    },
    start() {
      run(bin, 'pg_ctl', ['start', '-D', data, '-l', log, '-w', '-t', '60', '-o', opts]);
      running = true;
    },
    stop(mode = 'fast') {
      run(bin, 'pg_ctl', ['stop', '-D', data, '-m', mode, '-w', '-t', '60']);
      running = false;
    },
    destroy() {
      try {
        if (running) cluster.stop('immediate');
      } finally {
        fs.rmSync(base, { recursive: true, force: true });
      }
    },
  };
  cluster.start();
  // A run stopped half-way (Ctrl-C, a crashed worker) must not leave a server running in /tmp.
  process.once('exit', () => {
    if (running) spawnSync(isRoot ? 'runuser' : path.join(bin, 'pg_ctl'), isRoot ? ['-u', 'postgres', '--', path.join(bin, 'pg_ctl'), 'stop', '-D', data, '-m', 'immediate'] : ['stop', '-D', data, '-m', 'immediate']);
    fs.rmSync(base, { recursive: true, force: true });
  });
  return cluster;
}
