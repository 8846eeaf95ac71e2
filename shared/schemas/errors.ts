import { z } from "zod";

export const ERROR_CODES = ["validation_failed", "unauthenticated", "forbidden", "not_found", "conflict", "rate_limited", "payload_too_large", "unavailable", "internal"] as const;
export type ErrorCode = (typeof ERROR_CODES)[number];

/** The HTTP status of each code: an error is made from its code, so the two never disagree. */
export const ERROR_STATUS: Record<ErrorCode, number> = {
  validation_failed: 422,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  rate_limited: 429,
  payload_too_large: 413,
  unavailable: 503,
  internal: 500,
};

/** The one error shape every API error uses. `fields` maps a dotted field path to a message. */
export const ErrorBodySchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
  }),
});
export type ErrorBody = z.infer<typeof ErrorBodySchema>;

/** Turns zod issues into `{ "sheet.width": "…" }`, keeping the first message for each path. */
export function issuesToFields(issues: readonly { path: PropertyKey[]; message: string }[]): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of issues) {
    const key = issue.path.map(String).join(".") || "_";
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}
