// npm run verify-history — recomputes every object's hash chain in DATABASE_URL and names the first broken link.
import { openDatabase } from "./client.ts";
import { loadConfig } from "../lib/config.ts";
import { verifyChains } from "../features/history/history.chain.ts";

const { databaseUrl } = loadConfig();
const handle = openDatabase(databaseUrl);
const verdict = verifyChains(handle.db);
handle.close();
if (verdict.ok) {
  console.log(`History intact: ${verdict.checked} events checked in ${databaseUrl}.`);
} else {
  const b = verdict.brokenAt;
  console.error(`History broken at event ${b.seq} (object ${b.objectId}): ${b.reason}. ${verdict.checked} events before it check out.`);
  process.exit(1);
}
