import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { Photo, PhotoKind } from "@shared/schemas/photos.ts";
import { api, ApiError, qs, upload, type UploadProgress } from "@/lib/api-client.ts";
import { rootKeys } from "@/lib/query-keys.ts";

const objectPath = (objectId: string) => `/api/objects/${encodeURIComponent(objectId)}/photos`;

export const photoKeys = {
  all: rootKeys.photos,
  object: (objectId: string, reportId?: string) => [...rootKeys.photos, "object", objectId, reportId ?? "all"] as const,
};

/** One object's photos (or only one condition report's), oldest first. */
export const objectPhotosQuery = (objectId: string, reportId?: string) =>
  queryOptions({
    queryKey: photoKeys.object(objectId, reportId),
    queryFn: () => api.get<{ items: Photo[] }>(`${objectPath(objectId)}${qs({ reportId })}`).then((r) => r.items),
  });

export const useObjectPhotos = (objectId: string, reportId?: string) => useQuery(objectPhotosQuery(objectId, reportId));

/** Changes a photo's kind and caption; every photo list is fetched again. */
export function useUpdatePhoto() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, kind, caption }: { id: string; kind: PhotoKind; caption: string | null }) =>
      api.put<Photo>(`/api/photos/${encodeURIComponent(id)}`, { kind, caption: caption ?? "" }),
    onSuccess: () => qc.invalidateQueries({ queryKey: photoKeys.all }),
  });
}

export type PhotoUploadFields = { kind: PhotoKind; caption?: string; reportId?: string };
export type { UploadProgress };

const UPLOAD_MESSAGES = {
  network: "Reversa's server cannot be reached, so the photo was not sent. Check the connection, then try again.",
  failed: (status: number) => (status === 413 ? "This file is too large for the server to accept." : `The server answered ${status}. The photo was not saved; try again.`),
  aborted: "The upload was stopped before it finished; the photo was not saved.",
};

/** Sends one photo (one request per file, so each has its own progress) through the client's upload. */
export function uploadPhoto(objectId: string, file: File, fields: PhotoUploadFields, onProgress?: (p: UploadProgress) => void, signal?: AbortSignal): Promise<Photo> {
  const form = new FormData();
  // Fields before the file, so the server has them when the file arrives.
  form.append("kind", fields.kind);
  if (fields.caption) form.append("caption", fields.caption);
  if (fields.reportId) form.append("reportId", fields.reportId);
  form.append("file", file, file.name);
  return upload<Photo>(objectPath(objectId), form, { onProgress, signal, messages: UPLOAD_MESSAGES });
}

/** The sentence to show beside a file that was refused: the file's own problem first. */
export function uploadErrorMessage(error: unknown): string {
  if (error instanceof ApiError) return error.fields.file ?? error.fields.kind ?? error.fields.caption ?? error.fields.reportId ?? error.message;
  return "Something went wrong while sending the photo. It was not saved; try again.";
}
