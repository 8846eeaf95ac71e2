import type { RequestHandler } from "express";
import { rateLimit } from "express-rate-limit";
import { slowDown } from "express-slow-down";
import type { ErrorBody } from "../../shared/schemas/errors.ts";

const WINDOW_MS = 15 * 60 * 1000;
/** The longest delay an account's attempts get: slow enough to stop guessing, short enough never to lock the owner out. */
export const MAX_SIGN_IN_DELAY_MS = 10_000;

/** The delay before the n-th attempt on an account once `after` have failed: base, 2 × base, 4 × base… up to the cap. */
export function signInDelay(used: number, after: number, baseMs: number): number {
  if (used <= after) return 0;
  return Math.min(MAX_SIGN_IN_DELAY_MS, baseMs * 2 ** Math.min(20, used - after - 1));
}

const accountKey = (body: unknown) => {
  const email = (body as { email?: unknown } | undefined)?.email;
  return typeof email === "string" && email.trim() ? `account:${email.trim().toLowerCase()}` : null;
};

/**
 * Sign-in throttling in two parts (OWASP Authentication Cheat Sheet, "Protect against automated attacks"):
 * - by address: after `perAddress` failed attempts in 15 minutes, that address is refused (429) until the
 *   window ends, whichever accounts it tries, so one address cannot work through many accounts;
 * - by account: after `accountDelayAfter` failed attempts on one account, from any address, each further
 *   attempt on it waits a growing delay (doubling, at most 10 s) before it is checked. It is never refused,
 *   so a flood of wrong passwords from one address never locks the right password out from another.
 * Only failures count (successes are skipped), and a successful sign-in clears its account's count.
 */
export function signInThrottle(opts: { perAddress: number; accountDelayAfter: number; delayMs: number }): { middleware: RequestHandler[]; signedIn: (email: string) => void } {
  const refused: ErrorBody = { error: { code: "rate_limited", message: "Too many failed sign-in attempts from this address. Wait 15 minutes, then try again." } };
  const byAddress = rateLimit({
    windowMs: WINDOW_MS,
    limit: opts.perAddress,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    skipSuccessfulRequests: true,
    handler: (_req, res) => void res.status(429).json(refused),
  });
  const byAccount = slowDown({
    windowMs: WINDOW_MS,
    delayAfter: opts.accountDelayAfter,
    delayMs: (used) => signInDelay(used, opts.accountDelayAfter, opts.delayMs),
    maxDelayMs: MAX_SIGN_IN_DELAY_MS,
    skipSuccessfulRequests: true,
    // A body without an e-mail address is refused by validation anyway; it is counted by address only.
    skip: (req) => accountKey(req.body) === null,
    keyGenerator: (req) => accountKey(req.body)!,
  });
  return { middleware: [byAddress, byAccount], signedIn: (email) => void byAccount.resetKey(`account:${email.trim().toLowerCase()}`) };
}
