import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { MountingCorrection, MountingCreate, MountingRecord, MountingRevision } from "@shared/schemas/mountings.ts";
import type { Change } from "@shared/domain/diff.ts";
import { api } from "@/lib/api-client.ts";
import { objectHistoryKey, rootKeys } from "@/lib/query-keys.ts";

export const mountingKeys = {
  all: rootKeys.mountings,
  object: (objectId: string) => [...rootKeys.mountings, "object", objectId] as const,
  one: (id: string) => [...rootKeys.mountings, "one", id] as const,
  revisions: (id: string) => [...rootKeys.mountings, "revisions", id] as const,
};

export const objectMountingsQuery = (objectId: string) =>
  queryOptions({
    queryKey: mountingKeys.object(objectId),
    queryFn: () => api.get<{ items: MountingRecord[] }>(`/api/objects/${encodeURIComponent(objectId)}/mountings`).then((r) => r.items),
  });
export const mountingQuery = (id: string) => queryOptions({ queryKey: mountingKeys.one(id), queryFn: () => api.get<MountingRecord>(`/api/mountings/${encodeURIComponent(id)}`) });
export const revisionsQuery = (id: string) =>
  queryOptions({
    queryKey: mountingKeys.revisions(id),
    queryFn: () => api.get<{ items: (MountingRevision & { changes: Change[] })[] }>(`/api/mountings/${encodeURIComponent(id)}/revisions`).then((r) => r.items),
  });

export const useObjectMountings = (objectId: string) => useQuery(objectMountingsQuery(objectId));
export const useMounting = (id: string) => useQuery(mountingQuery(id));
export const useRevisions = (id: string, enabled = true) => useQuery({ ...revisionsQuery(id), enabled });

function useInvalidate() {
  const qc = useQueryClient();
  return (m: MountingRecord) => {
    qc.setQueryData(mountingQuery(m.id).queryKey, m);
    qc.invalidateQueries({ queryKey: mountingKeys.all });
    qc.invalidateQueries({ queryKey: objectHistoryKey(m.objectId) });
    qc.invalidateQueries({ queryKey: rootKeys.objects });
  };
}

export function useCreateMounting(objectId: string) {
  const done = useInvalidate();
  return useMutation({ mutationFn: (body: MountingCreate) => api.post<MountingRecord>(`/api/objects/${encodeURIComponent(objectId)}/mountings`, body), onSuccess: done });
}
export function useUpdateMountingDraft(id: string) {
  const done = useInvalidate();
  return useMutation({ mutationFn: (body: MountingCreate & { version: number }) => api.put<MountingRecord>(`/api/mountings/${encodeURIComponent(id)}`, body), onSuccess: done });
}
export function useCompleteMounting(id: string) {
  const done = useInvalidate();
  return useMutation({ mutationFn: (version: number) => api.post<MountingRecord>(`/api/mountings/${encodeURIComponent(id)}/complete`, { version }), onSuccess: done });
}
export function useCorrectMounting(id: string) {
  const done = useInvalidate();
  return useMutation({ mutationFn: (body: MountingCorrection) => api.post<MountingRecord>(`/api/mountings/${encodeURIComponent(id)}/corrections`, body), onSuccess: done });
}
export function useRemoveMounting(id: string) {
  const done = useInvalidate();
  return useMutation({
    mutationFn: (body: { version: number; endedOn: string; endReason: string }) => api.post<MountingRecord>(`/api/mountings/${encodeURIComponent(id)}/remove`, body),
    onSuccess: done,
  });
}
