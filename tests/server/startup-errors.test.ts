import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '../..');

function run(script: string, env: Record<string, string>) {
  return spawnSync(process.execPath, [script], { cwd: root, env: { ...process.env, ...env }, encoding: 'utf8', timeout: 60_000 });
}

// A stack trace line looks like "    at fn (file:line:col)".
const stackLine = /^\s+at .+:\d+:\d+\)?$/m;

describe('bad configuration fails with a message that says what to do', () => {
  it('npm start: DATABASE_URL unreachable', () => {
    // Port 9 on loopback: nothing listens, the connection is refused at once.
    const r = run('scripts/start.mjs', { DATABASE_URL: 'postgres://nobody@127.0.0.1:9/none', PORT: '5391' });
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/DATABASE_URL is set but the database is unreachable/);
    expect(r.stderr).toMatch(/What to do:/);
    expect(r.stderr).not.toMatch(stackLine);
  });

  it('npm start: the app port is taken', async () => {
    const blocker = net.createServer();
    await new Promise<void>((ok) => blocker.listen(0, '127.0.0.1', ok));
    const port = (blocker.address() as net.AddressInfo).port;
    try {
      const r = run('scripts/start.mjs', { PORT: String(port), DATABASE_URL: 'postgres://nobody@127.0.0.1:9/none' });
      expect(r.status).toBe(1);
      expect(r.stderr).toMatch(new RegExp(`Port ${port} .* already in use`));
      expect(r.stderr).toMatch(/PORT=/);
      expect(r.stderr).not.toMatch(stackLine);
    } finally {
      blocker.close();
    }
  });

  it('server: an invalid DATABASE_URL is reported by name', () => {
    const r = spawnSync(path.join(root, 'node_modules/.bin/tsx'), ['server/main.ts'], {
      cwd: root, env: { ...process.env, DATABASE_URL: 'not a url' }, encoding: 'utf8', timeout: 60_000,
    });
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/DATABASE_URL/);
    expect(r.stderr).toMatch(/What to do:/);
    expect(r.stderr).not.toMatch(stackLine);
  });
});
