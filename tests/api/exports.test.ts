import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { parse } from "csv-parse/sync";
import sharp from "sharp";
import { and, eq, inArray, sql } from "drizzle-orm";
import { pollUntil } from "../setup/poll.ts";
import { createTestApp, demoAgents, expectErrorShape, makeObject, type Agent, type RoleAgents } from "../setup/test-app.ts";
import { seedDemo } from "../../server/db/seed.ts";
import { clients, conditionReports, conditionRevisions, custodyReceipts, events, objects, photos, user } from "../../server/db/schema.ts";
import { createExportsService, JOB_TTL_MS } from "../../server/features/exports/exports.service.ts";
import { columnsFor, EXPORT_COLUMNS, minorToDecimal } from "../../server/features/exports/exports.columns.ts";
import { findClient } from "../../server/features/clients/clients.repo.ts";
import { OBJECT_STATUSES, OBJECT_STATUS_LABELS, OBJECT_TYPES, PHOTO_PROCESSES, SENSITIVITIES, VALUATION_BASES } from "../../shared/schemas/objects.ts";
import { CONDITION_CONTEXTS, RATINGS, SEVERITIES, ZONES } from "../../shared/schemas/condition.ts";
import { CUSTODY_KINDS, CUSTODY_KIND_LABELS } from "../../shared/schemas/custody.ts";
import { ADHESIVES, ATTACHMENT_METHODS, BOARD_GRADES } from "../../shared/schemas/mount-plan.ts";
import { GLAZING_TYPES, MOUNTING_REASONS, MOUNTING_STATUSES } from "../../shared/schemas/mountings.ts";
import { minorDigits } from "../../shared/domain/money.ts";
import type { SessionUser } from "../../shared/schemas/auth.ts";
import { at, first } from "../setup/lists.ts";
import { getBinary } from "../setup/http.ts";

const t = createTestApp();
let as: RoleAgents;
let varga: string; // the demo collector's client
let wrenfold: string; // the demo registrar's client
let photoId: string;
let photoObjectNumber: string;

// A title with every character RFC 4180 makes a field quote for: a comma, a double quote and a line break.
const TRICKY = 'Letter, "private" —\nsecond line, with a comma';
const VALUATION_COLUMNS = ["Valuation", "Valuation currency", "Valuation date", "Valuation basis", "Valuer"];

type Row = Record<string, string>;
const BOM = "\uFEFF";

/** The raw answer as a Buffer, whatever its content type. */
const raw = getBinary;
/** The ids of a client's objects, read from the database. */
const objectIdsOf = (clientId: string) =>
  t.db
    .select({ id: objects.id })
    .from(objects)
    .where(eq(objects.clientId, clientId))
    .all()
    .map((o) => o.id);

async function csv(agent: Agent, url: string): Promise<{ text: string; rows: Row[]; header: string[] }> {
  const res = await raw(agent, url);
  if (res.status !== 200) throw new Error(`GET ${url} answered ${res.status}: ${res.body.toString()}`);
  expect(res.headers["content-type"]).toMatch(/^text\/csv; charset=utf-8/);
  expect(res.headers["content-disposition"]).toMatch(/^attachment; filename=".+\.csv"$/);
  const text = (res.body as Buffer).toString("utf8");
  const rows = parse(text, { bom: true, columns: true, record_delimiter: "\r\n" }) as Row[];
  const header = first(parse(text, { bom: true, to_line: 1 }) as string[][], "the CSV header");
  return { text, rows, header };
}

async function json(agent: Agent, url: string): Promise<Record<string, string | number | null>[]> {
  const res = await agent.get(url);
  if (res.status !== 200) throw new Error(`GET ${url} answered ${res.status}: ${JSON.stringify(res.body)}`);
  expect(res.headers["content-type"]).toMatch(/^application\/json/);
  return res.body;
}

/**
 * The JSON rows as the CSV writes them: null as an empty field, numbers as their shortest decimal, and an
 * amount (a JSON number) with its currency's own decimals, as the CSV gives it ("12500.00" for 12500).
 */
