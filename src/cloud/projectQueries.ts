// Reads and writes of projects through TanStack Query, with optimistic updates where a change is
// safe to show at once (rename, delete, share switch) and rolled back when the server refuses.
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { queryKeys } from '../lib/queryKeys';
import { endpoints } from './endpoints';
import type { ProjectDetail, ProjectSummary } from './types';

export function useProjects(enabled = true) {
  return useQuery({ queryKey: queryKeys.projects.list(), queryFn: endpoints.listProjects, enabled });
}

export function useProject(id: string) {
  return useQuery({ queryKey: queryKeys.projects.detail(id), queryFn: ({ signal }) => endpoints.getProject(id, signal) });
}

/** Puts a fresh project answer into the cache and marks the list stale. */
export function storeProject(qc: QueryClient, p: ProjectDetail): void {
  qc.setQueryData(queryKeys.projects.detail(p.id), p);
  void qc.invalidateQueries({ queryKey: queryKeys.projects.list() });
}

export function useCreateProject() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: endpoints.createProject, onSuccess: (p) => storeProject(qc, p) });
}

export function useImportProject() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: ({ file, title }: { file: File; title?: string }) => endpoints.importProject(file, title), onSuccess: (p) => storeProject(qc, p) });
}

/** Optimistically patches the cached detail and list entry; returns a function that undoes it. */
async function optimistic(qc: QueryClient, id: string, detail: (p: ProjectDetail) => ProjectDetail, item: (p: ProjectSummary) => ProjectSummary | null) {
  await qc.cancelQueries({ queryKey: queryKeys.projects.detail(id) });
  await qc.cancelQueries({ queryKey: queryKeys.projects.list() });
  const prevDetail = qc.getQueryData<ProjectDetail>(queryKeys.projects.detail(id));
  const prevList = qc.getQueryData<ProjectSummary[]>(queryKeys.projects.list());
  if (prevDetail) qc.setQueryData(queryKeys.projects.detail(id), detail(prevDetail));
  if (prevList) qc.setQueryData(queryKeys.projects.list(), prevList.flatMap((p) => (p.id === id ? (item(p) ?? []) : [p])));
  return () => {
    qc.setQueryData(queryKeys.projects.detail(id), prevDetail);
    qc.setQueryData(queryKeys.projects.list(), prevList);
  };
}

export function useRenameProject(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ title, baseVersion }: { title: string; baseVersion: number }) => endpoints.patchProject(id, { title, baseVersion }),
    onMutate: ({ title }) => optimistic(qc, id, (p) => ({ ...p, title }), (p) => ({ ...p, title })),
    onError: (_e, _v, undo) => undo?.(),
    onSuccess: (p) => storeProject(qc, p),
  });
}

export function useDeleteProject(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => endpoints.deleteProject(id),
    onMutate: () => optimistic(qc, id, (p) => p, () => null),
    onError: (_e, _v, undo) => undo?.(),
    onSuccess: () => qc.removeQueries({ queryKey: queryKeys.projects.detail(id) }),
    onSettled: () => qc.invalidateQueries({ queryKey: queryKeys.projects.list() }),
  });
}

export function useSetShare(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (enabled: boolean) => endpoints.setShare(id, enabled),
    onMutate: (enabled) => optimistic(qc, id, (p) => ({ ...p, share: { enabled, token: enabled ? (p.share?.token ?? null) : null } }), (p) => p),
    onError: (_e, _v, undo) => undo?.(),
    onSuccess: (share) => {
      const p = qc.getQueryData<ProjectDetail>(queryKeys.projects.detail(id));
      if (p) qc.setQueryData(queryKeys.projects.detail(id), { ...p, share });
    },
  });
}
