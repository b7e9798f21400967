import type { ProjectRole } from '../db/schema';

export type { ProjectRole };

export const ROLES: readonly ProjectRole[] = ['viewer', 'editor', 'owner'];

const RANK: Record<ProjectRole, number> = { viewer: 1, editor: 2, owner: 3 };

/**
 * What each role may do, weakest first: viewers read and solve; editors also change the sheet and
 * its revisions; owners also manage members, invitations, the share link, rename and delete.
 */
export function hasRole(actual: ProjectRole, needed: ProjectRole): boolean {
  return RANK[actual] >= RANK[needed];
}

export function isRole(value: unknown): value is ProjectRole {
  return typeof value === 'string' && (ROLES as readonly string[]).includes(value);
}
