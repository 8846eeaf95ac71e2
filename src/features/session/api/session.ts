import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { SessionUser, SignIn } from "@shared/schemas/auth.ts";
import { api } from "@/lib/api-client.ts";
import { rootKeys } from "@/lib/query-keys.ts";

export const sessionKeys = { me: rootKeys.me };

/** The signed-in user, or null when signed out. */
export const meQuery = queryOptions({
  queryKey: sessionKeys.me,
  queryFn: async (): Promise<SessionUser | null> => (await api.get<{ user: SessionUser | null }>("/api/session")).user,
  staleTime: 5 * 60_000,
});

export const useMe = () => useQuery(meQuery);

export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SignIn) => api.post<{ ok: true }>("/api/session", body),
    onSuccess: async () => {
      qc.clear();
      await qc.fetchQuery(meQuery);
    },
  });
}

export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.delete<void>("/api/session"),
    onSettled: () => {
      qc.clear();
      qc.setQueryData(meQuery.queryKey, null);
    },
  });
}
