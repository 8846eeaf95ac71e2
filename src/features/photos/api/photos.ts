import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { ErrorBodySchema } from "@shared/schemas/errors.ts";
import type { Photo, PhotoKind } from "@shared/schemas/photos.ts";
import { api, ApiError, qs } from "@/lib/api-client.ts";

const objectPath = (objectId: string) => `/api/objects/${encodeURIComponent(objectId)}/photos`;

export const photoKeys = {
  all: ["photos"] as const,
  object: (objectId: string, reportId?: string) => ["photos", "object", objectId, reportId ?? "all"] as const,
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
/** `sent` goes from 0 to 1 while the bytes go out; then the server makes the versions (`processing`). */
export type UploadProgress = { sent: number; processing: boolean };

/**
 * Sends one photo (one request per file, so each has its own progress). XMLHttpRequest rather than
 * fetch, because only it reports upload progress. Errors come back as ApiError with the server's
 * sentence, as from the api client.
 */
export function uploadPhoto(
  objectId: string,
  file: File,
  fields: PhotoUploadFields,
  onProgress?: (p: UploadProgress) => void,
  signal?: AbortSignal,
): Promise<Photo> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    // Fields before the file, so the server has them when the file arrives.
    form.append("kind", fields.kind);
    if (fields.caption) form.append("caption", fields.caption);
    if (fields.reportId) form.append("reportId", fields.reportId);
    form.append("file", file, file.name);

    const xhr = new XMLHttpRequest();
    xhr.open("POST", objectPath(objectId));
    xhr.setRequestHeader("accept", "application/json");
    xhr.responseType = "text";
    xhr.upload.onprogress = (e) => {
      if (!e.lengthComputable) return;
      const sent = e.total ? e.loaded / e.total : 0;
      onProgress?.({ sent, processing: sent >= 1 });
    };
    xhr.upload.onload = () => onProgress?.({ sent: 1, processing: true });
    xhr.onload = () => {
      let data: unknown = null;
      try {
        data = JSON.parse(xhr.responseText);
      } catch {
        /* not JSON: handled below */
      }
      if (xhr.status === 201 || xhr.status === 200) return resolve(data as Photo);
      const parsed = ErrorBodySchema.safeParse(data);
      if (parsed.success) {
        const { code, message, fields: f } = parsed.data.error;
        return reject(new ApiError(xhr.status, code, message, f));
      }
      if (xhr.status === 413) return reject(new ApiError(413, "payload_too_large", "This file is too large for the server to accept.", {}));
      reject(new ApiError(xhr.status, "internal", `The server answered ${xhr.status}. The photo was not saved; try again.`));
    };
    xhr.onerror = () => reject(new ApiError(0, "network", "Reversa's server cannot be reached, so the photo was not sent. Check the connection, then try again."));
    xhr.onabort = () => reject(new ApiError(0, "aborted", "The upload was stopped before it finished; the photo was not saved."));
    if (signal) {
      if (signal.aborted) return reject(new ApiError(0, "aborted", "The upload was stopped before it finished; the photo was not saved."));
      signal.addEventListener("abort", () => xhr.abort(), { once: true });
    }
    xhr.send(form);
  });
}

/** The sentence to show beside a file that was refused: the file's own problem first. */
export function uploadErrorMessage(error: unknown): string {
  if (error instanceof ApiError) return error.fields.file ?? error.fields.kind ?? error.fields.caption ?? error.fields.reportId ?? error.message;
  return "Something went wrong while sending the photo. It was not saved; try again.";
}
