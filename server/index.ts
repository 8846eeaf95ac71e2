import fs from "node:fs";
import { createApp } from "./app.ts";
import { loadConfig } from "./lib/config.ts";
import { historyKeyingFor, resolveAuthSecret } from "./lib/secret.ts";
import { checkpointAllHeads, keyPlainChains, useHistoryKey } from "./features/history/history.chain.ts";
import { openDatabase } from "./db/client.ts";
import { sweepAfterCrash } from "./lib/sweep.ts";
import { DEMO_PASSWORD, DEMO_USERS, seedDemo } from "./db/seed.ts";

const config = loadConfig();
const authSecret = resolveAuthSecret(config.authSecret, config.databaseUrl);
const database = openDatabase(config.databaseUrl);
fs.mkdirSync(config.uploadsDir, { recursive: true });
// The history's key, outside the database; an older database's plain chains are keyed once, then checkpointed.
const keying = historyKeyingFor(config);
useHistoryKey(database.db, keying.historyKey, keying.checkpointsFile);
const keyed = keyPlainChains(database.db, keying.historyKey);
if (keyed && keying.checkpointsFile) checkpointAllHeads(database.db, keying.checkpointsFile, keying.historyKey);
const seeded = config.seedDemo ? await seedDemo(database.db) : false;

const { app, logger } = createApp({ config: { ...config, authSecret, ...keying }, database });
if (keyed) logger.info({ events: keyed }, "history chains keyed with the history key and checkpointed");
// What a crash may have left: half-written files, dead processes' upload folders, files no row names.
const swept = sweepAfterCrash(database.db, config.uploadsDir);
if (swept.incomingRemoved || swept.uploadTempRemoved)
  logger.info({ incoming: swept.incomingRemoved, uploadFolders: swept.uploadTempRemoved }, "removed temporary files left by an earlier run");
if (swept.quarantined.length)
  logger.warn({ files: swept.quarantined.length, folder: swept.quarantineDir }, "stored files that no record names were moved to quarantine; look at them, then delete the folder");
const server = app.listen(config.port, config.host, () => {
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : config.port;
  const url = config.clientDir ? config.publicUrl.replace(`:${config.port}`, `:${port}`) : `http://localhost:${port}/api/health`;
  const lines = ["", `  Reversa is running: open ${url}`, `  Database: ${config.databaseUrl}${seeded ? " (new; demo studio seeded)" : ""}`];
  if (config.seedDemo) {
    lines.push(`  Demo sign-ins (password "${DEMO_PASSWORD}"):`);
    for (const u of DEMO_USERS) lines.push(`    ${u.role.padEnd(10)} ${u.email}`);
  }
  console.log(`${lines.join("\n")}\n`);
});

function shutdown(signal: string) {
  logger.info({ signal }, "shutting down");
  server.close(() => {
    database.close();
    process.exit(0);
  });
  setTimeout(() => process.exit(1), 5000).unref();
}
process.on("SIGINT", () => shutdown("SIGINT"));
process.on("SIGTERM", () => shutdown("SIGTERM"));
