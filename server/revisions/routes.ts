import { Router, type Request } from 'express';
import { z } from 'zod';
import type { Db } from '../db/client';
import { HttpError } from '../http-errors';
import { accessOf, type RequireProjectRole } from '../authz/project-access';
import { parseWith } from '../validation';
import { TitleSchema, VersionSchema } from '../projects/schemas';
import { presentProject } from '../projects/present';
import { userSummary } from '../projects/repo';
import { getRevision, listRevisions, restoreRevision, saveRevision } from './repo';

const LabelBody = z.strictObject({ label: TitleSchema });
const RestoreBody = z.strictObject({ baseVersion: VersionSchema.optional() });

function revisionId(req: Request): string {
  const r = z.uuid().safeParse(req.params.revId);
  if (!r.success) throw notFound();
  return r.data;
}
const notFound = () => new HttpError(404, 'revision_not_found', 'No such revision of this project.');

/** Named revisions: list, view (read-only), save, restore (recorded as revisions too). */
export function revisionsRouter(db: Db, requireProjectRole: RequireProjectRole): Router {
  const r = Router();

  r.get('/projects/:id/revisions', requireProjectRole('viewer'), async (req, res) => {
    res.json({ revisions: await listRevisions(db, accessOf(req).project.id) });
  });

  r.get('/projects/:id/revisions/:revId', requireProjectRole('viewer'), async (req, res) => {
    const rev = await getRevision(db, accessOf(req).project.id, revisionId(req));
    if (!rev) throw notFound();
    res.json(rev);
  });

  r.post('/projects/:id/revisions', requireProjectRole('editor'), async (req, res) => {
    const { label } = parseWith(LabelBody, req.body);
    const { project, userId } = accessOf(req);
    const rev = await saveRevision(db, project, label, userId);
    res.status(201).json({ id: rev.id, label: rev.label, kind: rev.kind, projectVersion: rev.projectVersion, createdAt: rev.createdAt });
  });

  r.post('/projects/:id/revisions/:revId/restore', requireProjectRole('editor'), async (req, res) => {
    const { baseVersion } = parseWith(RestoreBody, req.body);
    const { project, role, userId } = accessOf(req);
    const result = await restoreRevision(db, project.id, revisionId(req), userId, baseVersion);
    if (!result.ok && result.reason === 'not_found') throw notFound();
    if (!result.ok) {
      throw new HttpError(409, 'version_conflict', `The project changed since you loaded it (you sent version ${baseVersion}; it is now at version ${result.currentVersion}). Reload, then restore again.`, 'baseVersion', { currentVersion: result.currentVersion });
    }
    res.json({
      project: presentProject(result.project, role, await userSummary(db, userId)),
      revision: { id: result.revision.id, label: result.revision.label, kind: result.revision.kind, projectVersion: result.revision.projectVersion, restoredFrom: result.revision.restoredFrom },
    });
  });

  return r;
}
