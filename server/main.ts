import http from 'node:http';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ConfigError, loadConfig, usesRealOAuth } from './config';
import { openDatabase } from './db/client';
import { createApp, sessionHandlersOf } from './app';
import { attachRealtime } from './realtime/attach';
import { startMail } from './mail/mailer';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

function exitWith(what: string, todo: string): never {
  process.stderr.write(`\ntapline: ${what}\n  What to do: ${todo}\n\n`);
  process.exit(1);
}

// A handler that throws in a promise (a bug, or input no validator foresaw) must not take down
// every other user's requests and sockets: log it loudly and keep serving. The request that hit it
// gets no answer; its client times out and retries. Synchronous uncaught exceptions still end the
// process (its state may be broken then).
process.on('unhandledRejection', (reason) => {
  console.error('tapline: unhandled rejection (a bug; the request that caused it was not answered):', reason);
});

async function main(): Promise<void> {
  let config;
  try {
    config = loadConfig();
  } catch (err) {
    if (err instanceof ConfigError) exitWith(err.message, 'Fix the environment variables listed above (see README, "Configuration").');
    throw err;
  }
  const database = openDatabase(config.DATABASE_URL);
  try {
    await database.pool.query('select 1');
  } catch (err) {
    exitWith(`Cannot reach the database at ${redact(config.DATABASE_URL)}: ${(err as Error).message}`,
      'Check that PostgreSQL runs and DATABASE_URL is right, or unset DATABASE_URL to let `npm start` run a local one.');
  }
  const mail = await startMail(config, database);
  const app = createApp({ config, database, mail, staticDir: config.TAPLINE_STATIC_DIR ?? path.join(root, 'dist') });
  const server = http.createServer(app);
  const realtime = attachRealtime(server, { config, database, sessionHandlers: sessionHandlersOf(app) });
  server.on('error', (err: NodeJS.ErrnoException) => {
    if (err.code === 'EADDRINUSE') exitWith(`Port ${config.PORT} is already in use.`, 'Stop the program using it, or start with another port: PORT=5180 npm start');
    exitWith(`The server could not listen: ${err.message}`, 'Check HOST and PORT.');
  });
  server.listen(config.PORT, config.HOST, () => {
    const origin = `http://${config.HOST === '0.0.0.0' ? 'localhost' : config.HOST}:${config.PORT}`;
    console.log(`tapline: serving on ${origin}`);
    if (!usesRealOAuth(config)) console.log(`tapline: sign-in uses the local fake provider (${origin}/fake-oauth/); set GITHUB_CLIENT_ID/SECRET for GitHub.`);
    if (mail?.toSink) console.log(`tapline: e-mail goes to a local sink; read it at ${origin}/dev/mailbox`);
    if (!mail) console.log('tapline: no SMTP_HOST set, so invitations cannot be sent.');
  });
  const stop = () => {
    // A shutdown that hangs (a connection that never closes) must not keep the process alive.
    setTimeout(() => {
      console.error('tapline: shutdown did not finish in 10 s; exiting anyway.');
      process.exit(1);
    }, 10_000).unref();
    // socket.io first: it closes the HTTP server and releases its database connections before the pool ends.
    const closing = realtime.close();
    server.closeAllConnections();
    void closing
      .catch(() => undefined)
      .then(() => mail?.close())
      .catch(() => undefined)
      .then(() => database.close())
      .finally(() => process.exit(0));
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

function redact(url: string): string {
  return url.replace(/\/\/([^:@/]+):[^@/]*@/, '//$1:***@');
}

void main();
