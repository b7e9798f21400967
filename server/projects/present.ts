import type { Project, ProjectRole } from '../db/schema';

/** `GET /api/projects/:id` shape. The share token is shown to owners only. */
export function presentProject(p: Project, role: ProjectRole, updatedBy: { id: number; login: string; name: string | null } | null) {
  return {
    id: p.id,
    title: p.title,
    role,
    version: p.version,
    sheet: p.sheet,
    createdAt: p.createdAt,
    updatedAt: p.updatedAt,
    updatedBy,
    ...(role === 'owner' ? { share: { enabled: p.shareToken !== null, token: p.shareToken } } : {}),
  };
}
