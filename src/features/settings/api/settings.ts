import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { StudioSettings, StudioSettingsRecord } from "@shared/schemas/settings.ts";
import { vocab } from "@shared/schemas/settings.ts";
import { api } from "@/lib/api-client.ts";

export const settingsQuery = queryOptions({
  queryKey: ["settings"],
  queryFn: () => api.get<StudioSettingsRecord>("/api/settings"),
  staleTime: 5 * 60_000,
});

export const useSettings = (enabled = true) => useQuery({ ...settingsQuery, enabled });

/** The studio's unit and vocabulary, with safe defaults while settings load. */
export function useStudio() {
  const { data } = useSettings();
  const unit = data?.unit ?? "mm";
  return { settings: data, unit, words: vocab(data?.vocabulary ?? "mount") };
}

export function useSaveSettings() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: StudioSettings) => api.put<StudioSettingsRecord>("/api/settings", body),
    onSuccess: (data) => qc.setQueryData(settingsQuery.queryKey, data),
  });
}
