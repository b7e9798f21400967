// Typed calls for each route of the service contract.
import { api } from '../lib/api';
import type { InvitationInfo, Me, Member, PendingInvitation, ProjectDetail, ProjectSummary, RevisionDetail, RevisionSummary, Role, SharedSheet } from './types';

const p = (id: string) => `/api/projects/${encodeURIComponent(id)}`;

export const endpoints = {
  me: () => api<Me>('/api/me'),
  providers: () => api<{ mode: 'github' | 'fake'; demoLogins: string[] }>('/api/auth/providers'),
  signOut: () => api<void>('/auth/logout', { method: 'POST' }),

  listProjects: () => api<{ projects: ProjectSummary[] }>('/api/projects').then((r) => r.projects),
  getProject: (id: string, signal?: AbortSignal) => api<ProjectDetail>(p(id), { signal }),
  createProject: (body: { title: string; sheet?: unknown }) => api<ProjectDetail>('/api/projects', { method: 'POST', json: body }),
  patchProject: (id: string, body: { title?: string; sheet?: unknown; baseVersion: number }) => api<ProjectDetail>(p(id), { method: 'PATCH', json: body }),
  deleteProject: (id: string) => api<void>(p(id), { method: 'DELETE' }),
  importProject: (file: File, title?: string) => {
    const form = new FormData();
    form.append('file', file);
    if (title) form.append('title', title);
    return api<ProjectDetail>('/api/projects/import', { method: 'POST', form });
  },
  /** A plain link target: the browser downloads the file with the session cookie. */
  exportUrl: (id: string) => `${p(id)}/export`,
  setShare: (id: string, enabled: boolean) => api<{ enabled: boolean; token: string | null }>(`${p(id)}/share`, { method: 'PUT', json: { enabled } }),
  getShared: (token: string, signal?: AbortSignal) => api<SharedSheet>(`/api/shared/${encodeURIComponent(token)}`, { signal }),

  listMembers: (id: string) => api<{ members: Member[] }>(`${p(id)}/members`).then((r) => r.members),
  setMemberRole: (id: string, userId: number, role: Role) => api<Member>(`${p(id)}/members/${userId}`, { method: 'PATCH', json: { role } }),
  removeMember: (id: string, userId: number) => api<void>(`${p(id)}/members/${userId}`, { method: 'DELETE' }),

  listInvitations: (id: string) => api<{ invitations: PendingInvitation[] }>(`${p(id)}/invitations`).then((r) => r.invitations),
  invite: (id: string, body: { email: string; role: Role }) => api<PendingInvitation>(`${p(id)}/invitations`, { method: 'POST', json: body }),
  revokeInvitation: (id: string, invitationId: string) => api<void>(`${p(id)}/invitations/${invitationId}`, { method: 'DELETE' }),
  getInvitation: (token: string) => api<InvitationInfo>(`/api/invitations/${encodeURIComponent(token)}`),
  acceptInvitation: (token: string) => api<{ projectId: string; role: Role }>(`/api/invitations/${encodeURIComponent(token)}/accept`, { method: 'POST' }),

  listRevisions: (id: string) => api<{ revisions: RevisionSummary[] }>(`${p(id)}/revisions`).then((r) => r.revisions),
  getRevision: (id: string, revId: string, signal?: AbortSignal) => api<RevisionDetail>(`${p(id)}/revisions/${revId}`, { signal }),
  saveRevision: (id: string, label: string) => api<RevisionSummary>(`${p(id)}/revisions`, { method: 'POST', json: { label } }),
  restoreRevision: (id: string, revId: string, baseVersion?: number) =>
    api<{ project: ProjectDetail; revision: RevisionSummary }>(`${p(id)}/revisions/${revId}/restore`, { method: 'POST', json: baseVersion === undefined ? {} : { baseVersion } }),
};