const asCsvCells = (rows: Record<string, string | number | null>[]) =>
  rows.map((r) =>
    Object.fromEntries(
      Object.entries(r).map(([k, v]) => [
        k,
        v == null
          ? ""
          : k === "Valuation" && typeof v === "number"
            ? minorToDecimal(Math.round(v * 10 ** minorDigits(String(r["Valuation currency"]))), String(r["Valuation currency"]))
            : String(v),
      ]),
    ),
  );

// The app's jobs keep their ZIPs for an hour; the test process ends sooner. Its temporary files go in a
// folder of its own (each test file runs in its own process), removed at the end, so it never touches
// another process's export folders.
const privateTmp = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-exports-test-"));
process.env.TMPDIR = privateTmp;
afterAll(() => fs.rmSync(privateTmp, { recursive: true, force: true }));

beforeAll(async () => {
  await seedDemo(t.db);
  as = await demoAgents(t);
  const byName = (name: string) => t.db.select({ id: clients.id }).from(clients).where(eq(clients.name, name)).get()!.id;
  varga = byName("Odile Varga-Pennick");
  wrenfold = byName("Wrenfold Hall Collection Trust");
  makeObject(t.db, varga, {
    objectNumber: "2026-0900",
    title: TRICKY,
    objectType: "document",
    status: "in-studio",
    valuationMinor: 12345,
    valuationCurrency: "GBP",
    valuationDate: "2026-05-01",
    valuationBasis: "agreed",
  });

  // One photo on one of the collector's objects, through the real upload route.
  const target = t.db
    .select()
    .from(objects)
    .where(and(eq(objects.clientId, varga), eq(objects.objectNumber, "2026-0001")))
    .get()!;
  photoObjectNumber = target.objectNumber;
  const png = await sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 184, g: 152, b: 118 } } })
    .png()
    .toBuffer();
  const up = await as.framer.post(`/api/objects/${target.id}/photos`).field("kind", "recto").attach("file", png, { filename: "recto.png" });
  if (up.status !== 201) throw new Error(`Photo upload answered ${up.status}: ${JSON.stringify(up.body)}`);
  photoId = up.body.id;
});

