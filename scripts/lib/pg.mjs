// Project-local PostgreSQL: find or install Debian's server, create a cluster inside the
// checkout on first use, start it on loopback only, and stop it again.
// Plain Node (no dependencies) because it runs before `npm ci` may have happened.
import { spawnSync, execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import net from 'node:net';
import { fail, note } from './say.mjs';

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;

export function pgSettings(root) {
  const base = path.join(root, '.local', 'pg');
  return {
    base,
    dataDir: path.join(base, 'data'),
    logFile: path.join(base, 'server.log'),
    port: Number(process.env.TAPLINE_PG_PORT ?? 54329),
    host: '127.0.0.1',
  };
}

export function adminUrl(s, db = 'postgres') {
  return `postgres://postgres@${s.host}:${s.port}/${db}`;
}

function findBinDir() {
  const root = '/usr/lib/postgresql';
  if (!fs.existsSync(root)) return null;
  const versions = fs.readdirSync(root).filter((v) => fs.existsSync(path.join(root, v, 'bin', 'initdb')));
  versions.sort((a, b) => Number(b) - Number(a));
  return versions.length ? path.join(root, versions[0], 'bin') : null;
}

export function ensurePostgresInstalled() {
  let bin = findBinDir();
  if (bin) return bin;
  if (!isRoot || !fs.existsSync('/usr/bin/apt-get')) {
    fail('PostgreSQL server is not installed and cannot be installed automatically here.',
      'Install it (Debian/Ubuntu: `sudo apt-get install -y postgresql`), or set DATABASE_URL to a database you already run.');
  }
  note('PostgreSQL is not installed; installing Debian\'s postgresql package (apt-get)...');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const upd = spawnSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  const inst = spawnSync('apt-get', ['install', '-y', '-qq', 'postgresql'], { stdio: 'inherit', env });
  if (upd.status !== 0 || inst.status !== 0) {
    fail('Installing PostgreSQL with apt-get failed (see the apt output above).',
      'Install the `postgresql` package by hand, or set DATABASE_URL to an existing database.');
  }
  bin = findBinDir();
  if (!bin) fail('apt-get reported success but no PostgreSQL server binaries were found under /usr/lib/postgresql.', 'Check the installation, or set DATABASE_URL.');
  return bin;
}

// PostgreSQL refuses to run as root; as root we run it as the `postgres` system user, which
// needs to own the data folder and to traverse every folder above it.
function asServerUser(cmd, args) {
  if (!isRoot) return [cmd, args];
  return ['runuser', ['-u', 'postgres', '--', cmd, ...args]];
}

function ensureServerUser() {
  if (!isRoot) return;
  const r = spawnSync('id', ['-u', 'postgres']);
  if (r.status !== 0) {
    const u = spawnSync('useradd', ['--system', '--no-create-home', '--shell', '/usr/sbin/nologin', 'postgres'], { stdio: 'inherit' });
    if (u.status !== 0) fail('There is no `postgres` system user to run the database server as, and creating one failed.', 'Create the user, or run as a normal user, or set DATABASE_URL.');
  }
}

function makeTraversable(dir) {
  const opened = [];
  let d = path.dirname(dir);
  while (true) {
    const st = fs.statSync(d);
    if ((st.mode & 0o001) === 0) { fs.chmodSync(d, st.mode | 0o001); opened.push(d); }
    const up = path.dirname(d);
    if (up === d) break;
    d = up;
  }
  if (opened.length) note(`Gave other users search (x) permission on ${opened.join(', ')} so the postgres user can reach the data folder.`);
}

function run(bin, cmd, args, { quiet = false } = {}) {
  const [c, a] = asServerUser(path.join(bin, cmd), args);
  return spawnSync(c, a, { encoding: 'utf8', stdio: quiet ? 'pipe' : ['ignore', 'pipe', 'pipe'] });
}

export function isClusterRunning(bin, s) {
  if (!fs.existsSync(path.join(s.dataDir, 'PG_VERSION'))) return false;
  return run(bin, 'pg_ctl', ['status', '-D', s.dataDir], { quiet: true }).status === 0;
}

export function portInUse(port, host = '127.0.0.1') {
  return new Promise((resolve) => {
    const srv = net.createServer();
    srv.once('error', () => resolve(true));
    srv.once('listening', () => srv.close(() => resolve(false)));
    srv.listen(port, host);
  });
}

/** Ensures the local cluster runs; returns { startedHere } so callers stop only what they started. */
export async function ensureCluster(root) {
  const bin = ensurePostgresInstalled();
  ensureServerUser();
  const s = pgSettings(root);
  fs.mkdirSync(s.base, { recursive: true });
  if (isRoot) { makeTraversable(s.base); execFileSync('chown', ['postgres:postgres', s.base]); }
  if (!fs.existsSync(path.join(s.dataDir, 'PG_VERSION'))) {
    note(`Creating a project-local PostgreSQL cluster in ${path.relative(root, s.dataDir)} (first run)...`);
    const r = run(bin, 'initdb', ['-D', s.dataDir, '-U', 'postgres', '--auth=trust', '--encoding=UTF8', '--locale=C.UTF-8'], { quiet: true });
    if (r.status !== 0) fail(`initdb failed: ${(r.stderr || r.stdout || '').trim().split('\n').slice(-3).join(' ')}`,
      `Remove ${s.dataDir} and try again, or set DATABASE_URL.`);
  }
  if (isClusterRunning(bin, s)) return { settings: s, startedHere: false, bin };
  if (await portInUse(s.port)) {
    fail(`Port ${s.port} on 127.0.0.1 is taken by another program, so the project database cannot start there.`,
      'Stop that program, or choose another port with TAPLINE_PG_PORT=NNNNN.');
  }
  fs.writeFileSync(s.logFile, '');
  if (isRoot) execFileSync('chown', ['postgres:postgres', s.logFile]);
  // No Unix socket: a long checkout path would exceed the ~100-character socket limit, and
  // every client here connects over loopback TCP anyway.
  const opts = `-c listen_addresses=${s.host} -c port=${s.port} -c unix_socket_directories= -c fsync=${process.env.TAPLINE_PG_FSYNC ?? 'on'} -c max_connections=200`;
  const r = run(bin, 'pg_ctl', ['start', '-D', s.dataDir, '-l', s.logFile, '-w', '-t', '60', '-o', opts]);
  if (r.status !== 0 && isClusterRunning(bin, s)) return { settings: s, startedHere: false, bin }; // another run won the race
  if (r.status !== 0) {
    const log = fs.existsSync(s.logFile) ? fs.readFileSync(s.logFile, 'utf8').trim().split('\n').slice(-5).join('\n    ') : '';
    fail(`PostgreSQL did not start.\n    ${log}`, `Read ${s.logFile}; remove ${s.dataDir} to start afresh, or set DATABASE_URL.`);
  }
  return { settings: s, startedHere: true, bin };
}

export function stopCluster(root) {
  const bin = findBinDir();
  if (!bin) return;
  const s = pgSettings(root);
  if (!isClusterRunning(bin, s)) return;
  run(bin, 'pg_ctl', ['stop', '-D', s.dataDir, '-m', 'fast', '-w'], { quiet: true });
}
