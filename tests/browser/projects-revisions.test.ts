// Revisions in the browser: save a named revision on the settings page, change the sheet, view the
// revision read-only in the editor, restore it, and see the restore recorded in the list.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openScreen, signInPage, type Screen } from '../support/browser';

let screen: Screen;
let server: Screen['server'];
let page: Screen['page'];
let problems: Screen['problems'];

beforeAll(async () => {
  screen = await openScreen({ viewport: { width: 1400, height: 900 } });
  ({ server, page, problems } = screen);
  page.on('dialog', (d) => void d.accept()); // the restore and leave buttons ask first
});
afterAll(async () => {
  await screen?.close();
});

const api = (path: string) => page.evaluate(async (p) => (await fetch(p)).json(), path);

describe('revisions in the browser', () => {
  it('saves a revision, views it read-only, restores it, and lists the restore', async () => {
    await signInPage(page, server.baseUrl, 'chen-demo');
    await page.getByLabel('Title').fill('Zener reference (revision test)');
    await page.getByLabel('Start from').selectOption({ label: 'Example: 5.1 V Zener shunt reference' });
    await page.getByRole('button', { name: 'Create project' }).click();
    await page.waitForURL(/\/projects\/[0-9a-f-]{36}$/);
    const id = new URL(page.url()).pathname.split('/').pop()!;
    const original = (await api(`/api/projects/${id}`)).sheet;

    await page.goto(`${server.baseUrl}/projects/${id}/settings`);
    const form = page.getByRole('form', { name: 'Save a revision' });
    await form.getByLabel('Name of this state').fill('As drawn');
    await form.getByRole('button', { name: 'Save revision' }).click();
    await expect.poll(() => page.locator('[data-revision="As drawn"]').count()).toBe(1);

    // Change the sheet through the API, as another tab would.
    await page.evaluate(async ({ pid, sheet }) => {
      const { token } = await (await fetch('/api/csrf')).json();
      const changed = { ...sheet, title: 'Changed after the revision' };
      await fetch(`/api/projects/${pid}`, { method: 'PATCH', headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': token }, body: JSON.stringify({ sheet: changed, baseVersion: 1 }) });
    }, { pid: id, sheet: original });
    await page.reload();

    await page.locator('[data-revision="As drawn"]').getByRole('link', { name: 'View' }).click();
    await page.getByTestId('sheet-editor').waitFor();
    await expect.poll(() => page.getByText(/^Saved revision \(project version 1\), read-only/).count()).toBe(1);
    await expect.poll(() => page.getByTestId('save-status').textContent()).toMatch(/read-only/i);

    await page.goto(`${server.baseUrl}/projects/${id}/settings`);
    await page.locator('[data-revision="As drawn"]').getByRole('button', { name: 'Restore' }).click();
    await expect.poll(async () => (await api(`/api/projects/${id}`)).version).toBe(3);
    expect((await api(`/api/projects/${id}`)).sheet).toEqual(original);
    await expect.poll(() => page.locator('[data-revision="Restored “As drawn”"]').count()).toBe(1);
    await expect.poll(() => page.locator('[data-revision="Before restoring “As drawn”"]').count()).toBe(1);
    expect(problems.errors).toEqual([]);
  });
});
