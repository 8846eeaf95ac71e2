import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { ClientCreate, ClientRecord } from "@shared/schemas/clients.ts";
import { api } from "@/lib/api-client.ts";
import { rootKeys } from "@/lib/query-keys.ts";

export const clientKeys = {
  all: rootKeys.clients,
  list: () => [...rootKeys.clients, "list"] as const,
  one: (id: string) => [...rootKeys.clients, "one", id] as const,
};

export const clientListQuery = queryOptions({
  queryKey: clientKeys.list(),
  queryFn: () => api.get<{ items: ClientRecord[] }>("/api/clients").then((r) => r.items),
});
export const clientQuery = (id: string) => queryOptions({ queryKey: clientKeys.one(id), queryFn: () => api.get<ClientRecord>(`/api/clients/${encodeURIComponent(id)}`) });

export const useClients = (enabled = true) => useQuery({ ...clientListQuery, enabled });
export const useClient = (id: string) => useQuery(clientQuery(id));

export function useSaveClient(id?: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: ClientCreate) => (id ? api.put<ClientRecord>(`/api/clients/${encodeURIComponent(id)}`, body) : api.post<ClientRecord>("/api/clients", body)),
    onSuccess: (c) => {
      qc.invalidateQueries({ queryKey: clientKeys.all });
      // Objects show their owner's name.
      qc.invalidateQueries({ queryKey: rootKeys.objects });
      qc.setQueryData(clientQuery(c.id).queryKey, c);
    },
  });
}
