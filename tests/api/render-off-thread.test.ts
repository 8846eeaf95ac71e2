import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { randomBytes } from "node:crypto";
import { createElement } from "react";
import { Document, Page, View } from "@react-pdf/renderer";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openDatabase } from "../../server/db/client.ts";
import { makeClient, makeObject } from "../../server/db/factories.ts";
import { DEMO_PASSWORD, seedDemo } from "../../server/db/seed.ts";
import { useHistoryKey } from "../../server/features/history/history.chain.ts";
import { Text } from "../../server/lib/pdf/text.tsx";
import { closeRenderPool, renderPdf, renderPoolStats, RENDER_THREADS } from "../../server/features/documents/render-pool.ts";
import { signInCookie, startServer, type RunningServer } from "../../scripts/lib/spawn-server.ts";
import { at } from "../setup/lists.ts";

afterAll(closeRenderPool);

/** A document of `rows` lines, heavy enough to take a worker a while to lay out. */
const heavy = (rows: number) =>
  createElement(
    Document,
    null,
    createElement(
      Page,
      { size: "A4", style: { padding: 40, fontFamily: "Libre Franklin" } },
      ...Array.from({ length: rows }, (_, i) =>
        createElement(View, { key: i }, createElement(Text, { style: { fontSize: 9 } }, `Row ${i}: a line of a long schedule, wrapping onto its page`)),
      ),
    ),
  );

describe("documents are laid out in worker threads", () => {
  it("when a document takes longer than its time limit, then the worker is stopped and it is refused with a clear 503", async () => {
    await expect(renderPdf(heavy(3000) as never, { timeoutMs: 1 })).rejects.toMatchObject({ status: 503, code: "unavailable", message: expect.stringMatching(/took too long/) });
    // The pool goes on: the next document renders.
    const { pdf, pages } = await renderPdf(heavy(3) as never);
    expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    expect(pages).toBe(1);
  });

  it(`when many documents are asked for at once, then at most ${RENDER_THREADS} are laid out at a time and all arrive`, async () => {
    const seen: number[] = [];
    const all = Promise.all(Array.from({ length: 6 }, () => renderPdf(heavy(200) as never)));
    const watch = setInterval(() => seen.push(renderPoolStats().threads), 5);
    const pdfs = await all;
    clearInterval(watch);
    expect(pdfs.every((p) => p.pdf.subarray(0, 5).toString("latin1") === "%PDF-")).toBe(true);
    expect(Math.max(...seen)).toBeLessThanOrEqual(RENDER_THREADS);
  });
});

describe("the server keeps answering while the heaviest document renders", () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-heavy-"));
  const key = randomBytes(32).toString("hex");
  let server: RunningServer;
  let clientId: string;
  beforeAll(async () => {
    // 5,000 valued objects: the most a schedule of values takes (ScheduleBodySchema), seeded before the server starts.
    const h = openDatabase(path.join(dir, "reversa.db"));
    useHistoryKey(h.db, Buffer.from(key, "utf8"), null);
    await seedDemo(h.db);
    clientId = makeClient(h.db, { kind: "institution", name: "Heavy collection trust" }).id;
    h.sqlite.transaction(() => {
      for (let i = 0; i < 5000; i++)
        makeObject(h.db, clientId, {
          objectNumber: `HV-${String(i).padStart(5, "0")}`,
          title: `Harbour study ${i}`,
          valuationMinor: 1000 + i,
          valuationCurrency: "GBP",
          valuationDate: "2026-01-01",
          valuationBasis: "agreed",
        } as never);
    })();
    h.close();
    // The time limit is raised: this test is about the server answering while a long render runs, and on a
    // loaded machine the 5,000-object schedule may take longer than the default 120 s.
    server = await startServer({ SEED_DEMO: "false", HISTORY_KEY: key, WORK_TIME_LIMIT_S: "3600" }, dir);
  });
  afterAll(async () => {
    await server?.stop();
    fs.rmSync(dir, { recursive: true, force: true });
  });

  it("when a 5,000-object schedule is being made, then health checks and the register are answered before it is done", async () => {
    const cookie = await signInCookie(server.baseUrl, "admin@reversa.test", DEMO_PASSWORD);
    let done = false;
    const schedule = fetch(`${server.baseUrl}/api/clients/${clientId}/documents/schedule`, {
      method: "POST",
      headers: { cookie, origin: server.baseUrl, "content-type": "application/json" },
      body: "{}",
    }).then(async (r) => {
      const body = Buffer.from(await r.arrayBuffer());
      done = true;
      return { status: r.status, body };
    });
    const answeredWhileRendering: number[] = [];
    const latencies: number[] = [];
    while (!done) {
      const t0 = performance.now();
      const [health, register] = await Promise.all([fetch(`${server.baseUrl}/api/health`), fetch(`${server.baseUrl}/api/objects?pageSize=50`, { headers: { cookie } })]);
      latencies.push(performance.now() - t0);
      expect(health.status).toBe(200);
      expect(register.status).toBe(200);
      await register.arrayBuffer();
      if (!done) answeredWhileRendering.push(latencies.length);
      await new Promise((r) => setTimeout(r, 20));
    }
    const res = await schedule;
    expect(res.status).toBe(200);
    expect(res.body.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    // Laid out on the request thread, nothing else would be answered until it was done.
    expect(answeredWhileRendering.length).toBeGreaterThan(5);
    latencies.sort((a, b) => a - b);
    console.info(
      `while the 5,000-object schedule rendered: ${latencies.length} health + register pairs, median ${at(latencies, Math.floor(latencies.length / 2)).toFixed(0)} ms, slowest ${latencies.at(-1)!.toFixed(0)} ms`,
    );
  }, 900_000);
});
