import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { MountPlanInput, SavedPlan } from "@shared/schemas/mount-plan.ts";
import { api } from "@/lib/api-client.ts";
import { rootKeys } from "@/lib/query-keys.ts";

export const planKeys = {
  all: rootKeys.plans,
  object: (objectId: string) => [...rootKeys.plans, "object", objectId] as const,
};

export const objectPlanQuery = (objectId: string) =>
  queryOptions({
    queryKey: planKeys.object(objectId),
    queryFn: () => api.get<{ draft: SavedPlan | null }>(`/api/objects/${encodeURIComponent(objectId)}/plan`).then((r) => r.draft),
    enabled: objectId !== "",
  });

export const useObjectPlan = (objectId: string) => useQuery(objectPlanQuery(objectId));

export function useSavePlan(objectId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { input: MountPlanInput; version?: number }) => api.put<SavedPlan>(`/api/objects/${encodeURIComponent(objectId)}/plan`, body),
    onSuccess: (saved) => qc.setQueryData(objectPlanQuery(objectId).queryKey, saved),
  });
}
