import { Router } from 'express';
import { desc } from 'drizzle-orm';
import type { Db } from '../db/client';
import { devMail } from '../db/schema';
import { escapeHtml, page } from '../html';

/**
 * `/dev/mailbox` (HTML) and `/dev/mailbox.json`: what the local SMTP sink received, newest first.
 * Mounted only while the sink is in use. Bodies are shown as text; links are the only markup.
 */
export function mailboxRouter(db: Db): Router {
  const r = Router();
  const latest = () => db.select().from(devMail).orderBy(desc(devMail.id)).limit(100);

  r.get('/mailbox.json', async (_req, res) => {
    res.json({ messages: await latest() });
  });

  r.get('/mailbox', async (_req, res) => {
    const rows = await latest();
    const linkify = (text: string) => escapeHtml(text).replace(/https?:\/\/[^\s<]+/g, (u) => `<a href="${u}">${u}</a>`);
    const items = rows
      .map((m) => `<tr><td>${escapeHtml(m.receivedAt.toISOString())}</td><td>${escapeHtml(m.rcptTo.join(', '))}</td>
<td><strong>${escapeHtml(m.subject)}</strong><pre>${linkify(m.text)}</pre></td></tr>`)
      .join('');
    res.setHeader('Cache-Control', 'no-store');
    res.type('html').send(page('Development mailbox', `<h1>Development mailbox</h1>
<p class="note">No SMTP_HOST is configured, so e-mail goes to this local sink instead of being delivered. Newest first.</p>
${rows.length ? `<table><thead><tr><th>Received</th><th>To</th><th>Message</th></tr></thead><tbody>${items}</tbody></table>` : '<p>No messages yet.</p>'}`));
  });
  return r;
}
