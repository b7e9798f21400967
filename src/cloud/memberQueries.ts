// Members and invitations of a project.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { queryKeys } from '../lib/queryKeys';
import { endpoints } from './endpoints';
import type { Member, PendingInvitation, Role } from './types';

export function useMembers(id: string) {
  return useQuery({ queryKey: queryKeys.projects.members(id), queryFn: () => endpoints.listMembers(id) });
}

export function useSetMemberRole(id: string) {
  const qc = useQueryClient();
  const key = queryKeys.projects.members(id);
  return useMutation({
    mutationFn: ({ userId, role }: { userId: number; role: Role }) => endpoints.setMemberRole(id, userId, role),
    onMutate: async ({ userId, role }) => {
      await qc.cancelQueries({ queryKey: key });
      const prev = qc.getQueryData<Member[]>(key);
      qc.setQueryData<Member[]>(key, (ms) => ms?.map((m) => (m.userId === userId ? { ...m, role } : m)));
      return prev;
    },
    onError: (_e, _v, prev) => qc.setQueryData(key, prev),
    // Your own role may have changed: refresh the project too.
    onSettled: () => qc.invalidateQueries({ queryKey: queryKeys.projects.detail(id) }),
  });
}

export function useRemoveMember(id: string) {
  const qc = useQueryClient();
  const key = queryKeys.projects.members(id);
  return useMutation({
    mutationFn: (userId: number) => endpoints.removeMember(id, userId),
    onMutate: async (userId) => {
      await qc.cancelQueries({ queryKey: key });
      const prev = qc.getQueryData<Member[]>(key);
      qc.setQueryData<Member[]>(key, (ms) => ms?.filter((m) => m.userId !== userId));
      return prev;
    },
    onError: (_e, _v, prev) => qc.setQueryData(key, prev),
    onSettled: () => qc.invalidateQueries({ queryKey: queryKeys.projects.all }),
  });
}

export function useInvitations(id: string, enabled: boolean) {
  return useQuery({ queryKey: queryKeys.projects.invitations(id), queryFn: () => endpoints.listInvitations(id), enabled });
}

export function useInvite(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { email: string; role: Role }) => endpoints.invite(id, body),
    onSuccess: (inv) => qc.setQueryData<PendingInvitation[]>(queryKeys.projects.invitations(id), (list) => [inv, ...(list ?? [])]),
  });
}

export function useRevokeInvitation(id: string) {
  const qc = useQueryClient();
  const key = queryKeys.projects.invitations(id);
  return useMutation({
    mutationFn: (invitationId: string) => endpoints.revokeInvitation(id, invitationId),
    onMutate: async (invitationId) => {
      await qc.cancelQueries({ queryKey: key });
      const prev = qc.getQueryData<PendingInvitation[]>(key);
      qc.setQueryData<PendingInvitation[]>(key, (l) => l?.filter((i) => i.id !== invitationId));
      return prev;
    },
    onError: (_e, _v, prev) => qc.setQueryData(key, prev),
  });
}

export function useInvitationInfo(token: string) {
  return useQuery({ queryKey: queryKeys.invitation(token), queryFn: () => endpoints.getInvitation(token), retry: false });
}

export function useAcceptInvitation(token: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => endpoints.acceptInvitation(token),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: queryKeys.projects.all });
      void qc.invalidateQueries({ queryKey: queryKeys.invitation(token) });
    },
  });
}
