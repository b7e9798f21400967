// Every TanStack Query key, in one place. Keys nest, so invalidating a prefix refreshes what is
// under it: `projects.detail(id)` also covers that project's members, invitations and revisions.

export const queryKeys = {
  me: ['me'] as const,
  providers: ['auth', 'providers'] as const,
  projects: {
    all: ['projects'] as const,
    list: () => ['projects', 'list'] as const,
    detail: (id: string) => ['projects', 'detail', id] as const,
    members: (id: string) => ['projects', 'detail', id, 'members'] as const,
    invitations: (id: string) => ['projects', 'detail', id, 'invitations'] as const,
    revisions: (id: string) => ['projects', 'detail', id, 'revisions'] as const,
    revision: (id: string, revId: string) => ['projects', 'detail', id, 'revisions', revId] as const,
  },
  invitation: (token: string) => ['invitation', token] as const,
  shared: (token: string) => ['shared', token] as const,
};
