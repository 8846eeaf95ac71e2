// npm run bench — measures Reversa's speed targets on a large database it seeds in a temporary folder.
// Nothing here is asserted by the test suite; the numbers go into the closing notes of issues.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { randomUUID } from "node:crypto";
import type { AddressInfo } from "node:net";
import { createApp } from "../server/app.ts";
import { loadConfig } from "../server/lib/config.ts";
import { openDatabase } from "../server/db/client.ts";
import { makeClient, makeUser } from "../server/db/factories.ts";
import { spawn, spawnSync } from "node:child_process";
import http from "node:http";
import net from "node:net";
import { computePlan } from "../shared/domain/mount-plan/index.ts";
import { MountPlanInputSchema } from "../shared/schemas/mount-plan.ts";

const OBJECTS = Number(process.env.BENCH_OBJECTS ?? 100_000);
const RUNS = Number(process.env.BENCH_RUNS ?? 200);

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-bench-"));
const file = path.join(dir, "bench.db");
const database = openDatabase(file);
const { db, sqlite } = database;

console.log(`Seeding ${OBJECTS.toLocaleString("en-GB")} objects into ${file} …`);
const t0 = performance.now();
const clients = Array.from({ length: 40 }, (_, i) => makeClient(db, { kind: i % 4 === 0 ? "institution" : "private", name: `Bench client ${i + 1}` }));
await makeUser(db, { email: "framer@bench.test", name: "Bench framer", role: "framer", password: "bench-password" });
await makeUser(db, { email: "collector@bench.test", name: "Bench collector", role: "collector", clientId: clients[3].id, password: "bench-password" });
const WORDS = "estuary harbour garden pear fern heron meadow lake map rose hawthorn sampler hands orchard tram birch pebbles poster deed crew tide fleet nets quay".split(" ");
const MAKERS = ["Ilse Korrow", "Amadou Fenn", "Hollis Dray", "Cordelia Vane", "Anselm Toller", "Odran Keyes", "Unknown maker", "Ruth Calloway-Ng"];
const TYPES = ["print", "drawing", "watercolour", "pastel", "photograph", "document"];
const STATUSES = ["in-studio", "with-owner", "on-loan", "with-conservator"];
const insert = sqlite.prepare(
  `insert into objects (id, object_number, title, maker, object_type, sheet_width_mm, sheet_height_mm, client_id, status, sensitivities, valuation_minor, valuation_currency)
   values (?, ?, ?, ?, ?, ?, ?, ?, ?, '[]', ?, 'GBP')`,
);
sqlite.transaction(() => {
  for (let i = 0; i < OBJECTS; i++) {
    const w = (k: number) => WORDS[(i * 7 + k * 13) % WORDS.length];
    insert.run(
      randomUUID(),
      `${2000 + (i % 27)}-${String(i).padStart(6, "0")}`,
      `${w(1)} ${w(2)} study ${i}`,
      MAKERS[i % MAKERS.length],
      TYPES[i % TYPES.length],
      150 + (i % 600),
      200 + (i % 700),
      clients[i % clients.length].id,
      STATUSES[i % STATUSES.length],
      (i % 1000) * 1000,
    );
  }
})();
sqlite.pragma("optimize");
console.log(`Seeded in ${((performance.now() - t0) / 1000).toFixed(1)} s.`);

const config = { ...loadConfig({ LOG_LEVEL: "silent", LOGIN_RATE_LIMIT: "1000", DATABASE_URL: file, NODE_ENV: "test" }), authSecret: "bench-secret-bench-secret-bench-secret-0000" };
const { app } = createApp({ config, database });
const server = app.listen(0, "127.0.0.1");
await new Promise((r) => server.once("listening", r));
const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;

async function cookieFor(email: string) {
  const r = await fetch(`${base}/api/session`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ email, password: "bench-password" }) });
  if (!r.ok) throw new Error(`sign-in failed: ${r.status}`);
  return r.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
}

