import { EnvSchema } from "../../shared/schemas/env.ts";
import path from "node:path";

export type Config = {
  port: number;
  host: string;
  databaseUrl: string;
  uploadsDir: string;
  /** Largest photo file accepted, in MB (1 MB = 1,048,576 bytes). */
  maxUploadMb: number;
  /** Largest photo accepted, in megapixels (width × height / 10^6), judged from the header before decoding. */
  maxUploadMegapixels: number;
  seedDemo: boolean;
  publicUrl: string;
  /** Whether PUBLIC_URL was given: back labels refuse to print a QR code to a guessed localhost address. */
  publicUrlGiven: boolean;
  trustedOrigins: string[];
  authSecret?: string;
  /** HISTORY_KEY, when set; otherwise the key is kept in .history-key beside the database. */
  historyKeyFromEnv?: string;
  /** HISTORY_CHECKPOINTS, when set; otherwise history-checkpoints.log beside the database. */
  historyCheckpoints?: string;
  logLevel: string;
  /** Failed sign-in attempts allowed per IP address per 15 minutes, on any accounts; then 429 until the window ends. */
  loginRateLimit: number;
  /** Failed attempts on one account (from any address) before each further attempt on it is delayed. */
  loginAccountDelayAfter: number;
  /** The first delay; each further failure doubles it, up to 10 s (never a lock-out). */
  loginDelayMs: number;
  /** Longest one document may take to lay out (and one export's datasets to gather) before it is stopped. */
  workTimeLimitMs: number;
  /** Folder of the built client to serve, or null to serve the API only. */
  clientDir: string | null;
  secureCookies: boolean;
};

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = EnvSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`).join("\n");
    throw new Error(`Reversa cannot start: some settings in the environment are wrong.\n${lines}`);
  }
  const e = parsed.data;
  const publicUrl = e.PUBLIC_URL ?? `http://localhost:${e.PORT}`;
  return {
    port: e.PORT,
    host: e.HOST,
    databaseUrl: e.DATABASE_URL,
    uploadsDir: path.resolve(e.UPLOADS_DIR),
    maxUploadMb: e.MAX_UPLOAD_MB,
    maxUploadMegapixels: e.MAX_UPLOAD_MEGAPIXELS,
    seedDemo: e.SEED_DEMO,
    publicUrl,
    publicUrlGiven: e.PUBLIC_URL !== undefined,
    trustedOrigins: [
      publicUrl,
      `http://localhost:${e.PORT}`,
      `http://127.0.0.1:${e.PORT}`,
      ...e.TRUSTED_ORIGINS.split(",")
        .map((s) => s.trim())
        .filter(Boolean),
    ],
    authSecret: e.BETTER_AUTH_SECRET,
    historyKeyFromEnv: e.HISTORY_KEY,
    historyCheckpoints: e.HISTORY_CHECKPOINTS,
    logLevel: e.LOG_LEVEL,
    loginRateLimit: e.LOGIN_RATE_LIMIT,
    loginAccountDelayAfter: e.LOGIN_ACCOUNT_DELAY_AFTER,
    loginDelayMs: e.LOGIN_DELAY_MS,
    workTimeLimitMs: e.WORK_TIME_LIMIT_S * 1000,
    clientDir: e.NODE_ENV === "production" ? path.resolve("dist/client") : null,
    secureCookies: publicUrl.startsWith("https://"),
  };
}
