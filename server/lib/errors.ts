import type { ZodError } from "zod";
import { ERROR_STATUS, issuesToFields, type ErrorCode } from "../../shared/schemas/errors.ts";

/** The one application error: a code (which gives its HTTP status, ERROR_STATUS) and a sentence for people. */
export class AppError extends Error {
  readonly status: number;
  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
    this.status = ERROR_STATUS[code];
  }
}

export const notFound = (what = "That record") => new AppError("not_found", `${what} was not found.`);
export const forbidden = (message = "Your role does not allow this.") => new AppError("forbidden", message);
export const conflict = (message: string, fields?: Record<string, string>) => new AppError("conflict", message, fields);

export function validationError(error: ZodError): AppError {
  const fields = issuesToFields(error.issues);
  const n = Object.keys(fields).length;
  const first = Object.entries(fields)[0];
  const message = n === 1 && first ? `Check ${first[0]}: ${first[1]}` : `Check the ${n} highlighted fields: ${Object.keys(fields).slice(0, 4).join(", ")}${n > 4 ? "…" : ""}.`;
  return new AppError("validation_failed", message, fields);
}
