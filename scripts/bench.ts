// npm run bench — measures Reversa's speed targets on a large database it seeds in a temporary folder.
// Nothing here is asserted by the test suite; the numbers go into the closing notes of issues.
// Sizes: BENCH_OBJECTS, BENCH_EVENTS, BENCH_MOUNTINGS; BENCH_RUNS sequential requests per API timing.
// The measured areas live in scripts/bench/, one module each; they run here in this order, on one database.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { benchVerifyChains } from "./bench/chains.ts";
import { benchDocuments } from "./bench/documents.ts";
import { seedBench } from "./bench/fixtures.ts";
import { benchPhotos } from "./bench/photos.ts";
import { benchCalculateRoute, benchPlannerPure } from "./bench/planner.ts";
import { benchRegister } from "./bench/register.ts";
import { benchServerWhileRendering } from "./bench/responsive.ts";
import { startInProcessApp } from "./bench/server.ts";

const OBJECTS = Number(process.env.BENCH_OBJECTS ?? 100_000);
const RUNS = Number(process.env.BENCH_RUNS ?? 200);
const EVENTS = Number(process.env.BENCH_EVENTS ?? 500_000);
const MOUNTED = Number(process.env.BENCH_MOUNTINGS ?? 20_000);

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-bench-"));
const file = path.join(dir, "bench.db");
try {
  const fixtures = await seedBench(file, { objects: OBJECTS, events: EVENTS, mounted: MOUNTED });
  const { database, objectIds, framerId, collectorClientId } = fixtures;
  try {
    const app = await startInProcessApp(file, database);
    try {
      await benchRegister({ base: app.base, runs: RUNS, database, objectIds, framerId });
    } finally {
      app.close();
    }
    benchVerifyChains(database);
    benchPlannerPure();
    await benchCalculateRoute({ file, dir });
    // The photos bench uploads photos of the first object; the dossier below is issued with them.
    await benchPhotos({ dir, file, objectIds, framerId });
    await benchDocuments({ dir, database, objectIds, framerId, collectorClientId });
    // Last: it moves up to 5,000 objects under the collector's client, which changes the register the others read.
    await benchServerWhileRendering({ file, database, collectorClientId });
  } finally {
    database.close();
  }
} finally {
  fs.rmSync(dir, { recursive: true, force: true });
}
