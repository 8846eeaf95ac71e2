import type { ErrorRequestHandler, RequestHandler } from "express";
import { ZodError } from "zod";
import { AppError, validationError } from "../lib/errors.ts";
import type { ErrorBody } from "../../shared/schemas/errors.ts";

export const apiNotFound: RequestHandler = (req) => {
  throw new AppError("not_found", `There is no API route ${req.method} ${req.originalUrl.split("?")[0]}.`);
};

/** Turns every error into the one error shape; never leaks a stack trace. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  let appError: AppError;
  if (err instanceof AppError) appError = err;
  else if (err instanceof ZodError) appError = validationError(err);
  else if (err?.type === "entity.parse.failed") appError = new AppError("validation_failed", "The request body is not valid JSON.", { _: "Not valid JSON." });
  else if (err?.type === "entity.too.large") appError = new AppError("payload_too_large", "The request is too large.");
  else {
    req.log?.error({ err }, "unhandled error");
    appError = new AppError("internal", "Something went wrong on the server. Nothing was saved; try again.");
  }
  const body: ErrorBody = { error: { code: appError.code, message: appError.message } };
  if (appError.fields) body.error.fields = appError.fields;
  res.status(appError.status).json(body);
};
