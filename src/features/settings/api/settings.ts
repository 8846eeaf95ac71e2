import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { StudioSettings, StudioSettingsRecord } from "@shared/schemas/settings.ts";
import { vocab } from "@shared/schemas/settings.ts";
import { api, ApiError, upload } from "@/lib/api-client.ts";
import { rootKeys } from "@/lib/query-keys.ts";

export const settingsKeys = { all: rootKeys.settings };

export const settingsQuery = queryOptions({
  queryKey: settingsKeys.all,
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

const LOGO_MESSAGES = {
  network: "Reversa's server cannot be reached. Check the connection and try again.",
  failed: (status: number) => `The server answered ${status}. The logo was not changed; try again.`,
};

/** Sends the studio's logo (PNG or JPEG) as multipart; the file's own problem is the sentence shown. */
async function putLogo(file: File): Promise<StudioSettingsRecord> {
  const form = new FormData();
  form.append("file", file, file.name);
  try {
    return await upload<StudioSettingsRecord>("/api/settings/logo", form, { method: "PUT", messages: LOGO_MESSAGES });
  } catch (e) {
    if (e instanceof ApiError && e.fields.file) throw new ApiError(e.status, e.code, e.fields.file, e.fields);
    throw e;
  }
}

export function useUploadLogo() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: putLogo, onSuccess: () => qc.invalidateQueries({ queryKey: settingsQuery.queryKey }) });
}

export function useRemoveLogo() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.delete<StudioSettingsRecord>("/api/settings/logo"),
    onSuccess: () => qc.invalidateQueries({ queryKey: settingsQuery.queryKey }),
  });
}
