import type { RequestHandler } from "express";
import { forbidden } from "../lib/errors.ts";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * Cross-site request forgery guard for every state-changing API request, sign-in included (OWASP CSRF
 * Prevention Cheat Sheet, "Verifying origin with standard headers"). A write must say where it comes from:
 * its `Origin` must be one of the studio's own origins (PUBLIC_URL, this port on localhost, TRUSTED_ORIGINS);
 * without an Origin, the browser's `Sec-Fetch-Site` must say same-origin. A foreign origin, the opaque
 * `null` origin, or neither header is refused with 403 before the body is read or the session looked at.
 */
export function sameOriginWrites(trustedOrigins: string[]): RequestHandler {
  const trusted = new Set(trustedOrigins.map((o) => o.replace(/\/+$/, "").toLowerCase()));
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const origin = req.get("origin");
    if (origin !== undefined) {
      if (origin !== "null" && trusted.has(origin.replace(/\/+$/, "").toLowerCase())) return next();
      return next(
        forbidden(
          `This request came from ${origin === "null" ? "a page with no origin" : origin}, which is not this studio's address; it was refused. Open Reversa at its own address and try again.`,
        ),
      );
    }
    if (req.get("sec-fetch-site") === "same-origin") return next();
    next(
      forbidden(
        "This request did not say which site it came from (no Origin header), so it was refused. Use Reversa in a browser at its own address, or send the Origin header from a script.",
      ),
    );
  };
}
