// Accessibility scan of every page with axe-core (the rules of WCAG 2.x A and AA plus axe's best
// practices, as axe-core ships them), in the light and the dark theme: home, sign-in, projects
// (signed in), project settings, the editor on an example and on a cloud project, the design
// report of each, an invitation, not-found, the development mailbox and the fake provider's
// authorize page. No serious or critical violation may remain; the others are printed.
// axe is evaluated through the DevTools protocol (page.evaluate), which the page's content
// security policy does not govern, so the policy under test stays the production one.
import fs from 'node:fs';
import { createRequire } from 'node:module';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser, signInPage, startBrowserServer, watchPage, type BrowserServer } from '../support/browser';

const axeSource = fs.readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');

interface Violation { id: string; impact: string | null; help: string; nodes: { target: string[]; failureSummary?: string }[] }

let server: BrowserServer;
let browser: Browser;
let projectId: string;
let inviteToken: string;

beforeAll(async () => {
  server = await startBrowserServer();
  browser = await launchBrowser();
  // A cloud project with a member invitation pending, made through the API as ada.
  const ctx = await browser.newContext();
  const page = await ctx.newPage();
  await signInPage(page, server.baseUrl, 'ada-demo');
  const sheet = JSON.parse(fs.readFileSync(new URL('../../examples/battery-divider.json', import.meta.url), 'utf8'));
  projectId = await page.evaluate(async (s) => {
    const { token } = await (await fetch('/api/csrf')).json();
    const post = async (path: string, body: unknown) => (await fetch(path, { method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': token }, body: JSON.stringify(body) })).json();
    const p = await post('/api/projects', { title: 'Accessible tap (a11y test)', sheet: s });
    await post(`/api/projects/${p.id}/invitations`, { email: 'reviewer@example.test', role: 'viewer' });
    await post(`/api/projects/${p.id}/revisions`, { label: 'First look' });
    return p.id as string;
  }, sheet);
  const [mail] = await server.mailbox();
  inviteToken = /\/invitations\/([A-Za-z0-9_-]+)/.exec(mail.text)![1];
  await ctx.close();
});

afterAll(async () => {
  await browser?.close();
  await server?.close();
});

/** Runs axe on the page as it is now; returns its violations. */
async function scan(page: Page): Promise<Violation[]> {
  await page.evaluate(axeSource);
  return page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run(ctx: Document, opts: object): Promise<{ violations: Violation[] }> } }).axe;
    const r = await axe.run(document, { resultTypes: ['violations'] });
    return r.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.slice(0, 5).map((n) => ({ target: n.target, failureSummary: n.failureSummary })) }));
  });
}

interface PageCase {
  name: string;
  path: () => string;
  signedIn: boolean;
  /** what shows that the page has finished loading */
  ready: (page: Page) => Promise<unknown>;
}

const heading = (page: Page) => page.getByRole('heading', { level: 1 }).first().waitFor();
const editor = (page: Page) => page.getByTestId('sheet-editor').waitFor();

const pages: PageCase[] = [
  { name: 'home', path: () => '/', signedIn: false, ready: heading },
  { name: 'sign-in', path: () => '/sign-in', signedIn: false, ready: heading },
  { name: 'projects (signed in)', path: () => '/projects', signedIn: true, ready: (p) => p.getByTestId('signed-in-as').waitFor() },
  { name: 'project settings', path: () => `/projects/${projectId}/settings`, signedIn: true, ready: heading },
  { name: 'editor, example', path: () => '/sheets/example-battery-divider', signedIn: false, ready: editor },
  { name: 'editor, cloud project', path: () => `/projects/${projectId}`, signedIn: true, ready: editor },
  { name: 'report, example', path: () => '/sheets/example-battery-divider/report', signedIn: false, ready: heading },
  { name: 'report, cloud project', path: () => `/projects/${projectId}/report`, signedIn: true, ready: heading },
  { name: 'invitation', path: () => `/invitations/${inviteToken}`, signedIn: false, ready: heading },
  { name: 'not found', path: () => '/no/such/page', signedIn: false, ready: heading },
  { name: 'dev mailbox', path: () => '/dev/mailbox', signedIn: false, ready: heading },
  { name: 'fake provider authorize', path: () => '/fake-oauth/authorize?client_id=tapline-fake-client&redirect_uri=%2Fauth%2Fgithub%2Fcallback&state=a11y', signedIn: false, ready: heading },
];

const found: Record<string, Violation[]> = {};

describe.each(['light', 'dark'] as const)('%s theme', (scheme) => {
  let signedOut: BrowserContext;
  let signedIn: BrowserContext;
  beforeAll(async () => {
    signedOut = await browser.newContext({ colorScheme: scheme, viewport: { width: 1280, height: 860 } });
    signedIn = await browser.newContext({ colorScheme: scheme, viewport: { width: 1280, height: 860 } });
    await signInPage(await signedIn.newPage(), server.baseUrl, 'ada-demo');
  });
  afterAll(async () => {
    await signedOut?.close();
    await signedIn?.close();
  });

  it.each(pages)('$name has no serious or critical violation', async (pc) => {
    const page = await (pc.signedIn ? signedIn : signedOut).newPage();
    const problems = watchPage(page);
    await page.goto(`${server.baseUrl}${pc.path()}`);
    await pc.ready(page);
    // Let late content (solver results, lists from the API) arrive before scanning.
    await page.waitForLoadState('load');
    await page.waitForTimeout(500);
    const violations = await scan(page);
    found[`${scheme}: ${pc.name}`] = violations;
    const blocking = violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
    expect(blocking, `${pc.name} (${scheme}):\n${JSON.stringify(blocking, null, 2)}`).toEqual([]);
    expect(problems.errors, 'no page errors while scanning').toEqual([]);
    await page.close();
  });
});

afterAll(() => {
  // The remaining (moderate, minor) findings, for docs/quality-gates.md.
  const lines = Object.entries(found).flatMap(([where, vs]) => vs.map((v) => `${where}: ${v.impact} ${v.id} (${v.nodes.length} nodes) — ${v.help}`));
  console.log(`axe: ${Object.keys(found).length} scans, ${lines.length} non-blocking findings${lines.length ? `:\n${lines.join('\n')}` : ''}`);
});
