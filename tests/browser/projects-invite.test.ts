// Inviting a colleague in the browser: the owner invites by e-mail on the settings page, the link
// is read from the local SMTP sink, the colleague signs in from the invitation page and accepts.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { launchBrowser, signInPage, startBrowserServer, watchPage, type BrowserServer } from '../support/browser';

let server: BrowserServer;
let browser: Browser;
beforeAll(async () => {
  server = await startBrowserServer();
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.close();
});

describe('invitations in the browser', () => {
  it('owner invites, colleague signs in from the link and accepts with the invited role', async () => {
    const owner = await (await browser.newContext()).newPage();
    const ownerProblems = watchPage(owner);
    await signInPage(owner, server.baseUrl, 'ada-demo');
    await owner.getByLabel('Title').fill('Night light review (browser test)');
    await owner.getByRole('button', { name: 'Create project' }).click();
    await owner.waitForURL(/\/projects\/[0-9a-f-]{36}$/);
    const projectPath = new URL(owner.url()).pathname;
    await owner.goto(`${server.baseUrl}${projectPath}/settings`);
    const form = owner.getByRole('form', { name: 'Invite by e-mail' });
    await form.getByLabel('E-mail').fill('ben-demo@tapline.local');
    await form.getByLabel('Role').selectOption('viewer');
    await form.getByRole('button', { name: 'Send invitation' }).click();
    await expect.poll(() => owner.getByRole('status').textContent()).toMatch(/Invitation sent/);
    await expect.poll(() => owner.getByText('ben-demo@tapline.local').count()).toBe(1);

    const [mail] = await server.mailbox();
    const link = /https?:\/\/\S+\/invitations\/[A-Za-z0-9_-]+/.exec(mail.text)![0];
    expect(new URL(link).origin).toBe(server.baseUrl);

    const guest = await (await browser.newContext()).newPage();
    const guestProblems = watchPage(guest);
    await guest.goto(link);
    await expect.poll(() => guest.getByRole('heading', { level: 1 }).textContent()).toBe('Join “Night light review (browser test)”');
    await guest.getByRole('link', { name: 'Sign in to accept' }).click();
    // The fake provider's page: pick a demo person.
    await guest.locator('button[data-login="ben-demo"]').click();
    await guest.waitForURL(link);
    await guest.getByRole('button', { name: /^Accept as/ }).click();
    await guest.waitForURL(`${server.baseUrl}${projectPath}`);

    await guest.goto(`${server.baseUrl}/projects`);
    const row = guest.locator('tbody tr', { hasText: 'Night light review (browser test)' });
    await expect.poll(() => row.locator('td').nth(1).textContent()).toBe('viewer');

    // The owner sees the new member after a reload.
    await owner.reload();
    await expect.poll(() => owner.locator('[data-member="ben-demo"]').count()).toBe(1);
    expect(ownerProblems.errors).toEqual([]);
    expect(guestProblems.errors).toEqual([]);
  });
});
