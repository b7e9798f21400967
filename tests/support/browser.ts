// Reusable set-up for browser tests: the real server (createApp) on a random loopback port with a
// fresh test database, the built client from dist/ and the local mail sink; and Debian's Chromium
// driven by playwright-core. Build the client first (`npx vite build`; `npm test` does it).
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import { chromium, type Browser, type BrowserContextOptions, type Page } from 'playwright-core';
import { desc } from 'drizzle-orm';
import { createApp, sessionHandlersOf } from '../../server/app';
import { attachRealtime } from '../../server/realtime/attach';
import { loadConfig, type Config } from '../../server/config';
import { devMail } from '../../server/db/schema';
import { startMail } from '../../server/mail/mailer';
import { createTestDatabase, type TestDatabase } from './db';

export const CHROMIUM_ARGS = [
  '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync',
];

const distDir = path.resolve(import.meta.dirname, '../../dist');

export interface BrowserServer {
  /** e.g. http://127.0.0.1:43817 */
  baseUrl: string;
  t: TestDatabase;
  config: Config;
  /** What the local SMTP sink received, newest first. */
  mailbox(): Promise<(typeof devMail.$inferSelect)[]>;
  close(): Promise<void>;
}

/**
 * Starts the whole app (API, live co-editing sockets, built client) on 127.0.0.1 with a database
 * of its own, as `server/main.ts` does. `env` overrides configuration.
 */
export async function startBrowserServer(env: Record<string, string> = {}): Promise<BrowserServer> {
  if (!fs.existsSync(path.join(distDir, 'index.html'))) {
    throw new Error('dist/index.html is missing: build the client with `npx vite build` before the browser tests (npm test does this).');
  }
  // A private copy of the build: in a shared checkout someone may rebuild dist/ mid-test.
  const clientDir = fs.mkdtempSync(path.join(os.tmpdir(), 'tapline-dist-'));
  fs.cpSync(distDir, clientDir, { recursive: true, filter: (src) => !src.endsWith('.map') });
  const t = await createTestDatabase();
  const config = loadConfig({ DATABASE_URL: t.url, NODE_ENV: 'test', RATE_LIMIT_SIGNIN: '1000', RATE_LIMIT_INVITATIONS: '1000', ...env });
  const mail = await startMail(config, t.database);
  const app = createApp({ config, database: t.database, mail, staticDir: clientDir });
  const server = http.createServer(app);
  // One process, so socket.io rooms need not go through PostgreSQL.
  const realtime = attachRealtime(server, { config, database: t.database, sessionHandlers: sessionHandlersOf(app), clustered: false });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    t,
    config,
    mailbox: () => t.database.db.select().from(devMail).orderBy(desc(devMail.id)),
    async close() {
      server.closeAllConnections();
      await realtime.close(); // closes the HTTP server too
      await mail?.close();
      await t.drop();
      fs.rmSync(clientDir, { recursive: true, force: true });
    },
  };
}

export interface Screen {
  server: BrowserServer;
  browser: Browser;
  /** one page in a context of its own, watched for errors (`problems`) */
  page: Page;
  problems: PageProblems;
  /** closes the browser, then the app and its database */
  close(): Promise<void>;
}

/**
 * The usual set-up of a screen test, for its beforeAll: the whole app (startBrowserServer),
 * Debian's Chromium and one watched page in a context with `context` options.
 */
export async function openScreen(context: BrowserContextOptions = {}, env: Record<string, string> = {}): Promise<Screen> {
  const server = await startBrowserServer(env);
  const browser = await launchBrowser();
  const page = await (await browser.newContext(context)).newPage();
  return {
    server,
    browser,
    page,
    problems: watchPage(page),
    async close() {
      await browser.close();
      await server.close();
    },
  };
}

/** Launches Debian's Chromium (CHROMIUM_PATH, default /usr/bin/chromium) headless. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium', args: CHROMIUM_ARGS });
}

export interface PageProblems {
  /** uncaught exceptions and console errors, including content-security-policy refusals */
  errors: string[];
}

// `GET /api/me` answers 401 to a signed-out visitor by contract; Chromium logs that as an error.
const EXPECTED = /^Failed to load resource: the server responded with a status of 401\b/;

/**
 * Records what went wrong in a page (uncaught errors, console errors such as CSP refusals), so a
 * test can assert that nothing did. A 401 answer to a signed-out visitor is not counted.
 */
export function watchPage(page: Page): PageProblems {
  const p: PageProblems = { errors: [] };
  page.on('pageerror', (e) => p.errors.push(`pageerror: ${e.message}`));
  page.on('console', (m) => {
    if (m.type() === 'error' && !EXPECTED.test(m.text())) p.errors.push(`console: ${m.text()} (${m.location().url})`);
  });
  return p;
}

/**
 * Signs the page in through the fake OAuth provider with `?login=NAME` (plain redirects) and
 * waits until it lands on `returnTo`.
 */
export async function signInPage(page: Page, baseUrl: string, login: string, returnTo = '/projects'): Promise<void> {
  await page.goto(`${baseUrl}/auth/github?${new URLSearchParams({ login, returnTo })}`);
  await page.waitForURL((u) => u.pathname === returnTo.split('?')[0]);
}
