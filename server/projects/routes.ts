import { Router } from 'express';
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { projects } from '../db/schema';
import { HttpError } from '../http-errors';
import { requireUser, currentUser } from '../auth/current-user';
import { accessOf, type RequireProjectRole } from '../authz/project-access';
import { parseWith } from '../validation';
import { emptySheet, validateSheet } from '../sheets/validate-sheet';
import { CreateProjectBody, PatchProjectBody } from './schemas';
import { createProject, deleteProject, listProjects, updateProject, userSummary } from './repo';
import { presentProject } from './present';

/** `GET|POST /api/projects`, `GET|PATCH|DELETE /api/projects/:id`. */
export function projectsRouter(db: Db, requireProjectRole: RequireProjectRole): Router {
  const r = Router();

  r.get('/projects', requireUser, async (req, res) => {
    res.json({ projects: await listProjects(db, currentUser(req).id) });
  });

  r.post('/projects', requireUser, async (req, res) => {
    const body = parseWith(CreateProjectBody, req.body);
    const sheet = body.sheet === undefined ? emptySheet(body.title) : validateSheet(body.sheet);
    const user = currentUser(req);
    const p = await createProject(db, user.id, body.title, sheet);
    res.status(201).location(`/api/projects/${p.id}`).json(presentProject(p, 'owner', { id: user.id, login: user.login, name: user.name }));
  });

  r.get('/projects/:id', requireProjectRole('viewer'), async (req, res) => {
    const { project, role } = accessOf(req);
    res.json(presentProject(project, role, await userSummary(db, project.updatedBy)));
  });

  // Renaming is for owners, changing the sheet for editors: the role follows the body.
  const patchRole = (req: { body?: { title?: unknown } }) => (req.body?.title !== undefined ? 'owner' : 'editor');
  r.patch('/projects/:id', requireProjectRole(patchRole), async (req, res) => {
    const { project, role, userId } = accessOf(req);
    const body = parseWith(PatchProjectBody, req.body);
    const sheet = body.sheet === undefined ? undefined : validateSheet(body.sheet);
    const updated = await updateProject(db, project.id, body.baseVersion, { title: body.title, sheet }, userId);
    if (!updated) {
      const [now] = await db.select({ version: projects.version }).from(projects).where(eq(projects.id, project.id));
      throw new HttpError(
        409,
        'version_conflict',
        `The project changed since you loaded it (you sent version ${body.baseVersion}; it is now at version ${now?.version}). Reload it, then make your change again.`,
        'baseVersion',
        { currentVersion: now?.version },
      );
    }
    res.json(presentProject(updated, role, await userSummary(db, userId)));
  });

  r.delete('/projects/:id', requireProjectRole('owner'), async (req, res) => {
    await deleteProject(db, accessOf(req).project.id);
    res.status(204).end();
  });

  return r;
}
