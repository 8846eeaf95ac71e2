import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { StudioSettings, StudioSettingsRecord } from "@shared/schemas/settings.ts";
import { vocab } from "@shared/schemas/settings.ts";
import { ErrorBodySchema } from "@shared/schemas/errors.ts";
import { api, ApiError } from "@/lib/api-client.ts";

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

/** Sends the studio's logo (PNG or JPEG) as multipart; errors come back as ApiError with the server's sentence. */
async function putLogo(file: File): Promise<StudioSettingsRecord> {
  const form = new FormData();
  form.append("file", file, file.name);
  let res: Response;
  try {
    res = await fetch("/api/settings/logo", { method: "PUT", credentials: "same-origin", headers: { accept: "application/json" }, body: form });
  } catch {
    throw new ApiError(0, "network", "Reversa's server cannot be reached. Check the connection and try again.");
  }
  const data: unknown = await res.json().catch(() => null);
  if (!res.ok) {
    const parsed = ErrorBodySchema.safeParse(data);
    if (parsed.success) throw new ApiError(res.status, parsed.data.error.code, parsed.data.error.fields?.file ?? parsed.data.error.message, parsed.data.error.fields);
    throw new ApiError(res.status, "internal", `The server answered ${res.status}. The logo was not changed; try again.`);
  }
  return data as StudioSettingsRecord;
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
