import type { ZodError } from "zod";
import { issuesToFields, type ErrorCode } from "../../shared/schemas/errors.ts";

/** The one application error: a code, an HTTP status and a sentence for people. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
  }
}

export const notFound = (what = "That record") => new AppError(404, "not_found", `${what} was not found.`);
export const forbidden = (message = "Your role does not allow this.") => new AppError(403, "forbidden", message);
export const conflict = (message: string, fields?: Record<string, string>) => new AppError(409, "conflict", message, fields);

export function validationError(error: ZodError): AppError {
  const fields = issuesToFields(error.issues);
  const n = Object.keys(fields).length;
  const first = Object.entries(fields)[0];
  const message =
    n === 1 && first ? `Check ${first[0]}: ${first[1]}` : `Check the ${n} highlighted fields: ${Object.keys(fields).slice(0, 4).join(", ")}${n > 4 ? "…" : ""}.`;
  return new AppError(422, "validation_failed", message, fields);
}
