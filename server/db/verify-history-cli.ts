// npm run verify-history — checks every object's history in DATABASE_URL: the keyed hash chain (with
// HISTORY_KEY or .history-key beside the database) and the signed checkpoints file beside it. Names the
// first break and exits 1; exits 0 when both check out.
import fs from "node:fs";
import { openDatabase } from "./client.ts";
import { loadConfig } from "../lib/config.ts";
import { checkpointsFileFor } from "../lib/secret.ts";
import { verifyChains, verifyCheckpoints } from "../features/history/history.chain.ts";
import path from "node:path";

const { databaseUrl, historyKeyFromEnv, historyCheckpoints } = loadConfig();
if (!fs.existsSync(databaseUrl)) {
  console.error(`There is no database at ${databaseUrl}; set DATABASE_URL to the file to check.`);
  process.exit(2);
}
const keyFile = path.join(path.dirname(path.resolve(databaseUrl)), ".history-key");
if (!historyKeyFromEnv && !fs.existsSync(keyFile)) {
  console.error(`There is no history key: set HISTORY_KEY, or put .history-key beside ${databaseUrl} (from the backup).`);
  process.exit(2);
}
const key = Buffer.from(historyKeyFromEnv ?? fs.readFileSync(keyFile, "utf8").trim(), "utf8");
const handle = openDatabase(databaseUrl, { migrate: false });
const verdict = verifyChains(handle.db, undefined, key);
const checkpoints = checkpointsFileFor(databaseUrl, historyCheckpoints);
const cp = verdict.ok && checkpoints ? verifyCheckpoints(handle.db, checkpoints, key) : null;
handle.close();
if (!verdict.ok) {
  const b = verdict.brokenAt;
  console.error(`History broken at event ${b.seq} (object ${b.objectId}): ${b.reason}. ${verdict.checked} events before it check out.`);
  process.exit(1);
}
if (cp && !cp.ok) {
  console.error(`History checkpoints disagree at line ${cp.line} of ${checkpoints}${cp.objectId ? ` (object ${cp.objectId})` : ""}: ${cp.reason}.`);
  process.exit(1);
}
console.log(`History intact: ${verdict.checked} events checked in ${databaseUrl}${cp ? `, and ${cp.checked} objects' checkpointed heads agree` : ""}.`);
