import { useQuery } from "@tanstack/react-query";
import type { Dataset, Format, JobState, JobStatus } from "@shared/schemas/exports.ts";
import { api, download } from "@/lib/api-client.ts";
import { rootKeys } from "@/lib/query-keys.ts";

export const exportKeys = {
  all: rootKeys.exports,
  job: (jobId: string) => [...rootKeys.exports, "job", jobId] as const,
};

const POLL_MS = 500;
const running = (state: JobState) => state === "running";

/** An archive job, asked again every half second while it runs; polling stops once it is done or failed. */
export const useExportJob = (jobId: string | null) =>
  useQuery({
    queryKey: exportKeys.job(jobId ?? ""),
    queryFn: () => api.get<JobStatus>(`/api/exports/${encodeURIComponent(jobId!)}`),
    enabled: !!jobId,
    retry: false,
    refetchInterval: (q) => (q.state.status !== "error" && (q.state.data === undefined || running(q.state.data.state)) ? POLL_MS : false),
  });

export const startArchive = (clientId: string, originals: boolean) => api.post<{ jobId: string }>(`/api/clients/${encodeURIComponent(clientId)}/exports/archive`, { originals });

export const downloadArchive = (jobId: string) => download(`/api/exports/${encodeURIComponent(jobId)}/download`, { method: "GET", fallbackName: "reversa-archive.zip" });

export const downloadDataset = (clientId: string, dataset: Dataset, format: Format) =>
  download(`/api/clients/${encodeURIComponent(clientId)}/exports/${dataset}.${format}`, { method: "GET", fallbackName: `${dataset}.${format}` });
