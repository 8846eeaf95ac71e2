// npm run db:seed — seeds the demo studio into an empty DATABASE_URL (migrating it first).
import { openDatabase } from "./client.ts";
import { loadConfig } from "../lib/config.ts";
import { seedDemo } from "./seed.ts";
import { historyKeyingFor } from "../lib/secret.ts";
import { useHistoryKey } from "../features/history/history.chain.ts";

const config = loadConfig();
const { databaseUrl } = config;
const handle = openDatabase(databaseUrl);
const keying = historyKeyingFor(config);
useHistoryKey(handle.db, keying.historyKey, keying.checkpointsFile);
const seeded = await seedDemo(handle.db);
handle.close();
console.log(seeded ? `Demo studio seeded into ${databaseUrl}.` : `${databaseUrl} already has users; nothing seeded.`);
