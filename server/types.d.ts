import type { SessionUser } from "../shared/schemas/auth.ts";

declare global {
  namespace Express {
    interface Request {
      /** The signed-in user; set by requireAuth. */
      user?: SessionUser;
      /** Parsed and validated input; set by validate(). */
      valid?: { body?: unknown; query?: unknown; params?: unknown };
    }
  }
}