async function measure(label: string, url: string, cookie: string) {
  const times: number[] = [];
  for (let i = 0; i < RUNS + 10; i++) {
    const t = performance.now();
    const r = await fetch(base + url, { headers: { cookie } });
    await r.arrayBuffer();
    if (!r.ok) throw new Error(`${url} answered ${r.status}`);
    if (i >= 10) times.push(performance.now() - t);
  }
  times.sort((a, b) => a - b);
  const p = (q: number) => times[Math.min(times.length - 1, Math.floor(q * times.length))].toFixed(1);
  console.log(`${label.padEnd(44)} p50 ${p(0.5).padStart(6)} ms   p95 ${p(0.95).padStart(6)} ms`);
}

const framer = await cookieFor("framer@bench.test");
const collector = await cookieFor("collector@bench.test");
const firstId = (sqlite.prepare("select id from objects limit 1 offset 5000").get() as { id: string }).id;
console.log(`\nAPI on loopback, ${RUNS} sequential requests each:`);
await measure("register, first page (50)", "/api/objects", framer);
await measure("register, search 'harbour hero'", "/api/objects?q=harbour%20hero", framer);
await measure("register, search by object number", "/api/objects?q=2013-004321", framer);
await measure("register, filter status + type", "/api/objects?status=on-loan&objectType=pastel", framer);
await measure("register, sort by title desc, page 100", "/api/objects?sort=title&dir=desc&page=100", framer);
await measure("register, collector's own objects", "/api/objects", collector);
await measure("object page: GET /api/objects/:id", `/api/objects/${firstId}`, framer);

server.close();

// ── Mount planner: the pure computation ────────────────────────────────────
const PLAN_INPUTS = [
  { unit: "mm", sheet: { width: 210, height: 297 }, window: { all: { mode: "overlap", overlap: 5 } }, borders: { all: 50 } },
  { unit: "in", sheet: { width: "8", height: "10" }, window: { all: { mode: "overlap", overlap: "3/16" } }, fitOuter: { width: 16, height: 20 }, bottomWeightPercent: 12, glazing: { material: "glass", thickness: "3/32", uvFiltering: true } },
  { unit: "mm", sheet: { width: 560, height: 760 }, imageBorders: { left: 25, top: 25, right: 25, bottom: 25 }, window: { left: { mode: "hide-border", border: 25, into: 3 }, top: { mode: "hide-border", border: 25, into: 3 }, right: { mode: "hide-border", border: 25, into: 3 }, bottom: { mode: "float", reveal: 10 } }, borders: { top: 80, side: 80, bottom: 95 }, doubleMount: { reveal: 5 }, glazing: { material: "acrylic", thickness: 3 }, boardSheet: { width: 1120, height: 815 }, materials: { boardGrade: "museum", attachment: "v-hinge", adhesive: "wheat-starch-paste", hingeCount: 3 }, object: { objectType: "watercolour", sensitivities: ["light-sensitive"] } },
].map((i) => MountPlanInputSchema.parse(i));
const ctx = { minOverlapMm: 5, rebateClearanceMm: 2 };
for (let i = 0; i < 2000; i++) computePlan(PLAN_INPUTS[i % 3], ctx);
const N = 30_000;
const tp = performance.now();
for (let i = 0; i < N; i++) computePlan(PLAN_INPUTS[i % 3], ctx);
const perSec = N / ((performance.now() - tp) / 1000);
console.log(`\nMount plan computation (pure, 3 kinds of plan, one with board yield): ${Math.round(perSec).toLocaleString("en-GB")} plans/s`);

