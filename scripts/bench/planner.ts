// The mount planner: the pure computation, and the calculate route under concurrent load.
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import http from "node:http";
import path from "node:path";
import { computePlan } from "../../shared/domain/mount-plan/index.ts";
import { MountPlanInputSchema } from "../../shared/schemas/mount-plan.ts";
import { nth } from "./nth.ts";
import { spawnBenchServer } from "./server.ts";

// ── Mount planner: the pure computation ────────────────────────────────────
/** The first two plans of both benches: an A4 sheet in mm, and an 8 × 10 in sheet fitted to a 16 × 20 in frame. */
const A4_MM = { unit: "mm", sheet: { width: 210, height: 297 }, window: { all: { mode: "overlap", overlap: 5 } }, borders: { all: 50 } };
const INCH_FIT = {
  unit: "in",
  sheet: { width: "8", height: "10" },
  window: { all: { mode: "overlap", overlap: "3/16" } },
  fitOuter: { width: 16, height: 20 },
  bottomWeightPercent: 12,
  glazing: { material: "glass", thickness: "3/32", uvFiltering: true },
};
const PLAN_INPUTS = [
  A4_MM,
  INCH_FIT,
  {
    unit: "mm",
    sheet: { width: 560, height: 760 },
    imageBorders: { left: 25, top: 25, right: 25, bottom: 25 },
    window: {
      left: { mode: "hide-border", border: 25, into: 3 },
      top: { mode: "hide-border", border: 25, into: 3 },
      right: { mode: "hide-border", border: 25, into: 3 },
      bottom: { mode: "float", reveal: 10 },
    },
    borders: { top: 80, side: 80, bottom: 95 },
    doubleMount: { reveal: 5 },
    glazing: { material: "acrylic", thickness: 3 },
    boardSheet: { width: 1120, height: 815 },
    materials: { boardGrade: "museum", attachment: "v-hinge", adhesive: "wheat-starch-paste", hingeCount: 3 },
    object: { objectType: "watercolour", sensitivities: ["light-sensitive"] },
  },
].map((i) => MountPlanInputSchema.parse(i));

export function benchPlannerPure() {
  const ctx = { minOverlapMm: 5, rebateClearanceMm: 2 };
  for (let i = 0; i < 2000; i++) computePlan(nth(PLAN_INPUTS, i % 3), ctx);
  const N = 30_000;
  const tp = performance.now();
  for (let i = 0; i < N; i++) computePlan(nth(PLAN_INPUTS, i % 3), ctx);
  const perSec = N / ((performance.now() - tp) / 1000);
  console.log(`\nMount plan computation (pure, 3 kinds of plan, one with board yield): ${Math.round(perSec).toLocaleString("en-GB")} plans/s`);
}

// ── Mount planner: the calculate route under 16 concurrent requests ────────
// The server runs in its own process, so the load generator does not share its event loop.
export async function benchCalculateRoute({ file, dir }: { file: string; dir: string }) {
  const calcServer = await spawnBenchServer(file);
  const childBase = calcServer.base;
  const childCookie = calcServer.cookie;
  const agent = new http.Agent({ keepAlive: true, maxSockets: 16 });
  const bodies = PLAN_INPUTS.map((_, i) =>
    JSON.stringify(
      [
        A4_MM,
        INCH_FIT,
        {
          unit: "mm",
          sheet: { width: 560, height: 760 },
          window: { all: { mode: "overlap", overlap: 6 } },
          borders: { top: 80, side: 80, bottom: 95 },
          doubleMount: { reveal: 5 },
          glazing: { material: "acrylic", thickness: 3 },
          boardSheet: { width: 1120, height: 815 },
        },
      ][i],
    ),
  );
  function post(body: string): Promise<number> {
    return new Promise((resolve, reject) => {
      const t = performance.now();
      const req = http.request(
        `${childBase}/api/mount-plans/calculate`,
        { method: "POST", agent, headers: { "content-type": "application/json", origin: childBase, cookie: childCookie, "content-length": Buffer.byteLength(body) } },
        (res) => {
          res.resume();
          res.on("end", () => (res.statusCode === 200 ? resolve(performance.now() - t) : reject(new Error(`calculate answered ${res.statusCode}`))));
        },
      );
      req.on("error", reject);
      req.end(body);
    });
  }
  const CONCURRENCY = 16;
  const PER_WORKER = 250;
  for (let i = 0; i < 200; i++) await post(nth(bodies, i % 3));
  const latencies: number[] = [];
  const tl = performance.now();
  await Promise.all(
    Array.from({ length: CONCURRENCY }, async (_, w) => {
      for (let i = 0; i < PER_WORKER; i++) latencies.push(await post(nth(bodies, (w + i) % 3)));
    }),
  );
  const elapsed = (performance.now() - tl) / 1000;
  latencies.sort((a, b) => a - b);
  const q = (x: number) => nth(latencies, Math.min(latencies.length - 1, Math.floor(x * latencies.length))).toFixed(2);
  console.log(
    `POST /api/mount-plans/calculate, ${CONCURRENCY} concurrent, ${latencies.length} requests: p50 ${q(0.5)} ms   p95 ${q(0.95)} ms   (${Math.round(latencies.length / elapsed)} req/s)`,
  );
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
  await calcServer.stop();
}
