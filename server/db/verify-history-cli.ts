// npm run verify-history — recomputes every object's hash chain in DATABASE_URL and names the first broken link.
import { openDatabase } from "./client.ts";
import { loadConfig } from "../lib/config.ts";
import { verifyChains } from "../features/history/history.chain.ts";

import fs from "node:fs";

const { databaseUrl } = loadConfig();
if (!fs.existsSync(databaseUrl)) {
  console.error(`There is no database at ${databaseUrl}; set DATABASE_URL to the file to check.`);
  process.exit(2);
}
const handle = openDatabase(databaseUrl, { migrate: false });
const verdict = verifyChains(handle.db);
handle.close();
if (verdict.ok) {
  console.log(`History intact: ${verdict.checked} events checked in ${databaseUrl}.`);
} else {
  const b = verdict.brokenAt;
  console.error(`History broken at event ${b.seq} (object ${b.objectId}): ${b.reason}. ${verdict.checked} events before it check out.`);
  process.exit(1);
}
