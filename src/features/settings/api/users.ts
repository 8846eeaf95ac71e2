import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { UserCreate, UserRecord } from "@shared/schemas/users.ts";
import { api } from "@/lib/api-client.ts";
import { rootKeys } from "@/lib/query-keys.ts";

export const userKeys = { all: rootKeys.users, list: () => [...rootKeys.users] as const };

export const usersQuery = queryOptions({ queryKey: userKeys.list(), queryFn: () => api.get<{ items: UserRecord[] }>("/api/users").then((r) => r.items) });

export const useUsers = () => useQuery(usersQuery);

export function useCreateUser() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (b: UserCreate) => api.post<UserRecord>("/api/users", b), onSuccess: () => qc.invalidateQueries({ queryKey: userKeys.all }) });
}
