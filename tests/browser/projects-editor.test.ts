// A cloud project in the schematic editor: /projects/:id opens the editor on the cloud sheet
// source; an edit autosaves through the API (PATCH with baseVersion) and survives a reload.
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openScreen, signInPage, watchPage, type Screen } from '../support/browser';

let screen: Screen;
let server: Screen['server'];
let browser: Screen['browser'];
let page: Screen['page'];
let problems: Screen['problems'];

beforeAll(async () => {
  screen = await openScreen({ viewport: { width: 1400, height: 900 } });
  ({ server, browser, page, problems } = screen);
});
afterAll(async () => {
  await screen?.close();
});

const projectJson = (id: string) => page.evaluate(async (pid) => (await fetch(`/api/projects/${pid}`)).json(), id);

describe('cloud project in the editor', () => {
  it('creates a project from an example, edits a value in the editor, reloads and sees the change', async () => {
    await signInPage(page, server.baseUrl, 'ada-demo');
    await page.getByLabel('Title').fill('Battery tap (editor test)');
    await page.getByLabel('Start from').selectOption({ label: 'Example: 12 V battery monitor tap' });
    await page.getByRole('button', { name: 'Create project' }).click();
    await page.waitForURL(/\/projects\/[0-9a-f-]{36}$/);
    const id = new URL(page.url()).pathname.split('/').pop()!;

    await page.getByTestId('sheet-editor').waitFor();
    await expect.poll(() => page.getByText(/^Cloud project · your role: owner/).count()).toBe(1);
    await page.getByTestId('part-R2').click();
    const field = page.locator('#param-R2-resistance');
    await field.fill('8k2');
    await field.press('Enter');
    // The editor autosaves after a pause; the server then holds version 2 with the new value.
    await expect.poll(async () => (await projectJson(id)).version, { timeout: 10_000 }).toBe(2);
    const saved = await projectJson(id);
    expect(saved.sheet.parts.find((p: { id: string }) => p.id === 'R2').params.resistance).toBe(8200);

    await page.reload();
    await page.getByTestId('sheet-editor').waitFor();
    await page.getByTestId('part-R2').click();
    await expect.poll(() => page.locator('#param-R2-resistance').inputValue()).toBe('8.2k');
  });

  it('opens a project read-only for a viewer', async () => {
    const owner = await (await browser.newContext({ viewport: { width: 1400, height: 900 } })).newPage();
    await signInPage(owner, server.baseUrl, 'ben-demo');
    const sheet = JSON.parse(fs.readFileSync(path.resolve(import.meta.dirname, '../../examples/battery-divider.json'), 'utf8'));
    const created = await owner.evaluate(async (sheetJson) => {
      const { token } = await (await fetch('/api/csrf')).json();
      const post = (url: string, body: unknown) => fetch(url, { method: 'POST', headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': token }, body: JSON.stringify(body) }).then((r) => r.json());
      const p = await post('/api/projects', { title: 'View only (editor test)', sheet: sheetJson });
      await post(`/api/projects/${p.id}/invitations`, { email: 'ada-demo@tapline.local', role: 'viewer' });
      return p.id as string;
    }, sheet);
    const [mail] = await server.mailbox();
    const token = /\/invitations\/([A-Za-z0-9_-]+)/.exec(mail.text)![1];
    await page.evaluate(async (t) => {
      const { token: csrf } = await (await fetch('/api/csrf')).json();
      await fetch(`/api/invitations/${t}/accept`, { method: 'POST', headers: { 'X-CSRF-Token': csrf } });
    }, token);
    await page.goto(`${server.baseUrl}/projects/${created}`);
    await page.getByTestId('sheet-editor').waitFor();
    await expect.poll(() => page.getByTestId('save-status').textContent()).toMatch(/read-only/i);
    await page.getByTestId('part-R2').click();
    expect(await page.locator('#param-R2-resistance').isDisabled()).toBe(true);
  });

  it('turns the share link on in settings; a signed-out visitor opens it read-only', async () => {
    await page.goto(`${server.baseUrl}/projects`);
    await page.getByRole('link', { name: 'Settings of Battery tap (editor test)' }).click();
    await page.getByLabel(/Anyone with the link can view/).check();
    const link = page.getByLabel('Share link', { exact: true });
    await expect.poll(() => link.inputValue()).toMatch(/\/sheets\/shared-[A-Za-z0-9_-]+$/);
    const url = await link.inputValue();

    const visitor = await (await browser.newContext({ viewport: { width: 1400, height: 900 } })).newPage();
    const visitorProblems = watchPage(visitor);
    await visitor.goto(url);
    await visitor.getByTestId('sheet-editor').waitFor();
    await expect.poll(() => visitor.getByText('Shared read-only link: you can solve this sheet but not change it.').count()).toBe(1);
    await visitor.getByTestId('part-R2').click();
    expect(await visitor.locator('#param-R2-resistance').inputValue()).toBe('8.2k');
    expect(await visitor.locator('#param-R2-resistance').isDisabled()).toBe(true);

    // Off again: the same link no longer opens.
    await page.getByLabel(/Anyone with the link can view/).uncheck();
    await expect.poll(() => page.getByLabel('Share link', { exact: true }).count()).toBe(0);
    await visitor.reload();
    await expect.poll(() => visitor.getByRole('alert').first().textContent()).toMatch(/share link does not work/);
    expect(visitorProblems.errors.filter((e) => !/status of 404/.test(e))).toEqual([]);
  });

  it('ran the editor (worker, canvas styles) without script errors or CSP refusals', () => {
    expect(problems.errors).toEqual([]);
  });
});
