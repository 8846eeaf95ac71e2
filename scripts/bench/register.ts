// The register and the object page through the in-process app: sequential GETs, p50 and p95 of each.
import type { DbHandle } from "../../server/db/client.ts";
import { cookieFor, measure } from "./server.ts";

export async function benchRegister(opts: { base: string; runs: number; database: DbHandle; objectIds: string[]; framerId: string }) {
  const { base, runs, objectIds, framerId } = opts;
  const { sqlite } = opts.database;
  const m = (label: string, url: string, cookie: string) => measure(base, runs, label, url, cookie);
  const framer = await cookieFor(base, "framer@bench.test");
  const collector = await cookieFor(base, "collector@bench.test");
  // An object from the middle of the seeded ones, there for any BENCH_OBJECTS (offset 5000 was past the end below 5,000).
  const firstId = (sqlite.prepare("select id from objects limit 1 offset ?").get(Math.floor(objectIds.length / 2)) as { id: string }).id;
  console.log(`\nAPI on loopback, ${runs} sequential requests each:`);
  await m("register, first page (50)", "/api/objects", framer);
  await m("register, search 'harbour hero'", "/api/objects?q=harbour%20hero", framer);
  await m("register, search by object number", "/api/objects?q=2013-004321", framer);
  await m("register, filter status + type", "/api/objects?status=on-loan&objectType=pastel", framer);
  await m("register, sort by title desc, page 100", "/api/objects?sort=title&dir=desc&page=100", framer);
  await m("register, collector's own objects", "/api/objects", collector);
  await m("object page: GET /api/objects/:id", `/api/objects/${firstId}`, framer);

  // ── The object page, for an object with a current mount, a superseded one, a corrected revision and 200 events ──
  const mountedId = objectIds[0];
  const today = new Date().toISOString().slice(0, 10);
  const dueToday = (sqlite.prepare("select count(*) as n from objects where check_due_on <= ?").get(today) as { n: number }).n;
  console.log(`(${dueToday.toLocaleString("en-GB")} objects are due for a check today; the object page is read for one with two mountings, a corrected revision and 200 events.)`);
  console.log(`\nObject page (its API calls), register with mount columns, mountings register:`);
  await m("object page: GET /api/objects/:id (mounted)", `/api/objects/${mountedId}`, framer);
  await m("object page: …/mountings", `/api/objects/${mountedId}/mountings`, framer);
  await m("object page: …/history?limit=50", `/api/objects/${mountedId}/history?limit=50`, framer);
  await m("object page: …/plan", `/api/objects/${mountedId}/plan`, framer);
  const custody = await fetch(`${base}/api/objects/${mountedId}/custody`, { headers: { cookie: framer } });
  const custodyBody = (await custody.json()) as { error?: { message?: string } };
  if (custody.status === 404 && custodyBody.error?.message?.startsWith("There is no API route")) console.log(`${"object page: …/custody".padEnd(44)}(no such route yet: skipped)`);
  else await m("object page: …/custody", `/api/objects/${mountedId}/custody`, framer);
  await m("register, filter method", "/api/objects?method=t-hinge", framer);
  await m("register, filter board + glazing", "/api/objects?boardGrade=conservation&glazing=ar-uv-glass", framer);
  await m("register, due for a check", `/api/objects?checkDueBy=${today}`, framer);
  await m("register, due for a check by due date", `/api/objects?checkDueBy=${today}&sort=checkDueOn`, framer);
  await m("register, sort by last mounted desc", "/api/objects?sort=lastMountedOn&dir=desc", framer);
  await m("register, last mounted, page 500 (undated)", "/api/objects?sort=lastMountedOn&page=500", framer);
  await m("register, status + method", "/api/objects?status=in-studio&method=corners", framer);
  await m("mountings register, first page", "/api/mountings", framer);
  await m("mountings register, batch filter", "/api/mountings?batch=mb-0123", framer);
  await m("mountings register, framer + date range", `/api/mountings?framerId=${framerId}&from=2019-01-01&to=2020-12-31`, framer);
  await m("mountings register, method + status", "/api/mountings?method=corners&status=superseded", framer);
}
