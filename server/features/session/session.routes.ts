import { Router, type Response as ExpressResponse } from "express";
import { fromNodeHeaders } from "better-auth/node";
import type { Auth } from "../../lib/auth.ts";
import { SignInSchema } from "../../../shared/schemas/auth.ts";
import { AppError } from "../../lib/errors.ts";
import { input, validate } from "../../middleware/validate.ts";
import type { SessionResolver } from "../../middleware/require-auth.ts";

/** Copies better-auth's cookies onto the Express response. */
function forwardCookies(from: Response, to: ExpressResponse) {
  const cookies = from.headers.getSetCookie();
  if (cookies.length) to.setHeader("Set-Cookie", cookies);
}

/**
 * Sign-in and sign-out in the API's own error shape, on top of better-auth.
 * GET /api/session → { user | null } · POST /api/session { email, password } · DELETE /api/session
 */
export function sessionRoutes(auth: Auth, sessions: SessionResolver, signedIn: (email: string) => void = () => {}) {
  const r = Router();

  // Public: tells the client whether it is signed in, without a 401 in the console.
  r.get("/", async (req, res) => {
    res.setHeader("Cache-Control", "no-store");
    res.json({ user: await sessions.resolve(req, res) });
  });

  r.post("/", validate({ body: SignInSchema }), async (req, res) => {
    const body = input(req, "body", SignInSchema);
    const response = await auth.api.signInEmail({
      body: { email: body.email, password: body.password, rememberMe: true },
      headers: fromNodeHeaders(req.headers),
      asResponse: true,
    });
    if (!response.ok) {
      if (response.status === 401 || response.status === 400) {
        throw new AppError("unauthenticated", "That e-mail address and password do not match an account. Check both and try again.", {
          password: "E-mail address or password is wrong.",
        });
      }
      throw new AppError(response.status === 403 ? "forbidden" : "internal", "Sign-in failed; try again.");
    }
    forwardCookies(response, res);
    signedIn(body.email);
    const data = (await response.json()) as { user: { id: string } };
    res.json({ ok: true, userId: data.user.id });
  });

  r.delete("/", async (req, res) => {
    sessions.forget(req);
    const response = await auth.api.signOut({ headers: fromNodeHeaders(req.headers), asResponse: true });
    forwardCookies(response, res);
    res.status(204).end();
  });

  return r;
}
