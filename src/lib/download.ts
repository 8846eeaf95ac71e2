import { ErrorBodySchema } from "@shared/schemas/errors.ts";
import { ApiError } from "./api-client.ts";

/** Asks the server for a file (POST for documents, which issues them; GET for exports) and saves it. */
export async function downloadFile(url: string, opts: { method?: "GET" | "POST"; body?: unknown; fallbackName: string }): Promise<{ code: string | null }> {
  let res: Response;
  try {
    res = await fetch(url, {
      method: opts.method ?? "POST",
      credentials: "same-origin",
      headers: opts.body === undefined ? {} : { "content-type": "application/json" },
      body: opts.body === undefined ? (opts.method === "GET" ? undefined : "{}") : JSON.stringify(opts.body),
    });
  } catch {
    throw new ApiError(0, "network", "Reversa's server cannot be reached. Try again.");
  }
  if (!res.ok) {
    const parsed = ErrorBodySchema.safeParse(await res.json().catch(() => null));
    throw parsed.success ? new ApiError(res.status, parsed.data.error.code, parsed.data.error.message, parsed.data.error.fields) : new ApiError(res.status, "internal", `The server answered ${res.status}.`);
  }
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
