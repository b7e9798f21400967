// Chooses the database: DATABASE_URL when set (a real deployment), else the project-local cluster.
import { spawnSync } from 'node:child_process';
import { adminUrl, ensureCluster, stopCluster } from './pg.mjs';
import { fail, note } from './say.mjs';

async function createDatabaseIfMissing(url, name) {
  const { default: pg } = await import('pg');
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const r = await client.query('select 1 from pg_database where datname = $1', [name]);
    if (r.rowCount === 0) await client.query(`create database "${name}"`);
  } finally {
    await client.end();
  }
}

/** Returns { url, stop } where stop() ends the local cluster only if this call started it. */
export async function prepareDatabase(root, dbName) {
  if (process.env.DATABASE_URL) {
    const url = process.env.DATABASE_URL;
    const { default: pg } = await import('pg');
    const client = new pg.Client({ connectionString: url, connectionTimeoutMillis: 5000 });
    try {
      await client.connect();
      await client.end();
    } catch (err) {
      fail(`DATABASE_URL is set but the database is unreachable: ${err.message}`,
        'Check host, port, user and password in DATABASE_URL, or unset it to use the project-local PostgreSQL.');
    }
    return { url, adminUrl: url, stop: () => {}, local: false };
  }
  const { settings, startedHere } = await ensureCluster(root);
  try {
    await createDatabaseIfMissing(adminUrl(settings), dbName);
  } catch (err) {
    fail(`The local PostgreSQL runs but creating database "${dbName}" failed: ${err.message}`, `Read ${settings.logFile}.`);
  }
  if (startedHere) note(`PostgreSQL started on ${settings.host}:${settings.port}.`);
  return {
    url: adminUrl(settings, dbName),
    adminUrl: adminUrl(settings),
    local: true,
    stop: () => { if (startedHere) stopCluster(root); },
  };
}

export function runTsx(root, script, env) {
  const r = spawnSync('npx', ['tsx', script], { cwd: root, stdio: 'inherit', env: { ...process.env, ...env } });
  return r.status ?? 1;
}
