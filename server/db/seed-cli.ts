// npm run db:seed — seeds the demo studio into an empty DATABASE_URL (migrating it first).
import { openDatabase } from "./client.ts";
import { loadConfig } from "../lib/config.ts";
import { seedDemo } from "./seed.ts";

const { databaseUrl } = loadConfig();
const handle = openDatabase(databaseUrl);
const seeded = await seedDemo(handle.db);
handle.close();
console.log(seeded ? `Demo studio seeded into ${databaseUrl}.` : `${databaseUrl} already has users; nothing seeded.`);
