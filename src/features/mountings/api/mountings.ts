import { useMutation, useQuery } from "@tanstack/react-query";
import type { MountingCreate, MountingData, MountingRecord, MountingRevision } from "@shared/schemas/mountings.ts";
import { api } from "@/lib/api-client.ts";
import { rootKeys } from "@/lib/query-keys.ts";
import { revisionedApi, useCorrect, useCreateDraft, useLock, useRevisionedSaved, useUpdateDraft } from "@/lib/revisioned.ts";

const mountings = revisionedApi<MountingRecord, MountingRevision, MountingCreate, MountingData>(rootKeys.mountings, {
  base: "/api/mountings",
  ofObject: "mountings",
  lock: "complete",
});

export const mountingKeys = mountings.keys;
export const objectMountingsQuery = mountings.objectQuery;
export const mountingQuery = mountings.oneQuery;
export const revisionsQuery = mountings.revisionsQuery;

export const useObjectMountings = (objectId: string) => useQuery(objectMountingsQuery(objectId));
export const useMounting = (id: string) => useQuery(mountingQuery(id));
export const useRevisions = (id: string, enabled = true) => useQuery({ ...revisionsQuery(id), enabled });

export const useCreateMounting = (objectId: string) => useCreateDraft(mountings, objectId);
export const useUpdateMountingDraft = (id: string) => useUpdateDraft(mountings, id);
export const useCompleteMounting = (id: string) => useLock(mountings, id);
export const useCorrectMounting = (id: string) => useCorrect(mountings, id);
export function useRemoveMounting(id: string) {
  const done = useRevisionedSaved<MountingRecord>(mountings);
  return useMutation({
    mutationFn: (body: { version: number; endedOn: string; endReason: string }) => api.post<MountingRecord>(`/api/mountings/${encodeURIComponent(id)}/remove`, body),
    onSuccess: done,
  });
}
