// Cloud projects in a real browser: sign in through the fake provider, create a project from an
// example, change it, reload, see the change; user text is shown as text, never run as markup.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser, startBrowserServer, watchPage, type BrowserServer, type PageProblems } from '../support/browser';

let server: BrowserServer;
let browser: Browser;
let context: BrowserContext;
let page: Page;
let problems: PageProblems;

beforeAll(async () => {
  server = await startBrowserServer();
  browser = await launchBrowser();
  context = await browser.newContext();
  page = await context.newPage();
  problems = watchPage(page);
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

const UUID = /\/projects\/([0-9a-f-]{36})$/;

describe('cloud projects in the browser', () => {
  it('signs in through the fake provider from the sign-in page', async () => {
    await page.goto(`${server.baseUrl}/sign-in`);
    await page.getByRole('link', { name: 'ada-demo' }).click();
    await page.waitForURL(`${server.baseUrl}/projects`);
    await expect.poll(() => page.getByTestId('signed-in-as').textContent()).toBe('Ada Okafor (demo)');
  });

  it('creates a project from an example, changes it, reloads and sees the change', async () => {
    await page.getByLabel('Title').fill('Probe bench (browser test)');
    await page.getByLabel('Start from').selectOption({ label: 'Example: 12 V battery monitor tap' });
    await page.getByRole('button', { name: 'Create project' }).click();
    await page.waitForURL(UUID);
    const id = UUID.exec(page.url())![1];

    // The example's sheet is on the server now.
    const stored = await page.evaluate(async (pid) => (await fetch(`/api/projects/${pid}`)).json(), id);
    expect(stored.sheet.title).toBe('12 V battery monitor tap');
    expect(stored.role).toBe('owner');

    // Change it through the settings page (rename), then reload: the change came from the server.
    await page.getByRole('link', { name: 'Members, revisions and sharing' }).click();
    await page.waitForURL(`${server.baseUrl}/projects/${id}/settings`);
    await page.getByLabel('Project title', { exact: true }).fill('Probe bench, renamed');
    await page.getByRole('button', { name: 'Rename' }).click();
    await expect.poll(async () => (await page.evaluate(async (pid) => (await fetch(`/api/projects/${pid}`)).json(), id)).title).toBe('Probe bench, renamed');
    await page.reload();
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Probe bench, renamed: settings');

    await page.goto(`${server.baseUrl}/projects`);
    const row = page.locator(`tr[data-project-id="${id}"]`);
    await expect.poll(() => row.locator('td').first().textContent()).toBe('Probe bench, renamed');
    await expect.poll(() => row.locator('td').nth(1).textContent()).toBe('owner');
  });

  it('shows a title with a script payload as text and never runs it', async () => {
    const payload = '<img src=x onerror="window.__pwned=1"><script>window.__pwned=2</script>';
    await page.goto(`${server.baseUrl}/projects`);
    await page.getByLabel('Title').fill(payload);
    await page.getByRole('button', { name: 'Create project' }).click();
    await page.waitForURL(UUID);
    await page.goto(`${server.baseUrl}/projects`);
    const cell = page.getByRole('link', { name: payload, exact: true });
    await expect.poll(() => cell.textContent()).toBe(payload);
    expect(await page.locator('tbody img').count()).toBe(0);
    expect(await page.evaluate(() => (window as unknown as { __pwned?: number }).__pwned)).toBeUndefined();
  });

  it('searches and sorts the projects table', async () => {
    await page.goto(`${server.baseUrl}/projects`);
    await page.getByLabel('Search projects').fill('renamed');
    await expect.poll(() => page.locator('tbody tr').count()).toBe(1);
    await page.getByLabel('Search projects').fill('');
    await page.getByRole('button', { name: /^Title/ }).click();
    const titles = await page.locator('tbody tr td:first-child').allTextContents();
    expect(titles).toEqual([...titles].sort((a, b) => a.localeCompare(b)));
  });

  it('ran without script errors or content-security-policy refusals', () => {
    expect(problems.errors).toEqual([]);
  });
});
