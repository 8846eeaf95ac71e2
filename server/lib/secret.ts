import { randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";

/**
 * The session-signing secret: BETTER_AUTH_SECRET when set, otherwise a random one kept
 * beside the database file so sessions survive a restart without any setup.
 */
export function resolveAuthSecret(fromEnv: string | undefined, databaseUrl: string): string {
  if (fromEnv) return fromEnv;
  if (databaseUrl === ":memory:") return randomBytes(32).toString("hex");
  const file = path.join(path.dirname(path.resolve(databaseUrl)), ".auth-secret");
  if (fs.existsSync(file)) return fs.readFileSync(file, "utf8").trim();
  const secret = randomBytes(32).toString("hex");
  fs.mkdirSync(path.dirname(file), { recursive: true });
  fs.writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}