describe("single-dataset exports", () => {
  it("when the studio exports each dataset as CSV and JSON, then the CSV has a BOM, CRLF line ends, a header row, and the same rows as the JSON", async () => {
    for (const dataset of ["objects", "mountings", "condition", "custody", "valuations"] as const) {
      const c = await csv(as.framer, `/api/clients/${varga}/exports/${dataset}.csv`);
      const j = await json(as.framer, `/api/clients/${varga}/exports/${dataset}.json`);
      expect(c.text.startsWith(BOM), dataset).toBe(true);
      // Every line break outside quoted fields is CRLF: strip quoted fields and no bare \n or \r is left.
      const outsideQuotes = c.text.replace(/"(?:[^"]|"")*"/g, "");
      expect(outsideQuotes.replace(/\r\n/g, ""), dataset).not.toMatch(/[\r\n]/);
      expect(c.text.endsWith("\r\n"), dataset).toBe(true);
      expect(c.header, dataset).toEqual(columnsFor(dataset, true));
      expect(j.length, dataset).toBeGreaterThan(0);
      for (const row of j) expect(Object.keys(row), dataset).toEqual(c.header);
      expect(c.rows, dataset).toEqual(asCsvCells(j));
    }
  });

  it("when any dataset is read, then no cell is a stored code: every value is in words (docs/exports.md)", async () => {
    const codes = new Set<string>(
      [
        CONDITION_CONTEXTS,
        RATINGS,
        SEVERITIES,
        ZONES,
        CUSTODY_KINDS,
        ATTACHMENT_METHODS,
        ADHESIVES,
        BOARD_GRADES,
        MOUNTING_REASONS,
        MOUNTING_STATUSES,
        GLAZING_TYPES,
        OBJECT_TYPES,
        PHOTO_PROCESSES,
        SENSITIVITIES,
        OBJECT_STATUSES,
        VALUATION_BASES,
      ].flat(),
    );
    let cells = 0;
    for (const dataset of ["objects", "mountings", "condition", "custody", "valuations"] as const) {
      for (const agent of [as.framer, as.collector]) {
        const j = await json(agent, `/api/clients/${varga}/exports/${dataset}.json`);
        for (const row of j) {
          for (const [k, v] of Object.entries(row)) {
            cells++;
            if (typeof v === "string") for (const part of v.split("; ")) expect(codes.has(part), `${dataset} · ${k}: "${v}"`).toBe(false);
          }
        }
      }
    }
    expect(cells).toBeGreaterThan(500);
  });

  it("when a dataset is read as JSON, then counts, lengths and amounts are JSON numbers, and the amounts equal the records' minor units", async () => {
    const vals = await json(as.collector, `/api/clients/${varga}/exports/valuations.json`);
    expect(vals.length).toBeGreaterThan(0);
    for (const v of vals) {
      expect(typeof v.Valuation).toBe("number");
      const o = t.db
        .select()
        .from(objects)
        .where(and(eq(objects.clientId, varga), eq(objects.objectNumber, String(v["Object number"]))))
        .get()!;
      expect(Math.round((v.Valuation as number) * 10 ** minorDigits(o.valuationCurrency!))).toBe(o.valuationMinor);
    }
    const objs = await json(as.collector, `/api/clients/${varga}/exports/objects.json`);
    for (const o of objs) expect(typeof o["Dimension: sheet width (mm)"]).toBe("number");
    const cond = await json(as.collector, `/api/clients/${varga}/exports/condition.json`);
    for (const c of cond) expect(typeof c["Number of findings"]).toBe("number");
  });

  it("when the condition dataset is read, then each report carries its findings, numbered as in the report, and its recommendations", async () => {
    const cond = await json(as.framer, `/api/clients/${varga}/exports/condition.json`);
    const withFindings = cond.filter((c) => (c["Number of findings"] as number) > 0);
    expect(withFindings.length).toBeGreaterThan(0);
    for (const c of withFindings) {
      const lines = String(c.Findings).split("\n");
      expect(lines).toHaveLength(c["Number of findings"] as number);
      for (const [i, l] of lines.entries()) expect(l.startsWith(`${i + 1}. `)).toBe(true);
      const report = t.db
        .select()
        .from(conditionRevisions)
        .where(eq(conditionRevisions.reportId, String(c["Condition check/assessment reference number"])))
        .all()
        .at(-1)!;
      const data = report.data as { findings: { term: string; severity: string }[]; recommendations: Record<string, string | null> };
      for (const [i, f] of data.findings.entries()) expect(lines[i]).toContain(f.term);
      expect(c["Recommendation: handling"]).toBe(data.recommendations.handling ?? null);
      expect(c["Referral to a conservator"]).toBe(data.recommendations.referral ?? null);
    }
  });

  it("when the custody dataset is read, then it lists every hand-over of the client's objects as recorded", async () => {
    const rows = await json(as.collector, `/api/clients/${varga}/exports/custody.json`);
    const ids = objectIdsOf(varga);
    const recorded = t.db.select().from(custodyReceipts).where(inArray(custodyReceipts.objectId, ids)).all();
    expect(rows.map((r) => r["Receipt id"]).sort()).toEqual(recorded.map((r) => r.id).sort());
    for (const r of recorded) {
      const row = rows.find((x) => x["Receipt id"] === r.id)!;
      expect(row).toMatchObject({
        Date: r.date,
        From: r.fromParty,
        To: r.toParty,
        "Signed by": r.signedBy,
        "Hand-over": CUSTODY_KIND_LABELS[r.kind as keyof typeof CUSTODY_KIND_LABELS],
        "Agreed return date": r.returnDue ?? null,
      });
    }
    expect((await as.registrar.get(`/api/clients/${varga}/exports/custody.json`)).status).toBe(404);
  });

  it("when the objects CSV is read back, then it holds the same objects and values as the API's own records", async () => {
    const { rows } = await csv(as.collector, `/api/clients/${varga}/exports/objects.csv`);
    const list = await as.collector.get("/api/objects?pageSize=200");
    expect(list.status).toBe(200);
    const numbers = list.body.items.map((i: { objectNumber: string }) => i.objectNumber).sort();
    expect(rows.map((r) => r["Object number"])).toEqual(numbers);
    for (const item of list.body.items as { id: string; objectNumber: string }[]) {
      const rec = (await as.collector.get(`/api/objects/${item.id}`)).body;
      const row = rows.find((r) => r["Object number"] === rec.objectNumber)!;
      expect(row.Title).toBe(rec.title);
      expect(row["Production person"]).toBe(rec.maker ?? "");
      expect(row["Production date"]).toBe(rec.dateMade ?? "");
      expect(Number(row["Dimension: sheet width (mm)"])).toBe(rec.sheetWidthMm);
      expect(Number(row["Dimension: sheet height (mm)"])).toBe(rec.sheetHeightMm);
      expect(row["Current location"]).toBe(rec.location ?? "");
      expect(row["Valuation currency"]).toBe(rec.valuationCurrency ?? "");
      // Exact decimal from integer minor units: back to minor units it is the API's integer.
      if (rec.valuationMinor != null) expect(Math.round(Number(row.Valuation) * 100)).toBe(rec.valuationMinor);
      expect(row["Valuation date"]).toBe(rec.valuationDate ?? "");
    }
    const estuary = rows.find((r) => r.Title === "Estuary at low water, study")!;
    expect(estuary).toMatchObject({ "Object name": "Watercolour", Valuation: "4200.00", "Valuation currency": "GBP", Valuer: "Harl & Osten Valuers (invented)" });
  });

  it("when a title holds a comma, quotes and a line break, then the CSV quotes it (quotes doubled) and a CSV parser reads it back whole", async () => {
    const { text, rows } = await csv(as.framer, `/api/clients/${varga}/exports/objects.csv`);
    expect(text).toContain(`"Letter, ""private"" —\nsecond line, with a comma"`);
    const row = rows.find((r) => r["Object number"] === "2026-0900")!;
    expect(row.Title).toBe(TRICKY);
    expect(row.Valuation).toBe("123.45");
    const j = await json(as.framer, `/api/clients/${varga}/exports/objects.json`);
    expect(j.find((r) => r["Object number"] === "2026-0900")!.Title).toBe(TRICKY);
  });

  it("when the header is read, then it uses the Spectrum 5.0 unit names, and lengths carry their unit", async () => {
    const { header } = await csv(as.framer, `/api/clients/${varga}/exports/objects.csv`);
    for (const name of [
      "Object number",
      "Object name",
      "Title",
      "Production person",
      "Production date",
      "Current location",
      "Condition check date",
      "Valuation",
      "Valuation currency",
      "Valuation date",
      "Valuer",
    ])
      expect(header).toContain(name);
    for (const h of header.filter((h) => h.startsWith("Dimension"))) expect(h).toMatch(/\(mm\)$/);
    const cond = await csv(as.framer, `/api/clients/${varga}/exports/condition.csv`);
    expect(cond.header).toEqual(expect.arrayContaining(["Object number", "Condition", "Condition check date", "Condition note"]));
  });

  it("when filtered by status or object type, then only that client's matching objects come back", async () => {
    const inStudio = await json(as.framer, `/api/clients/${varga}/exports/objects.json?status=in-studio`);
    expect(inStudio.length).toBeGreaterThan(0);
    for (const r of inStudio) expect(r.Status).toBe(OBJECT_STATUS_LABELS["in-studio"]);
    const photographs = await json(as.framer, `/api/clients/${varga}/exports/objects.json?objectType=photograph`);
    expect(photographs.map((r) => r["Object name"])).toEqual(photographs.map(() => "Photograph"));
    const inDb = t.db
      .select({ n: sql<number>`count(*)` })
      .from(objects)
      .where(and(eq(objects.clientId, varga), eq(objects.objectType, "photograph")))
      .get()!.n;
    expect(inDb).toBeGreaterThan(0);
    expect(photographs.length).toBe(inDb);
    const all = await json(as.framer, `/api/clients/${varga}/exports/objects.json`);
    expect(all.length).toBe(9); // the eight demo objects and the one made here
  });

  it("when the collector or the registrar export their own client's records, then they see the valuation columns, as the studio does", async () => {
    for (const [agent, client] of [
      [as.collector, varga],
      [as.registrar, wrenfold],
      [as.admin, wrenfold],
      [as.framer, varga],
    ] as const) {
      const { header, rows } = await csv(agent, `/api/clients/${client}/exports/objects.csv`);
      expect(header).toEqual(expect.arrayContaining(VALUATION_COLUMNS));
      expect(rows.some((r) => r.Valuation !== "")).toBe(true);
      const v = await csv(agent, `/api/clients/${client}/exports/valuations.csv`);
      expect(v.header).toEqual(columnsFor("valuations", true));
    }
  });

  it("when a user may not read valuations, then the valuation columns are left out, header and all", () => {
    // No role in shared/permissions.ts may export a client's records without "valuation:read" on it
    // (studio staff and that client's users have both), so this checks the column list the route uses.
    for (const dataset of ["objects", "valuations"] as const) {
      const without = columnsFor(dataset, false);
      for (const c of VALUATION_COLUMNS) expect(without).not.toContain(c);
    }
    expect(columnsFor("objects", false)).toContain("Title");
    expect(columnsFor("objects", true).length).toBe(EXPORT_COLUMNS.objects.length);
  });

  it("when a mounting is still a draft, then the studio's export lists it and the collector's does not", async () => {
    const target = t.db.select().from(objects).where(eq(objects.objectNumber, "2026-0900")).get()!;
    const res = await as.framer.post(`/api/objects/${target.id}/mountings`).send({
      reason: "first-mounting",
      mountedOn: "2026-11-30",
      data: {
        plan: { unit: "mm", sheet: { width: 210, height: 297 }, window: { all: { mode: "overlap", overlap: 5 } }, borders: { all: 60 } },
        boards: { window: { grade: "museum", buffered: false, ply: 4, batch: "MB-1" }, backing: { grade: "museum", buffered: false, ply: 4 } },
        attachment: { method: "corners", hinges: [] },
        glazing: { type: "uv-glass", thicknessMm: 2 },
        undoNotes: "Slide the sheet out of the four polyester corners; nothing is stuck to it.",
      },
    });
    expect(res.status).toBe(201);
    const studio = await json(as.framer, `/api/clients/${varga}/exports/mountings.json`);
    expect(studio.find((r) => r["Mounting record id"] === res.body.id)).toMatchObject({ "Object number": "2026-0900", "Record status": "Draft", "Window board batch": "MB-1" });
    const own = await json(as.collector, `/api/clients/${varga}/exports/mountings.json`);
    expect(own.find((r) => r["Mounting record id"] === res.body.id)).toBeUndefined();
    expect(own.length).toBe(studio.length - 1);
  });

  it("when someone exports another client's records, then it answers 404, as for a client that does not exist", async () => {
    for (const [agent, client] of [
      [as.collector, wrenfold],
      [as.registrar, varga],
    ] as const) {
      for (const url of [`/api/clients/${client}/exports/objects.csv`, `/api/clients/${client}/exports/valuations.json`]) {
        const res = await agent.get(url);
        expect(res.status, url).toBe(404);
        expectErrorShape(res.body, "not_found");
      }
      const zip = await agent.post(`/api/clients/${client}/exports/archive`);
      expect(zip.status).toBe(404);
    }
    const none = await as.framer.get(`/api/clients/no-such-client/exports/objects.csv`);
    expect(none.status).toBe(404);
  });

  it("when the dataset or format is unknown, then it answers 422", async () => {
    expectErrorShape((await as.framer.get(`/api/clients/${varga}/exports/invoices.csv`)).body, "validation_failed");
    expectErrorShape((await as.framer.get(`/api/clients/${varga}/exports/objects.xlsx`)).body, "validation_failed");
  });

  it("money is converted from minor units exactly, with the currency's own number of decimals", () => {
    expect(minorToDecimal(420000, "GBP")).toBe("4200.00");
    expect(minorToDecimal(5, "GBP")).toBe("0.05");
    expect(minorToDecimal(-5, "EUR")).toBe("-0.05");
    expect(minorToDecimal(1500, "JPY")).toBe("1500");
    expect(minorToDecimal(1234, "KWD")).toBe("1.234");
    expect(minorToDecimal(9007199254740991, "USD")).toBe("90071992547409.91");
  });
});

