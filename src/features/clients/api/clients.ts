import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { ClientCreate, ClientRecord } from "@shared/schemas/clients.ts";
import { api } from "@/lib/api-client.ts";

export const clientListQuery = queryOptions({
  queryKey: ["clients", "list"],
  queryFn: () => api.get<{ items: ClientRecord[] }>("/api/clients").then((r) => r.items),
});
export const clientQuery = (id: string) =>
  queryOptions({ queryKey: ["clients", "one", id], queryFn: () => api.get<ClientRecord>(`/api/clients/${encodeURIComponent(id)}`) });

export const useClients = (enabled = true) => useQuery({ ...clientListQuery, enabled });
export const useClient = (id: string) => useQuery(clientQuery(id));

export function useSaveClient(id?: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: ClientCreate) =>
      id ? api.put<ClientRecord>(`/api/clients/${encodeURIComponent(id)}`, body) : api.post<ClientRecord>("/api/clients", body),
    onSuccess: (c) => {
      qc.invalidateQueries({ queryKey: ["clients"] });
      qc.invalidateQueries({ queryKey: ["objects"] });
      qc.setQueryData(clientQuery(c.id).queryKey, c);
    },
  });
}