// ── Mount planner: the calculate route under 16 concurrent requests ────────
// The server runs in its own process, so the load generator does not share its event loop.
const port = await new Promise<number>((resolve) => {
  const s = net.createServer().listen(0, "127.0.0.1", () => {
    const p = (s.address() as AddressInfo).port;
    s.close(() => resolve(p));
  });
});
const child = spawn(process.execPath, ["--import", "tsx", "server/index.ts"], {
  env: { ...process.env, NODE_ENV: "test", PORT: String(port), HOST: "127.0.0.1", DATABASE_URL: file, SEED_DEMO: "false", LOG_LEVEL: "silent", LOGIN_RATE_LIMIT: "1000", BETTER_AUTH_SECRET: config.authSecret },
  stdio: ["ignore", "ignore", "inherit"],
});
const childBase = `http://127.0.0.1:${port}`;
for (let i = 0; ; i++) {
  try {
    if ((await fetch(`${childBase}/api/health`)).ok) break;
  } catch {
    /* starting */
  }
  if (i > 150) throw new Error("bench server did not start");
  await new Promise((r) => setTimeout(r, 100));
}
const childCookie = await (async () => {
  const r = await fetch(`${childBase}/api/session`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ email: "framer@bench.test", password: "bench-password" }) });
  return r.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
})();
const agent = new http.Agent({ keepAlive: true, maxSockets: 16 });
const bodies = PLAN_INPUTS.map((_, i) => JSON.stringify([
  { unit: "mm", sheet: { width: 210, height: 297 }, window: { all: { mode: "overlap", overlap: 5 } }, borders: { all: 50 } },
  { unit: "in", sheet: { width: "8", height: "10" }, window: { all: { mode: "overlap", overlap: "3/16" } }, fitOuter: { width: 16, height: 20 }, bottomWeightPercent: 12, glazing: { material: "glass", thickness: "3/32", uvFiltering: true } },
  { unit: "mm", sheet: { width: 560, height: 760 }, window: { all: { mode: "overlap", overlap: 6 } }, borders: { top: 80, side: 80, bottom: 95 }, doubleMount: { reveal: 5 }, glazing: { material: "acrylic", thickness: 3 }, boardSheet: { width: 1120, height: 815 } },
][i]));
function post(body: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const t = performance.now();
    const req = http.request(`${childBase}/api/mount-plans/calculate`, { method: "POST", agent, headers: { "content-type": "application/json", cookie: childCookie, "content-length": Buffer.byteLength(body) } }, (res) => {
      res.resume();
      res.on("end", () => (res.statusCode === 200 ? resolve(performance.now() - t) : reject(new Error(`calculate answered ${res.statusCode}`))));
    });
    req.on("error", reject);
    req.end(body);
  });
}
const CONCURRENCY = 16;
const PER_WORKER = 250;
for (let i = 0; i < 200; i++) await post(bodies[i % 3]);
const latencies: number[] = [];
const tl = performance.now();
await Promise.all(
  Array.from({ length: CONCURRENCY }, async (_, w) => {
    for (let i = 0; i < PER_WORKER; i++) latencies.push(await post(bodies[(w + i) % 3]));
  }),
);
const elapsed = (performance.now() - tl) / 1000;
latencies.sort((a, b) => a - b);
const q = (x: number) => latencies[Math.min(latencies.length - 1, Math.floor(x * latencies.length))].toFixed(2);
console.log(`POST /api/mount-plans/calculate, ${CONCURRENCY} concurrent, ${latencies.length} requests: p50 ${q(0.5)} ms   p95 ${q(0.95)} ms   (${Math.round(latencies.length / elapsed)} req/s)`);
agent.destroy();

// The same load from wrk (Debian's package), a much lighter load generator, when it is installed.
const wrk = spawnSync("sh", ["-c", "command -v wrk"], { encoding: "utf8" }).stdout.trim();
if (wrk) {
  const lua = path.join(dir, "calc.lua");
  fs.writeFileSync(
    lua,
    `wrk.method = "POST"\nwrk.body = [[${bodies[2]}]]\nwrk.headers["content-type"] = "application/json"\nwrk.headers["cookie"] = [[${childCookie}]]\n` +
      `done = function(s, l, r) io.write(string.format("RESULT %.2f %.2f %.0f %d\\n", l:percentile(50)/1000, l:percentile(95)/1000, s.requests/(s.duration/1e6), s.errors.status)) end\n`,
  );
  const out = spawnSync(wrk, ["-t1", `-c${CONCURRENCY}`, "-d8s", "-s", lua, `${childBase}/api/mount-plans/calculate`], { encoding: "utf8" }).stdout;
  const m = out.match(/RESULT ([\d.]+) ([\d.]+) (\d+) (\d+)/);
  if (m) console.log(`  same route under wrk, ${CONCURRENCY} connections, 8 s: p50 ${m[1]} ms   p95 ${m[2]} ms   (${m[3]} req/s, ${m[4]} non-2xx)`);
} else console.log("  (install Debian's wrk for a lighter load generator: apt-get install wrk)");
child.kill("SIGTERM");
await new Promise((r) => child.once("exit", r));

database.close();
fs.rmSync(dir, { recursive: true, force: true });