describe("bulk ZIP of one client's records", () => {
  async function runToDone(agent: Agent, client: string) {
    const start = await agent.post(`/api/clients/${client}/exports/archive`);
    expect(start.status).toBe(202);
    expect(start.body).toEqual({ jobId: expect.any(String) });
    const { jobId } = start.body as { jobId: string };
    const seen: number[] = [];
    // On a loaded two-core machine the dossiers in the ZIP take a while; the test's timeout bounds the wait.
    const last = await pollUntil(
      async () => {
        const s = await agent.get(`/api/exports/${jobId}`);
        expect(s.status).toBe(200);
        expect(s.body).toEqual({ state: expect.stringMatching(/^(running|done|failed)$/), progress: expect.any(Number), message: expect.any(String) });
        seen.push(s.body.progress);
        return s.body as { state: string };
      },
      (s) => s.state !== "running",
    );
    expect(last.state).toBe("done");
    return { jobId, seen };
  }

  // unzip comes with the tests' tools (scripts/ensure-tools.sh installs it), so these always run.
  const unzipList = (file: string) => {
    const list = spawnSync("/usr/bin/unzip", ["-Z1", file], { encoding: "utf8" });
    expect(list.status, list.stderr).toBe(0);
    return list.stdout.split("\n").filter(Boolean);
  };
  const unzipFile = (file: string, name: string) => spawnSync("/usr/bin/unzip", ["-p", file, name], { maxBuffer: 1 << 28 }).stdout as Buffer;

  it("when the collector asks for a ZIP, then the job runs to done with rising progress, and the ZIP holds every dataset, the photos (metadata removed) and the PDFs, each listed in the manifest with a SHA-256 that matches", async () => {
    const eventsBefore = t.db.select({ n: sql<number>`count(*)` }).from(events).where(eq(events.type, "document-issued")).get()!.n;
    const { jobId, seen } = await runToDone(as.collector, varga);
    for (let i = 1; i < seen.length; i++) expect(at(seen, i)).toBeGreaterThanOrEqual(at(seen, i - 1));
    expect(seen.at(-1)).toBe(1);
    for (const p of seen) expect(p >= 0 && p <= 1).toBe(true);

    // Someone else may neither poll nor download it.
    expect((await as.framer.get(`/api/exports/${jobId}`)).status).toBe(404);
    expect((await as.registrar.get(`/api/exports/${jobId}/download`)).status).toBe(404);

    const res = await raw(as.collector, `/api/exports/${jobId}/download`);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toBe("application/zip");
    expect(res.headers["content-disposition"]).toMatch(/^attachment; filename=".+\.zip"$/);
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-export-test-"));
    const ids = objectIdsOf(varga);
    try {
      const file = path.join(dir, "export.zip");
      fs.writeFileSync(file, res.body as Buffer);
      const names = unzipList(file).sort();
      const datasets = ["condition", "custody", "mountings", "objects", "valuations"].flatMap((d) => [`${d}.csv`, `${d}.json`]);
      const numbers = t.db
        .select({ n: objects.objectNumber })
        .from(objects)
        .where(eq(objects.clientId, varga))
        .all()
        .map((o) => o.n);
      for (const n of [...datasets, "manifest.csv", "manifest.json", ...numbers.map((n) => `dossiers/${n}.pdf`)]) expect(names, n).toContain(n);
      // The photo is named so a person can tell it apart: object number, its order, its kind.
      expect(names.filter((n) => new RegExp(`^photos/${photoObjectNumber}/${photoObjectNumber}-01-recto-front\\.(png|jpg)$`).test(n))).toHaveLength(1);
      // Every signed condition report and every custody receipt of the client's objects, as PDFs.
      const signed = t.db
        .select({ n: sql<number>`count(*)` })
        .from(conditionReports)
        .where(and(inArray(conditionReports.objectId, ids), eq(conditionReports.status, "signed")))
        .get()!.n;
      const receipts = t.db.select({ n: sql<number>`count(*)` }).from(custodyReceipts).where(inArray(custodyReceipts.objectId, ids)).get()!.n;
      expect(signed).toBeGreaterThan(0);
      expect(receipts).toBeGreaterThan(0);
      expect(names.filter((n) => n.startsWith("condition-reports/") && n.endsWith(".pdf"))).toHaveLength(signed);
      expect(names.filter((n) => n.startsWith("custody-receipts/") && n.endsWith(".pdf"))).toHaveLength(receipts);
      for (const pdfName of names.filter((n) => n.endsWith(".pdf")).slice(0, 3)) expect(unzipFile(file, pdfName).subarray(0, 5).toString("latin1")).toBe("%PDF-");

      // The manifest lists every file but itself, and each SHA-256 is that of the file in the ZIP (FIPS 180-4, node:crypto).
      const manifest = JSON.parse(unzipFile(file, "manifest.json").toString("utf8")) as {
        file: string;
        kind: string;
        objectNumber: string | null;
        caption: string | null;
        bytes: number;
        sha256: string;
      }[];
      expect(manifest.map((m) => m.file).sort()).toEqual(names.filter((n) => !n.startsWith("manifest.")));
      for (const m of manifest) {
        const bytes = unzipFile(file, m.file);
        expect(m.sha256, m.file).toBe(createHash("sha256").update(bytes).digest("hex"));
        expect(m.bytes, m.file).toBe(bytes.length);
        expect(m.kind, m.file).toBeTruthy();
      }
      const manifestCsv = parse(unzipFile(file, "manifest.csv").toString("utf8"), { columns: true, bom: true }) as Record<string, string>[];
      expect(manifestCsv.map((r) => [r.File, r["SHA-256"]])).toEqual(manifest.map((m) => [m.file, m.sha256]));
      // A client user gets the full-size copy with its metadata removed, the same bytes the app serves, never the original.
      const photoEntry = manifest.find((m) => m.file.startsWith("photos/"))!;
      expect(photoEntry).toMatchObject({ kind: "photo (full size, metadata removed)", objectNumber: photoObjectNumber });
      const served = await raw(as.collector, `/api/photos/${photoId}/full`);
      expect(photoEntry.sha256).toBe(
        createHash("sha256")
          .update(served.body as Buffer)
          .digest("hex"),
      );
      const originalSha = t.db.select({ sha: photos.sha256 }).from(photos).where(eq(photos.id, photoId)).get()!.sha;
      expect(photoEntry.sha256).not.toBe(originalSha);

      // The CSV inside the ZIP is the same file as the single export.
      const single = await csv(as.collector, `/api/clients/${varga}/exports/objects.csv`);
      expect(unzipFile(file, "objects.csv").toString("utf8")).toBe(single.text);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }

    // Each object in the ZIP has one "archive exported" event naming what went in; issuing its PDFs for the
    // archive wrote no "document issued" event of its own; the single downloads wrote none.
    const exported = t.db
      .select()
      .from(events)
      .where(and(eq(events.type, "exported"), inArray(events.objectId, ids)))
      .all();
    expect(exported).toHaveLength(ids.length);
    for (const e of exported) expect(e.summary).toMatch(/^Included in an archive of Odile Varga-Pennick's records: object dossier [0-9A-F]{4}-[0-9A-F]{4}-[0-9A-F]{4}/);
    expect(t.db.select({ n: sql<number>`count(*)` }).from(events).where(eq(events.type, "document-issued")).get()!.n).toBe(eventsBefore);
    const others = t.db
      .select({ n: sql<number>`count(*)` })
      .from(events)
      .where(
        and(
          eq(events.type, "exported"),
          sql`${events.objectId} not in (${sql.join(
            ids.map((i) => sql`${i}`),
            sql`, `,
          )})`,
        ),
      )
      .get()!.n;
    expect(others).toBe(0);
  });

  it("when studio staff ask for the originals, then the ZIP holds the photos' original files; a client user asking for them is refused", async () => {
    expect((await as.collector.post(`/api/clients/${varga}/exports/archive`).send({ originals: true })).status).toBe(403);
    const start = await as.admin.post(`/api/clients/${varga}/exports/archive`).send({ originals: true });
    expect(start.status).toBe(202);
    await pollUntil(
      () => as.admin.get(`/api/exports/${start.body.jobId}`),
      (s) => s.body.state !== "running",
    );
    const res = await raw(as.admin, `/api/exports/${start.body.jobId}/download`);
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-export-test-"));
    try {
      const file = path.join(dir, "export.zip");
      fs.writeFileSync(file, res.body as Buffer);
      const manifest = JSON.parse(unzipFile(file, "manifest.json").toString("utf8")) as { file: string; kind: string; sha256: string }[];
      const entry = manifest.find((m) => m.file.startsWith("photos/"))!;
      expect(entry.kind).toBe("photo (original file, with its metadata)");
      // The original's SHA-256 as recorded at upload (the file exactly as sent).
      expect(entry.sha256).toBe(t.db.select({ sha: photos.sha256 }).from(photos).where(eq(photos.id, photoId)).get()!.sha);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });

  it("when an unknown job is polled, then it answers 404", async () => {
    expectErrorShape((await as.framer.get(`/api/exports/no-such-job`)).body, "not_found");
    expectErrorShape((await as.framer.get(`/api/exports/no-such-job/download`)).body, "not_found");
  });

  it("when the studio zips an institution's records, then it runs to done as well", async () => {
    const { seen } = await runToDone(as.admin, wrenfold);
    expect(seen.at(-1)).toBe(1);
  });

  it("when the job is watched turn by turn, then its progress rises through values between 0 and 1; an hour later the job and its file are gone", async () => {
    let now = new Date("2026-12-01T10:00:00Z");
    const service = createExportsService(t.db, { uploadsDir: path.join(inject("testDbDir"), "uploads") }, () => now);
    const row = t.db.select().from(user).where(eq(user.email, "collector@reversa.test")).get()!;
    const collector: SessionUser = { id: row.id, name: row.name, email: row.email, role: row.role, clientId: row.clientId };
    const jobId = service.startArchive(collector, findClient(t.db, varga)!);
    const seen: number[] = [];
    // Watched every turn of the event loop until it ends, however long a loaded machine takes (the test timeout bounds it).
    await pollUntil(
      () => {
        const s = service.status(collector, jobId);
        if (seen.at(-1) !== s.progress) seen.push(s.progress);
        return s;
      },
      (s) => s.state !== "running",
      { intervalMs: 0 },
    );
    expect(service.status(collector, jobId).state).toBe("done");
    expect(seen.length).toBeGreaterThan(2); // 0, at least one step between, 1
    expect(seen[0]).toBe(0);
    expect(seen.at(-1)).toBe(1);
    for (let i = 1; i < seen.length; i++) expect(at(seen, i)).toBeGreaterThan(at(seen, i - 1));
    expect(seen.slice(1, -1).every((p) => p > 0 && p < 1)).toBe(true);

    const { file } = service.download(collector, jobId);
    expect(fs.existsSync(file)).toBe(true);
    expect(() => service.status({ ...collector, id: "someone-else" }, jobId)).toThrow(/not found/);
    now = new Date(now.getTime() + JOB_TTL_MS + 1);
    expect(() => service.status(collector, jobId)).toThrow(/not found/);
    for (let i = 0; i < 100 && fs.existsSync(file); i++) await new Promise((r) => setTimeout(r, 20));
    expect(fs.existsSync(file)).toBe(false);
    await service.clear();
  });
});
