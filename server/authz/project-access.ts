import type { Request, RequestHandler } from 'express';
import { and, eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { memberships, projects, type Project } from '../db/schema';
import { HttpError } from '../http-errors';
import { hasRole, type ProjectRole } from './roles';

export interface ProjectAccess {
  project: Project;
  role: ProjectRole;
  userId: number;
}

declare module 'express-serve-static-core' {
  interface Request {
    projectAccess?: ProjectAccess;
  }
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The role a route needs: fixed, or chosen from the request (PATCH with a title needs owner). */
export type RoleNeeded = ProjectRole | ((req: Request) => ProjectRole);

export function notFoundProject(): HttpError {
  return new HttpError(404, 'project_not_found', 'No such project, or it is not shared with you. Check the link, or ask its owner to invite you.');
}

/**
 * The one authorisation check for every `/api/projects/:id/...` route: 401 when signed out, 404 for
 * a non-member (private projects give no hint that they exist), 403 for a member whose role is
 * too weak. On success `req.projectAccess` holds the project row and the caller's role.
 */
export function projectAccessGuard(db: Db) {
  return function requireProjectRole(needed: RoleNeeded): RequestHandler {
    return async (req, _res, next) => {
      if (!req.user) throw new HttpError(401, 'signed_out', 'You are not signed in. Sign in and try again.');
      const id = req.params.id;
      if (typeof id !== 'string' || !UUID.test(id)) throw notFoundProject();
      const [row] = await db
        .select({ project: projects, role: memberships.role })
        .from(projects)
        .innerJoin(memberships, and(eq(memberships.projectId, projects.id), eq(memberships.userId, req.user.id)))
        .where(eq(projects.id, id));
      if (!row) throw notFoundProject();
      const role = typeof needed === 'function' ? needed(req) : needed;
      if (!hasRole(row.role, role)) {
        throw new HttpError(403, 'forbidden', `This needs the ${role} role on the project; you are a ${row.role}. Ask an owner to change your role.`);
      }
      req.projectAccess = { project: row.project, role: row.role, userId: req.user.id };
      next();
    };
  };
}

export type RequireProjectRole = ReturnType<typeof projectAccessGuard>;

/** The access `requireProjectRole` established for this request. */
export function accessOf(req: Request): ProjectAccess {
  if (!req.projectAccess) throw new Error('route is missing requireProjectRole()');
  return req.projectAccess;
}
