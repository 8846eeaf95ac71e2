// npm run db:migrate — applies drizzle/ migrations to DATABASE_URL.
import { openDatabase } from "./client.ts";
import { loadConfig } from "../lib/config.ts";

const { databaseUrl } = loadConfig();
openDatabase(databaseUrl).close();
console.log(`Migrations applied to ${databaseUrl}.`);
