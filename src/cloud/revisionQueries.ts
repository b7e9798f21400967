// Named revisions of a project.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { queryKeys } from '../lib/queryKeys';
import { endpoints } from './endpoints';
import { storeProject } from './projectQueries';

export function useRevisions(id: string) {
  return useQuery({ queryKey: queryKeys.projects.revisions(id), queryFn: () => endpoints.listRevisions(id) });
}

export function useSaveRevision(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (label: string) => endpoints.saveRevision(id, label),
    onSuccess: () => qc.invalidateQueries({ queryKey: queryKeys.projects.revisions(id) }),
  });
}

export function useRestoreRevision(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ revId, baseVersion }: { revId: string; baseVersion?: number }) => endpoints.restoreRevision(id, revId, baseVersion),
    onSuccess: ({ project }) => {
      storeProject(qc, project);
      void qc.invalidateQueries({ queryKey: queryKeys.projects.revisions(id) });
    },
  });
}
