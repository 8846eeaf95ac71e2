import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";

/** A secret from the environment, or else one kept in `name` beside the database file (made on first use, mode 0600). */
function secretBeside(name: string, fromEnv: string | undefined, databaseUrl: string): string {
  if (fromEnv) return fromEnv;
  if (databaseUrl === ":memory:") return randomBytes(32).toString("hex");
  const file = path.join(path.dirname(path.resolve(databaseUrl)), name);
  if (fs.existsSync(file)) return fs.readFileSync(file, "utf8").trim();
  const secret = randomBytes(32).toString("hex");
  fs.mkdirSync(path.dirname(file), { recursive: true });
  fs.writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

/**
 * The session-signing secret: BETTER_AUTH_SECRET when set, otherwise a random one kept
 * beside the database file so sessions survive a restart without any setup.
 */
export function resolveAuthSecret(fromEnv: string | undefined, databaseUrl: string): string {
  return secretBeside(".auth-secret", fromEnv, databaseUrl);
}

/**
 * The key of the history chain (docs: README "History"): HISTORY_KEY when set, otherwise a random one
 * in .history-key beside the database, never inside it. Whoever holds the database but not this key
 * cannot rewrite the history unseen.
 */
export function resolveHistoryKey(fromEnv: string | undefined, databaseUrl: string): Buffer {
  return Buffer.from(secretBeside(".history-key", fromEnv, databaseUrl), "utf8");
}

/** The append-only file of signed history checkpoints, beside the database; null for an in-memory one. */
export function checkpointsFileFor(databaseUrl: string, override?: string): string | null {
  if (override) return path.resolve(override);
  return databaseUrl === ":memory:" ? null : path.join(path.dirname(path.resolve(databaseUrl)), "history-checkpoints.log");
}

/** Opens the history of a database for writing: its key and checkpoints file (scripts and the server alike). */
export type HistoryKeying = { historyKey: Buffer; checkpointsFile: string | null };
export function historyKeyingFor(config: { historyKeyFromEnv?: string; historyCheckpoints?: string; databaseUrl: string }): HistoryKeying {
  return { historyKey: resolveHistoryKey(config.historyKeyFromEnv, config.databaseUrl), checkpointsFile: checkpointsFileFor(config.databaseUrl, config.historyCheckpoints) };
}
