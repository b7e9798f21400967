// Route ids of cloud sheets, as they appear in /projects/:id and /sheets/:id.

const UUID = '[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}';
const PROJECT = new RegExp(`^(?:cloud-)?(${UUID})$`, 'i');
const REVISION = new RegExp(`^rev-(${UUID})_(${UUID})$`, 'i');
const SHARED = /^shared-([A-Za-z0-9_-]{20,100})$/;

export type CloudRouteId =
  | { kind: 'project'; projectId: string }
  | { kind: 'revision'; projectId: string; revId: string }
  | { kind: 'shared'; token: string };

/** Reads a route id; null when it is not a cloud sheet's. */
export function parseCloudRouteId(id: string): CloudRouteId | null {
  let m = PROJECT.exec(id);
  if (m) return { kind: 'project', projectId: m[1].toLowerCase() };
  m = REVISION.exec(id);
  if (m) return { kind: 'revision', projectId: m[1].toLowerCase(), revId: m[2].toLowerCase() };
  m = SHARED.exec(id);
  if (m) return { kind: 'shared', token: m[1] };
  return null;
}

export const cloudPaths = {
  project: (id: string) => `/projects/${id}`,
  settings: (id: string) => `/projects/${id}/settings`,
  revision: (id: string, revId: string) => `/sheets/rev-${id}_${revId}`,
  shared: (token: string) => `/sheets/shared-${token}`,
};
