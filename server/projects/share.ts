import { Router } from 'express';
import { randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { z } from 'zod';
import type { Db } from '../db/client';
import { projects } from '../db/schema';
import { HttpError } from '../http-errors';
import { accessOf, type RequireProjectRole } from '../authz/project-access';
import { parseWith } from '../validation';

const ShareBody = z.strictObject({ enabled: z.boolean() });
const TOKEN = /^[A-Za-z0-9_-]{20,100}$/;

/**
 * The read-only share link: owners turn it on (`PUT /api/projects/:id/share {enabled:true}`) and
 * off; turning it off forgets the token, so old links stop working. Anyone holding the link can
 * read the sheet at `GET /api/shared/:token` without signing in, and nothing else.
 */
export function shareRouter(db: Db, requireProjectRole: RequireProjectRole): Router {
  const r = Router();

  r.put('/projects/:id/share', requireProjectRole('owner'), async (req, res) => {
    const { enabled } = parseWith(ShareBody, req.body);
    const { project } = accessOf(req);
    const token = enabled ? (project.shareToken ?? randomBytes(24).toString('base64url')) : null;
    await db.update(projects).set({ shareToken: token }).where(eq(projects.id, project.id));
    res.json({ enabled, token });
  });

  r.get('/shared/:token', async (req, res) => {
    const t = req.params.token;
    const [p] = TOKEN.test(t) ? await db.select().from(projects).where(eq(projects.shareToken, t)) : [];
    if (!p) throw new HttpError(404, 'share_not_found', 'This share link does not work (any more). Ask the project owner for a current one.');
    res.setHeader('Cache-Control', 'no-store');
    res.json({ title: p.title, sheet: p.sheet, version: p.version, updatedAt: p.updatedAt, readOnly: true });
  });

  return r;
}
