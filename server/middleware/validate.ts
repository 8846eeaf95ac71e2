import type { Request, RequestHandler } from "express";
import type { z } from "zod";
import { validationError } from "../lib/errors.ts";

type Schemas = { body?: z.ZodType; query?: z.ZodType; params?: z.ZodType };

/** Parses body, query and params with the shared zod schemas before the handler runs. */
export function validate(schemas: Schemas): RequestHandler {
  return (req, _res, next) => {
    const valid: NonNullable<Request["valid"]> = {};
    for (const part of ["params", "query", "body"] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const result = schema.safeParse(req[part] ?? {});
      if (!result.success) throw validationError(result.error);
      valid[part] = result.data;
    }
    req.valid = valid;
    next();
  };
}

/** Typed access to what validate() parsed. */
export function input<T extends z.ZodType>(req: Request, part: "body" | "query" | "params", _schema: T): z.infer<T> {
  return req.valid?.[part] as z.infer<T>;
}
