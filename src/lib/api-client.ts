import { ErrorBodySchema } from "@shared/schemas/errors.ts";

/**
 * The client's one transport: JSON requests (`api`), files saved from the server (`download`) and
 * multipart uploads with progress (`upload`). Every failure comes back as an ApiError read by the one
 * parser below, from the server's one error shape (shared/schemas/errors.ts).
 */

/** An API error as the client sees it: the one error shape, plus the HTTP status. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Record<string, string> = {},
  ) {
    super(message);
  }
}

/** What a request says when it fails without the server's own sentence. */
type Messages = {
  /** The server could not be reached at all. */
  network: string;
  /** The server answered with an error that is not in the one error shape. */
  failed: (status: number) => string;
};

const JSON_MESSAGES: Messages = {
  network: "Reversa's server cannot be reached. Check the connection; nothing you typed has been lost.",
  failed: (status) => `The server answered ${status}. Nothing was saved; try again.`,
};

/** The one error parser: the server's error body, or a sentence of our own when the body is not one. */
export function errorFromResponse(status: number, body: unknown, failed: (status: number) => string): ApiError {
  const parsed = ErrorBodySchema.safeParse(body);
  if (parsed.success) return new ApiError(status, parsed.data.error.code, parsed.data.error.message, parsed.data.error.fields);
  return new ApiError(status, status === 413 ? "payload_too_large" : "internal", failed(status));
}

/** Any thrown value as an ApiError, so screens have one thing to show. */
export function toApiError(err: unknown): ApiError {
  return err instanceof ApiError ? err : new ApiError(0, "internal", err instanceof Error ? err.message : String(err));
}

async function send(url: string, init: RequestInit, messages: Messages): Promise<Response> {
  let res: Response;
  try {
    res = await fetch(url, { credentials: "same-origin", ...init });
  } catch {
    throw new ApiError(0, "network", messages.network);
  }
  if (!res.ok) throw errorFromResponse(res.status, await res.json().catch(() => null), messages.failed);
  return res;
}

async function request<T>(method: string, url: string, body?: unknown): Promise<T> {
  const res = await send(
    url,
    {
      method,
      headers: body === undefined ? { accept: "application/json" } : { "content-type": "application/json", accept: "application/json" },
      body: body === undefined ? undefined : JSON.stringify(body),
    },
    JSON_MESSAGES,
  );
  if (res.status === 204) return undefined as T;
  return (await res.json().catch(() => null)) as T;
}

export const api = {
  get: <T>(url: string) => request<T>("GET", url),
  post: <T>(url: string, body?: unknown) => request<T>("POST", url, body ?? {}),
  put: <T>(url: string, body: unknown) => request<T>("PUT", url, body),
  delete: <T>(url: string) => request<T>("DELETE", url),
};

const DOWNLOAD_MESSAGES: Messages = {
  network: "Reversa's server cannot be reached. Try again.",
  failed: (status) => `The server answered ${status}.`,
};

/** Asks the server for a file (POST for documents, which issues them; GET for exports) and saves it. */
export async function download(url: string, opts: { method?: "GET" | "POST"; body?: unknown; fallbackName: string }): Promise<{ code: string | null }> {
  const res = await send(
    url,
    {
      method: opts.method ?? "POST",
      headers: opts.body === undefined ? {} : { "content-type": "application/json" },
      body: opts.body === undefined ? (opts.method === "GET" ? undefined : "{}") : JSON.stringify(opts.body),
    },
    DOWNLOAD_MESSAGES,
  );
  const blob = await res.blob();
  const name = /filename="?([^";]+)"?/.exec(res.headers.get("content-disposition") ?? "")?.[1] ?? opts.fallbackName;
  const href = URL.createObjectURL(blob);
  const a = document.createElement("a");
  a.href = href;
  a.download = name;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(href), 10_000);
  return { code: res.headers.get("x-verification-code") };
}

/** `sent` goes from 0 to 1 while the bytes go out; then the server works on them (`processing`). */
export type UploadProgress = { sent: number; processing: boolean };
export type UploadOptions = {
  method?: "POST" | "PUT";
  onProgress?: (p: UploadProgress) => void;
  signal?: AbortSignal;
  /** What to say when the server cannot be reached, answers outside the error shape, or the upload is stopped. */
  messages: Messages & { aborted?: string };
};

/**
 * Sends a multipart form. XMLHttpRequest rather than fetch, because only it reports upload progress.
 * Errors come back as ApiError with the server's sentence, as from `api`.
 */
export function upload<T>(url: string, form: FormData, opts: UploadOptions): Promise<T> {
  const aborted = opts.messages.aborted ?? "The upload was stopped before it finished; nothing was saved.";
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open(opts.method ?? "POST", url);
    xhr.setRequestHeader("accept", "application/json");
    xhr.responseType = "text";
    xhr.upload.onprogress = (e) => {
      if (!e.lengthComputable) return;
      const sent = e.total ? e.loaded / e.total : 0;
      opts.onProgress?.({ sent, processing: sent >= 1 });
    };
    xhr.upload.onload = () => opts.onProgress?.({ sent: 1, processing: true });
    xhr.onload = () => {
      let data: unknown = null;
      try {
        data = JSON.parse(xhr.responseText);
      } catch {
        /* not JSON: the parser says so */
      }
      if (xhr.status >= 200 && xhr.status < 300) return resolve(data as T);
      reject(errorFromResponse(xhr.status, data, opts.messages.failed));
    };
    xhr.onerror = () => reject(new ApiError(0, "network", opts.messages.network));
    xhr.onabort = () => reject(new ApiError(0, "aborted", aborted));
    if (opts.signal) {
      if (opts.signal.aborted) return reject(new ApiError(0, "aborted", aborted));
      opts.signal.addEventListener("abort", () => xhr.abort(), { once: true });
    }
    xhr.send(form);
  });
}

/** Builds a query string from defined values only. */
export function qs(params: Record<string, string | number | undefined | null>): string {
  const s = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== null && v !== "") s.set(k, String(v));
  const text = s.toString();
  return text ? `?${text}` : "";
}
