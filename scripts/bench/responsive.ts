import type { DbHandle } from "../../server/db/client.ts";
import { spawnBenchServer } from "./server.ts";

// ── The server keeps answering while the heaviest document is laid out ──────
// A schedule of values of one client's whole collection (the most the contract allows is 5,000 objects),
// while health and a register page are asked for every 20 ms: their latency is the request thread's pause.
export async function benchServerWhileRendering(opts: { file: string; database: DbHandle; collectorClientId: string }) {
  const { sqlite } = opts.database;
  const heavyClient = opts.collectorClientId;
  // Gather 5,000 objects (or all there are) under one client: the largest schedule ScheduleBodySchema allows.
  sqlite
    .prepare("update objects set client_id = ? where id in (select id from objects where client_id != ? limit max(0, 5000 - (select count(*) from objects where client_id = ?)))")
    .run(heavyClient, heavyClient, heavyClient);
  const count = (sqlite.prepare("select count(*) n from objects where client_id = ?").get(heavyClient) as { n: number }).n;
  const server = await spawnBenchServer(opts.file);
  const headers = { cookie: server.cookie, origin: server.base, "content-type": "application/json" };
  /** Runs `request` and meanwhile asks for health and a register page every 20 ms; their latency is the request thread's pause. */
  const probeWhile = async (what: string, request: () => Promise<Response>) => {
    const t = performance.now();
    let done = false;
    const answer = request().then(async (r) => {
      await r.arrayBuffer();
      done = true;
      return r.status;
    });
    const lat: number[] = [];
    while (!done) {
      const t1 = performance.now();
      await Promise.all([
        fetch(`${server.base}/api/health`).then((r) => r.arrayBuffer()),
        fetch(`${server.base}/api/objects?pageSize=50`, { headers }).then((r) => r.arrayBuffer()),
      ]);
      lat.push(performance.now() - t1);
      await new Promise((r) => setTimeout(r, 20));
    }
    const status = await answer;
    const took = performance.now() - t;
    lat.sort((a, b) => a - b);
    const worst = lat.at(-1) ?? 0;
    console.log(
      `${what}: ${status} in ${(took / 1000).toFixed(1)} s; meanwhile ${lat.length} health + register pairs, median ${(lat[Math.floor(lat.length / 2)] ?? 0).toFixed(0)} ms, worst ${worst.toFixed(0)} ms   (target < 100 ms ${worst < 100 ? "✓" : "✕ over target"})`,
    );
  };
  console.log("");
  await probeWhile(`Schedule of values of ${count.toLocaleString("en-GB")} objects through the server`, () =>
    fetch(`${server.base}/api/clients/${heavyClient}/documents/schedule`, { method: "POST", headers, body: "{}" }),
  );
  // The same client's datasets, gathered in the export worker (an archive gathers all of them the same way).
  for (const dataset of ["objects", "mountings"]) {
    await probeWhile(`${dataset}.csv of the same ${count.toLocaleString("en-GB")} objects`, () =>
      fetch(`${server.base}/api/clients/${heavyClient}/exports/${dataset}.csv`, { headers }),
    );
  }
  await server.stop();
}
