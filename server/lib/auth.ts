import { betterAuth } from "better-auth";
import { drizzleAdapter } from "better-auth/adapters/drizzle";
import { hashPassword } from "better-auth/crypto";
import type { Db } from "../db/client.ts";
import * as schema from "../db/schema.ts";
import type { Config } from "./config.ts";

/**
 * Sign-in is better-auth with its Drizzle adapter: e-mail and password, sessions in SQLite,
 * HttpOnly SameSite=Lax cookies. Sign-up is closed: the studio admin creates accounts.
 */
export function createAuth(db: Db, config: Config & { authSecret: string }) {
  return betterAuth({
    appName: "Reversa",
    baseURL: config.publicUrl,
    basePath: "/api/auth",
    secret: config.authSecret,
    trustedOrigins: config.trustedOrigins,
    database: drizzleAdapter(db, {
      provider: "sqlite",
      schema: { user: schema.user, session: schema.session, account: schema.account, verification: schema.verification },
    }),
    emailAndPassword: { enabled: true, disableSignUp: true, minPasswordLength: 10 },
    user: {
      additionalFields: {
        role: { type: "string", required: true, input: false, defaultValue: "framer" },
        clientId: { type: "string", required: false, input: false },
      },
    },
    session: {
      expiresIn: 60 * 60 * 24 * 7,
      updateAge: 60 * 60 * 24,
      // No cookie cache: with it, a signed-out (or role-changed) session stayed valid for up to its
      // maxAge to anyone holding the cookies. One indexed SQLite lookup per call is cheap.
      cookieCache: { enabled: false },
    },
    // Sign-in attempts are limited by express-rate-limit in front of this handler (app.ts).
    rateLimit: { enabled: false },
    advanced: {
      useSecureCookies: config.secureCookies,
      defaultCookieAttributes: { httpOnly: true, sameSite: "lax" },
    },
    telemetry: { enabled: false },
    // better-auth logs to the console on its own; keep it quiet when the app's log level is silent.
    logger: { disabled: config.logLevel === "silent" },
  });
}
export type Auth = ReturnType<typeof createAuth>;

/** The password hash better-auth itself verifies, for the seed and the admin's user screen. */
export const hashUserPassword = (password: string) => hashPassword(password);
