import { Router, type Request } from 'express';
import { z } from 'zod';
import type { Db } from '../db/client';
import { HttpError } from '../http-errors';
import { accessOf, type RequireProjectRole } from '../authz/project-access';
import { parseWith } from '../validation';
import { MAX_INT4 } from '../projects/schemas';
import { changeMember, listMembers } from './repo';

const RoleBody = z.strictObject({ role: z.enum(['viewer', 'editor', 'owner']) });
// Plain decimal digits only ("0x1", "1e3" or " 1" are not user ids), within the int4 column.
const UserIdParam = z.string().regex(/^[1-9][0-9]{0,9}$/).transform(Number).pipe(z.number().max(MAX_INT4));

function targetUserId(req: Request): number {
  const r = UserIdParam.safeParse(req.params.userId);
  if (!r.success) throw new HttpError(404, 'member_not_found', 'No such member of this project.');
  return r.data;
}

function refuse(reason: 'not_member' | 'last_owner'): never {
  if (reason === 'not_member') throw new HttpError(404, 'member_not_found', 'No such member of this project.');
  throw new HttpError(409, 'last_owner', 'A project needs at least one owner: make someone else an owner first, or delete the project.');
}

/** `GET /api/projects/:id/members`, `PATCH|DELETE /api/projects/:id/members/:userId`. */
export function membersRouter(db: Db, requireProjectRole: RequireProjectRole): Router {
  const r = Router();

  r.get('/projects/:id/members', requireProjectRole('viewer'), async (req, res) => {
    res.json({ members: await listMembers(db, accessOf(req).project.id) });
  });

  r.patch('/projects/:id/members/:userId', requireProjectRole('owner'), async (req, res) => {
    const { role } = parseWith(RoleBody, req.body);
    const change = await changeMember(db, accessOf(req).project.id, targetUserId(req), role);
    if (!change.ok) refuse(change.reason);
    res.json(change.member);
  });

  // Any member may leave; removing someone else is for owners.
  const removeRole = (req: Request) => (String(req.user?.id) === req.params.userId ? 'viewer' : 'owner');
  r.delete('/projects/:id/members/:userId', requireProjectRole(removeRole), async (req, res) => {
    const change = await changeMember(db, accessOf(req).project.id, targetUserId(req), null);
    if (!change.ok) refuse(change.reason);
    res.status(204).end();
  });

  return r;
}
