import { Router, type Request, type RequestHandler } from 'express';
import { z } from 'zod';
import type { Config } from '../config';
import type { Db } from '../db/client';
import { HttpError } from '../http-errors';
import { currentUser, requireUser } from '../auth/current-user';
import { accessOf, type RequireProjectRole } from '../authz/project-access';
import type { Mail } from '../mail/mailer';
import { parseWith } from '../validation';
import { invitationEmail } from './email';
import { acceptInvitation, deleteInvitation, describeInvitation, insertInvitation, listPendingInvitations } from './repo';
import { newInvitationToken } from './tokens';

const InviteBody = z.strictObject({
  email: z.string().trim().toLowerCase().pipe(z.email({ error: 'must be an e-mail address' })).refine((e) => e.length <= 254, 'is too long'),
  role: z.enum(['viewer', 'editor', 'owner']),
});

const TOKEN = /^[A-Za-z0-9_-]{20,100}$/;

function tokenParam(req: Request): string {
  const t = req.params.token;
  if (typeof t !== 'string' || !TOKEN.test(t)) throw new HttpError(404, 'invitation_not_found', 'This invitation link is not valid. Check that you copied all of it.');
  return t;
}

/** Where e-mailed links point: PUBLIC_URL when set (always in production), else this request's origin. */
function appOrigin(config: Config, req: Request): string {
  return config.PUBLIC_URL ? config.PUBLIC_URL.replace(/\/$/, '') : `${req.protocol}://${req.get('host')}`;
}

interface InvitationDeps {
  config: Config;
  db: Db;
  mail: Mail | null;
  requireProjectRole: RequireProjectRole;
  limiter: RequestHandler;
}

/** Project invitations (owners) and the accept link (`/api/invitations/:token`). */
export function invitationsRouter({ config, db, mail, requireProjectRole, limiter }: InvitationDeps): Router {
  const r = Router();

  r.get('/projects/:id/invitations', requireProjectRole('owner'), async (req, res) => {
    res.json({ invitations: await listPendingInvitations(db, accessOf(req).project.id) });
  });

  r.post('/projects/:id/invitations', requireProjectRole('owner'), limiter, async (req, res) => {
    const body = parseWith(InviteBody, req.body);
    if (!mail) throw new HttpError(503, 'mail_unavailable', 'E-mail is not configured on this server (SMTP_HOST), so invitations cannot be sent.');
    const { project, userId } = accessOf(req);
    const user = currentUser(req);
    const { token, hash } = newInvitationToken();
    const expiresAt = new Date(Date.now() + config.INVITATION_DAYS * 24 * 3600 * 1000);
    const inv = await insertInvitation(db, { projectId: project.id, email: body.email, role: body.role, tokenHash: hash, invitedBy: userId, expiresAt });
    const link = `${appOrigin(config, req)}/invitations/${token}`;
    try {
      await mail.send(invitationEmail({ to: body.email, projectTitle: project.title, inviter: user.name ?? user.login, role: body.role, link, expiresAt }));
    } catch (err) {
      await deleteInvitation(db, project.id, inv.id);
      console.error('invitation e-mail failed:', (err as Error).message);
      throw new HttpError(502, 'mail_failed', 'The invitation e-mail could not be sent; nothing was saved. Check the address, or try again later.');
    }
    res.status(201).json({ id: inv.id, email: inv.email, role: inv.role, createdAt: inv.createdAt, expiresAt: inv.expiresAt });
  });

  r.delete('/projects/:id/invitations/:invitationId', requireProjectRole('owner'), async (req, res) => {
    const ok = z.uuid().safeParse(req.params.invitationId).success && (await deleteInvitation(db, accessOf(req).project.id, req.params.invitationId as string));
    if (!ok) throw new HttpError(404, 'invitation_not_found', 'No such invitation on this project.');
    res.status(204).end();
  });

  r.get('/invitations/:token', async (req, res) => {
    const info = await describeInvitation(db, tokenParam(req));
    if (!info) throw new HttpError(404, 'invitation_not_found', 'This invitation link is not valid. Check that you copied all of it.');
    // The project id stays out: the link's holder learns what they were invited to, nothing more.
    const { projectId: _p, ...shown } = info;
    res.json(shown);
  });

  r.post('/invitations/:token/accept', requireUser, async (req, res) => {
    const result = await acceptInvitation(db, tokenParam(req), currentUser(req).id);
    if (result.ok) {
      res.json({ projectId: result.projectId, role: result.role });
      return;
    }
    if (result.reason === 'unknown') throw new HttpError(404, 'invitation_not_found', 'This invitation link is not valid. Check that you copied all of it.');
    if (result.reason === 'accepted') throw new HttpError(410, 'invitation_used', 'This invitation has already been used. Ask the project owner for a new one if you still need access.');
    throw new HttpError(410, 'invitation_expired', 'This invitation has expired. Ask the project owner to invite you again.');
  });

  return r;
}
