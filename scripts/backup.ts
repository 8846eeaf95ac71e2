// `npm run backup [-- <folder>]`: a consistent copy of the database, the uploads and the secrets while
// Reversa runs, with a manifest of SHA-256 hashes (server/lib/backup.ts). Reads DATABASE_URL and UPLOADS_DIR.
import path from "node:path";
import { loadConfig } from "../server/lib/config.ts";
import { backup } from "../server/lib/backup.ts";
import { checkpointsFileFor } from "../server/lib/secret.ts";

const config = loadConfig();
const to = process.argv[2] ?? path.join("backups", `reversa-${new Date().toISOString().replace(/[:.]/g, "-")}`);
try {
  const checkpointsFile = checkpointsFileFor(config.databaseUrl, config.historyCheckpoints);
  const m = await backup({ databaseUrl: config.databaseUrl, uploadsDir: config.uploadsDir, to, checkpointsFile });
  const bytes = m.files.reduce((n, f) => n + f.bytes, 0);
  console.log(`Backup written to ${path.resolve(to)}: ${m.files.length} files, ${(bytes / 1048576).toFixed(1)} MB, each listed with its SHA-256 in manifest.json.`);
  // Secrets given through the environment are not in any file this script can copy: say so, every time.
  const fromEnv = [config.authSecret && "BETTER_AUTH_SECRET", config.historyKeyFromEnv && "HISTORY_KEY"].filter(Boolean);
  if (fromEnv.length)
    console.log(
      `Note: ${fromEnv.join(" and ")} come${fromEnv.length === 1 ? "s" : ""} from the environment and ${fromEnv.length === 1 ? "is" : "are"} not in this backup. Keep ${fromEnv.length === 1 ? "it" : "them"} safe yourself: without HISTORY_KEY the restored history cannot be verified.`,
    );
} catch (e) {
  console.error(`Backup failed: ${e instanceof Error ? e.message : String(e)}`);
  process.exit(1);
}
