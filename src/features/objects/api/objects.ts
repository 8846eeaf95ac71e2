import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { ObjectCreate, ObjectListItem, ObjectListQuery, ObjectRecord, ObjectUpdate } from "@shared/schemas/objects.ts";
import type { Page } from "@shared/schemas/common.ts";
import { api, qs } from "@/lib/api-client.ts";
import { objectHistoryKey, rootKeys } from "@/lib/query-keys.ts";

export const objectKeys = {
  all: rootKeys.objects,
  lists: () => [...rootKeys.objects, "list"] as const,
  list: (params: ObjectListParams) => [...rootKeys.objects, "list", params] as const,
  one: (id: string) => [...rootKeys.objects, "one", id] as const,
  nextNumber: () => [...rootKeys.objects, "next-number"] as const,
};

export type ObjectListParams = Partial<ObjectListQuery>;

export const objectListQuery = (params: ObjectListParams) =>
  queryOptions({
    queryKey: objectKeys.list(params),
    queryFn: () => api.get<Page<ObjectListItem>>(`/api/objects${qs(params)}`),
    placeholderData: keepPreviousData,
  });

/** One object; an id not known yet ("") asks for nothing (it would read the register instead). */
export const objectQuery = (id: string) =>
  queryOptions({ queryKey: objectKeys.one(id), queryFn: () => api.get<ObjectRecord>(`/api/objects/${encodeURIComponent(id)}`), enabled: id !== "" });

export const useObjects = (params: ObjectListParams) => useQuery(objectListQuery(params));
export const useObject = (id: string) => useQuery(objectQuery(id));
export const useNextObjectNumber = (enabled: boolean) =>
  useQuery({ queryKey: objectKeys.nextNumber(), queryFn: () => api.get<{ objectNumber: string }>("/api/objects/next-number"), enabled, staleTime: 0 });

export function useCreateObject() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: ObjectCreate) => api.post<ObjectRecord>("/api/objects", body),
    onSuccess: (obj) => {
      qc.invalidateQueries({ queryKey: objectKeys.all });
      // Clients show how many objects they have.
      qc.invalidateQueries({ queryKey: rootKeys.clients });
      qc.setQueryData(objectQuery(obj.id).queryKey, obj);
    },
  });
}

export function useUpdateObject(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: ObjectUpdate) => api.put<ObjectRecord>(`/api/objects/${encodeURIComponent(id)}`, body),
    onSuccess: (obj) => {
      qc.invalidateQueries({ queryKey: objectKeys.lists() });
      // The edit is an event in the object's history.
      qc.invalidateQueries({ queryKey: objectHistoryKey(obj.id) });
      qc.setQueryData(objectQuery(obj.id).queryKey, obj);
    },
  });
}
