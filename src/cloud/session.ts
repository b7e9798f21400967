// Who is signed in, and signing out.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { isSignedOut, resetCsrf } from '../lib/api';
import { queryKeys } from '../lib/queryKeys';
import { endpoints } from './endpoints';
import type { Me } from './types';

/** The signed-in user, or null when nobody is (a 401 is an answer here, not an error). */
export function useMe() {
  return useQuery({
    queryKey: queryKeys.me,
    queryFn: async (): Promise<Me | null> => {
      try {
        return await endpoints.me();
      } catch (e) {
        if (isSignedOut(e)) return null;
        throw e;
      }
    },
    staleTime: 60_000,
    retry: false,
  });
}

export function useAuthProviders() {
  return useQuery({ queryKey: queryKeys.providers, queryFn: endpoints.providers, staleTime: Infinity });
}

/** Where the sign-in button goes: the server route that starts OAuth, coming back to `returnTo`. */
export function signInHref(returnTo: string, login?: string): string {
  const q = new URLSearchParams({ returnTo });
  if (login) q.set('login', login);
  return `/auth/github?${q}`;
}

export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: endpoints.signOut,
    onSuccess: () => {
      resetCsrf();
      qc.setQueryData(queryKeys.me, null);
      qc.removeQueries({ queryKey: queryKeys.projects.all });
    },
  });
}
