import { z } from "zod";

/** Everything the server reads from the environment, with defaults that work out of the box. */
export const EnvSchema = z.object({
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default("0.0.0.0"),
  DATABASE_URL: z.string().default("data/reversa.db"),
  UPLOADS_DIR: z.string().default("uploads"),
  MAX_UPLOAD_MB: z.coerce.number().positive().max(2048).default(40),
  MAX_UPLOAD_MEGAPIXELS: z.coerce.number().positive().max(1000).default(100),
  SEED_DEMO: z
    .enum(["true", "false", "1", "0"])
    .default("true")
    .transform((v) => v === "true" || v === "1"),
  PUBLIC_URL: z.string().url().optional(),
  TRUSTED_ORIGINS: z.string().default(""),
  BETTER_AUTH_SECRET: z.string().min(32).optional(),
  HISTORY_KEY: z.string().min(32).optional(),
  HISTORY_CHECKPOINTS: z.string().optional(),
  LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).default("info"),
  LOGIN_RATE_LIMIT: z.coerce.number().int().min(1).default(10),
  LOGIN_ACCOUNT_DELAY_AFTER: z.coerce.number().int().min(1).default(5),
  LOGIN_DELAY_MS: z.coerce.number().int().min(1).max(60_000).default(500),
  /** Longest one document may take to lay out, and one export's datasets to gather, in seconds. */
  WORK_TIME_LIMIT_S: z.coerce.number().int().min(5).max(3600).default(120),
  NODE_ENV: z.string().default("development"),
});
