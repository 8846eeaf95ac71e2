import fs from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { signInCookie, startServer, type RunningServer } from "../../scripts/lib/spawn-server.ts";
import { DEMO_PASSWORD } from "../../server/db/seed.ts";

// The real server in its own process, so its memory and its answers are measured as a client sees them.
let server: RunningServer;
let cookie: string;
beforeAll(async () => {
  server = await startServer({ SEED_DEMO: "true" });
  cookie = await signInCookie(server.baseUrl, "framer@reversa.test", DEMO_PASSWORD);
});
afterAll(async () => {
  await server?.stop();
  if (server) fs.rmSync(server.dir, { recursive: true, force: true });
});

const post = (url: string, body: unknown) =>
  fetch(`${server.baseUrl}${url}`, { method: "POST", headers: { "content-type": "application/json", cookie, origin: server.baseUrl }, body: JSON.stringify(body) });

// Bounds: docs/trade.md §10. The heaviest plans the bounds allow, and values past them.
const A4 = { unit: "mm", sheet: { width: 210, height: 297 }, window: { all: { mode: "overlap", overlap: 5 } } };
const HEAVIEST_PLAN = {
  ...A4,
  sheet: { width: 5, height: 5 },
  window: { all: { mode: "float", reveal: 0 } },
  borders: { all: 0 },
  boardSheet: { width: 3000, height: 3000 },
  kerf: 0,
};
const HEAVIEST_CUT = {
  unit: "mm",
  boardSheet: { width: 3000, height: 3000 },
  kerf: 0,
  pieces: Array.from({ length: 4 }, (_, i) => ({ id: `p${i}`, width: 5 + i, height: 5, quantity: 500 })),
};
const PAST_BOUNDS = [
  { ...A4, boardSheet: { width: 1e15, height: 1e15 } },
  { ...A4, unit: "in", sheet: { width: "99999999999999999999 1/2", height: 8 } },
  { ...A4, unit: "in", sheet: { width: String(Number.MAX_VALUE), height: "1e308" } },
  { ...A4, unit: "in", sheet: { width: "1/0", height: "-0" } },
  { ...A4, sheet: { width: 210, height: 297 }, borders: { all: 1e300 } },
];

describe("one request cannot stall or kill the server", () => {
  it("when the planner and the cutting list are flooded with the heaviest values allowed and values past every bound, then each answers 200 or 422, memory stays flat and the server keeps answering", async () => {
    // Warm up once, then take the baseline.
    await (await post("/api/mount-plans/calculate", HEAVIEST_PLAN)).text();
    await (await post("/api/mount-plans/cutting-list", HEAVIEST_CUT)).text();
    const before = server.rssMb();
    const statuses: number[] = [];
    for (let round = 0; round < 6; round++) {
      const batch = [
        ...Array.from({ length: 8 }, () => post("/api/mount-plans/calculate", HEAVIEST_PLAN)),
        ...Array.from({ length: 2 }, () => post("/api/mount-plans/cutting-list", HEAVIEST_CUT)),
        ...PAST_BOUNDS.map((b) => post("/api/mount-plans/calculate", b)),
        post("/api/mount-plans/cutting-list", { ...HEAVIEST_CUT, pieces: [{ id: "x", width: 1e12, height: 1e12, quantity: 500 }] }),
      ];
      for (const r of await Promise.all(batch)) {
        statuses.push(r.status);
        await r.text();
      }
      // Between rounds the server still answers its health check.
      expect((await fetch(`${server.baseUrl}/api/health`)).status).toBe(200);
    }
    expect(
      statuses.filter((s) => s !== 200 && s !== 422),
      server.output(),
    ).toEqual([]);
    expect(statuses.filter((s) => s === 422).length).toBe(6 * (PAST_BOUNDS.length + 1));
    // Memory: what a flood leaves behind, not a speed. 150 MB is far above one heavy answer's size.
    const growth = server.rssMb() - before;
    expect(growth, `grew ${growth.toFixed(0)} MB`).toBeLessThan(150);
    expect(server.child.exitCode).toBeNull();
  });
});
