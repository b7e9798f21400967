// Two people (two browser contexts, two sessions) editing one cloud project live: each sees the
// other's avatar, pointer and selection; edits cross both ways; undo takes back only one's own
// change; a dropped connection shows a banner, keeps the edits made meanwhile, and recovers.
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { eq } from 'drizzle-orm';
import { createApp, sessionHandlersOf } from '../../server/app';
import { loadConfig } from '../../server/config';
import { memberships, users } from '../../server/db/schema';
import { attachRealtime, type Realtime } from '../../server/realtime/attach';
import { createTestDatabase, type TestDatabase } from '../support/db';
import { launchBrowser, signInPage, watchPage, type PageProblems } from '../support/browser';

const distDir = path.resolve(import.meta.dirname, '../../dist');

let t: TestDatabase;
let server: http.Server;
let realtime: Realtime;
let baseUrl: string;
let browser: Browser;
let ada: Page;
let ben: Page;
let problems: PageProblems[];
let projectId: string;
let clientDir: string;

// The app as server/main.ts runs it, but with the socket.io server at hand (to drop connections).
beforeAll(async () => {
  if (!fs.existsSync(path.join(distDir, 'index.html'))) throw new Error('dist/index.html is missing: run `npx vite build` first (npm test does).');
  // A private copy of the build: in a shared checkout someone may rebuild dist/ mid-test.
  clientDir = fs.mkdtempSync(path.join(os.tmpdir(), 'tapline-collab-dist-'));
  fs.cpSync(distDir, clientDir, { recursive: true, filter: (src) => !src.endsWith('.map') });
  t = await createTestDatabase();
  const config = loadConfig({ DATABASE_URL: t.url, NODE_ENV: 'test', RATE_LIMIT_SIGNIN: '1000' });
  const app = createApp({ config, database: t.database, staticDir: clientDir });
  server = http.createServer(app);
  realtime = attachRealtime(server, { config, database: t.database, sessionHandlers: sessionHandlersOf(app) });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  browser = await launchBrowser();
  ada = await (await browser.newContext({ viewport: { width: 1400, height: 900 } })).newPage();
  ben = await (await browser.newContext({ viewport: { width: 1400, height: 900 } })).newPage();
  problems = [watchPage(ada), watchPage(ben)];
  await signInPage(ada, baseUrl, 'ada-demo');
  await signInPage(ben, baseUrl, 'ben-demo');
  const sheet = JSON.parse(fs.readFileSync(path.resolve(import.meta.dirname, '../../examples/battery-divider.json'), 'utf8'));
  projectId = await ada.evaluate(async (sheetJson) => {
    const { token } = await (await fetch('/api/csrf')).json();
    const res = await fetch('/api/projects', { method: 'POST', headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': token }, body: JSON.stringify({ title: 'Live together (browser test)', sheet: sheetJson }) });
    return (await res.json()).id as string;
  }, sheet);
  const [b] = await t.database.db.select().from(users).where(eq(users.login, 'ben-demo'));
  await t.database.db.insert(memberships).values({ projectId, userId: b.id, role: 'editor' });
});
afterAll(async () => {
  await browser?.close();
  server?.closeAllConnections();
  await realtime?.close();
  await t?.drop();
  if (clientDir) fs.rmSync(clientDir, { recursive: true, force: true });
});

const resistance = (page: Page, id: string) => page.locator(`#param-${id}-resistance`);
const stored = async () => (await t.database.pool.query('select version, sheet from projects where id = $1', [projectId])).rows[0];

async function setResistance(page: Page, id: string, text: string) {
  await page.getByTestId(`part-${id}`).click();
  await resistance(page, id).fill(text);
  await resistance(page, id).press('Enter');
}

describe('two people on one sheet', () => {
  it('each sees the other arrive', async () => {
    await ada.goto(`${baseUrl}/projects/${projectId}`);
    await ben.goto(`${baseUrl}/projects/${projectId}`);
    await ada.getByTestId('sheet-editor').waitFor();
    await ben.getByTestId('sheet-editor').waitFor();
    await expect.poll(() => ada.locator('[data-testid=collab-peers] [data-login=ben-demo][data-here=true]').count(), { timeout: 15_000 }).toBe(1);
    await expect.poll(() => ben.locator('[data-testid=collab-peers] [data-login=ada-demo][data-here=true]').count()).toBe(1);
  });

  it('an edit by one appears for the other, and is stored', async () => {
    await setResistance(ada, 'R2', '8k2');
    await ben.getByTestId('part-R2').click();
    await expect.poll(() => resistance(ben, 'R2').inputValue(), { timeout: 10_000 }).toBe('8.2k');
    await expect.poll(async () => (await stored()).sheet.parts.find((p: { id: string }) => p.id === 'R2').params.resistance).toBe(8200);
  });

  it('shows the other person’s pointer with their name, and what they selected', async () => {
    const canvas = ben.locator('.react-flow__pane');
    const box = (await canvas.boundingBox())!;
    await ben.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await ben.mouse.move(box.x + box.width / 2 + 30, box.y + box.height / 2 + 20);
    const cursor = ada.locator('[data-testid=collab-peer-layer][data-login=ben-demo] [data-testid=collab-cursor]');
    await expect.poll(() => cursor.count(), { timeout: 10_000 }).toBe(1);
    expect(await cursor.textContent()).toMatch(/ben/i);
    // ben had R2 selected (previous test): ada sees it outlined in ben's colour
    await expect.poll(() => ada.locator('[data-testid=collab-peer-layer][data-login=ben-demo] [data-testid=collab-remote-selection]').count()).toBeGreaterThan(0);
  });

  it('undo after the other’s edit takes back only one’s own change', async () => {
    await setResistance(ben, 'R1', '22k');
    await ada.getByTestId('part-R1').click();
    await expect.poll(() => resistance(ada, 'R1').inputValue(), { timeout: 10_000 }).toBe('22k');
    // ada's last own change was R2 = 8k2; her undo restores R2 and leaves ben's R1 alone
    await ada.locator('.react-flow__pane').click({ position: { x: 5, y: 5 } });
    await ada.keyboard.press('Control+z');
    await expect.poll(async () => (await stored()).sheet.parts.find((p: { id: string }) => p.id === 'R2').params.resistance, { timeout: 10_000 }).not.toBe(8200);
    const s = (await stored()).sheet;
    expect(s.parts.find((p: { id: string }) => p.id === 'R1').params.resistance).toBe(22000);
    await ben.getByTestId('part-R2').click();
    await expect.poll(() => resistance(ben, 'R2').inputValue()).not.toBe('8.2k');
  });

  it('a part one deletes disappears for the other', async () => {
    await ben.getByTestId('part-RL1').click();
    await ben.keyboard.press('Delete');
    await expect.poll(() => ada.getByTestId('part-RL1').count(), { timeout: 10_000 }).toBe(0);
    expect((await stored()).sheet.parts.some((p: { id: string }) => p.id === 'RL1')).toBe(false);
  });

  it('a dropped connection shows a banner; edits made meanwhile are kept and arrive once it returns', async () => {
    // Close every socket at the transport level, as a network drop would; clients reconnect by themselves.
    for (const s of realtime.io.of('/').sockets.values()) s.conn.close();
    await expect.poll(() => ben.getByTestId('collab-banner').getAttribute('data-state'), { timeout: 5000, interval: 20 }).toBe('offline');
    await setResistance(ben, 'R1', '33k');
    await expect.poll(() => ben.getByTestId('collab-banner').textContent(), { timeout: 15_000 }).toMatch(/Back online/);
    await ada.getByTestId('part-R1').click();
    await expect.poll(() => resistance(ada, 'R1').inputValue(), { timeout: 10_000 }).toBe('33k');
    // the avatars come back after the reconnect too
    await expect.poll(() => ada.locator('[data-testid=collab-peers] [data-login=ben-demo][data-here=true]').count(), { timeout: 10_000 }).toBe(1);
  });

  it('when one leaves, their avatar fades out for the other', async () => {
    await ben.goto(`${baseUrl}/projects`);
    await expect.poll(() => ada.locator('[data-testid=collab-peers] [data-login=ben-demo][data-here=true]').count(), { timeout: 10_000 }).toBe(0);
  });

  it('ran without script errors', () => {
    // The test cut the connections on purpose: Chromium logs a send attempted on a socket it has
    // already seen closing (socket.io learns of the close a moment later). Nothing else may appear.
    const dropped = /WebSocket is already in CLOSING or CLOSED state/;
    for (const p of problems) expect(p.errors.filter((e) => !dropped.test(e))).toEqual([]);
  });
});
