import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { spawnSync } from "node:child_process";
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq, isNotNull } from "drizzle-orm";
import { createTestApp, demoAgents, makeClient, makeObject, type Agent, type RoleAgents } from "../setup/test-app.ts";
import { seedDemo } from "../../server/db/seed.ts";
import { clients, custodyReceipts, mountings, objects, user } from "../../server/db/schema.ts";
import { getSettings, saveSettings } from "../../server/features/settings/settings.repo.ts";
import { formatMoney } from "../../shared/domain/money.ts";
import { renderScheduleForBench } from "../../server/features/documents/schedule.tsx";
import { handlingCautions } from "../../server/features/documents/custody-receipt.tsx";
import { at, first } from "../setup/lists.ts";
import { binary } from "../setup/http.ts";

const t = createTestApp({ env: { PUBLIC_URL: "http://reversa.example.test" } });
let as: RoleAgents;
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-more-docs-"));
afterAll(() => fs.rmSync(tmp, { recursive: true, force: true }));

const post = (agent: Agent, url: string, body?: object) => {
  const r = agent.post(url);
  return (body ? r.send(body) : r).buffer(true).parse(binary as never);
};

function poppler(tool: "pdftotext" | "pdffonts" | "pdfinfo" | "pdfimages", pdf: Buffer, layout = true): string {
  const file = path.join(tmp, `${randomUUID()}.pdf`);
  fs.writeFileSync(file, pdf);
  const args = tool === "pdftotext" ? [...(layout ? ["-layout"] : []), file, "-"] : tool === "pdfimages" ? ["-list", file] : [file];
  const r = spawnSync(`/usr/bin/${tool}`, args, { encoding: "utf8" });
  expect(r.status, r.stderr).toBe(0);
  return r.stdout;
}
const textOf = (pdf: Buffer) => poppler("pdftotext", pdf).replace(/[ \t]+/g, " ");
/** Writes the PDF into .tmp/more-documents when KEEP_PDFS is set, to look at it. */
function keep(name: string, pdf: Buffer) {
  if (!process.env.KEEP_PDFS) return;
  const dir = path.resolve(".tmp/more-documents");
  fs.mkdirSync(dir, { recursive: true });
  fs.writeFileSync(path.join(dir, `${name}.pdf`), pdf);
}

/** Every PDF: opens in poppler, embeds Libre Franklin, answers as an attachment with its code, and the code verifies. */
async function expectDocument(res: { status: number; headers: Record<string, string>; body: unknown }, kind: string) {
  expect(res.status, String(res.body)).toBe(200);
  expect(res.headers["content-type"]).toMatch(/^application\/pdf/);
  expect(res.headers["content-disposition"]).toMatch(/^attachment; filename=".+\.pdf"$/);
  const code = res.headers["x-verification-code"];
  expect(code).toMatch(/^[0-9A-F]{4}-[0-9A-F]{4}-[0-9A-F]{4}$/);
  const pdf = res.body as Buffer;
  expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
  const fonts = poppler("pdffonts", pdf);
  expect(fonts).toMatch(/LibreFranklin/);
  for (const line of fonts.split("\n").filter((l) => /LibreFranklin/.test(l))) expect(line).toMatch(/\byes\b/); // embedded
  expect(textOf(pdf)).toContain(code);
  const v = await as.admin.get(`/api/verify/${code}`);
  expect(v.status).toBe(200);
  expect(v.body).toMatchObject({ valid: true, code, kind });
  return { pdf, code, text: textOf(pdf) };
}

let wrenfold: string;
let varga: string;

beforeAll(async () => {
  await seedDemo(t.db);
  as = await demoAgents(t);
  wrenfold = t.db.select().from(user).where(eq(user.email, "registrar@reversa.test")).get()!.clientId!;
  varga = t.db.select().from(user).where(eq(user.email, "collector@reversa.test")).get()!.clientId!;
});

const MONEY = /((?:[A-Z]{1,3})?[$£€¥]|[A-Z]{3}\s)(\d[\d,]*(?:\.\d+)?)\s*$/;
/** Reads the rendered rows back: per currency symbol, the sum of the last amount on each object's line, in minor units. */
function sumRows(text: string, numbers: string[]): Map<string, number> {
  const sums = new Map<string, number>();
  const wanted = new Set(numbers);
  for (const line of text.split("\n")) {
    const number = first(line.trim().split(" "));
    if (!wanted.has(number)) continue;
    const m = line.trim().match(MONEY);
    if (!m) continue;
    const minor = Math.round(Number(at(m, 2).replace(/,/g, "")) * 100);
    sums.set(at(m, 1).trim(), (sums.get(at(m, 1).trim()) ?? 0) + minor);
  }
  return sums;
}
function totalsIn(text: string): Map<string, number> {
  const out = new Map<string, number>();
  for (const m of text.matchAll(/Total ((?:[A-Z]{1,3})?[$£€¥]|[A-Z]{3}\s)(\d[\d,]*(?:\.\d+)?)/g)) out.set(at(m, 1).trim(), Math.round(Number(at(m, 2).replace(/,/g, "")) * 100));
  return out;
}

describe("the schedule of values", () => {
  it("lists every object of the registrar's institution, and its totals are the sums of the values listed, per currency", async () => {
    const res = await post(as.registrar, `/api/clients/${wrenfold}/documents/schedule`);
    const { text, pdf } = await expectDocument(res, "schedule-of-values");
    keep("schedule", pdf);
    const rows = t.db.select().from(objects).where(eq(objects.clientId, wrenfold)).all();
    expect(rows.length).toBeGreaterThan(0);
    for (const r of rows) expect(text).toContain(r.objectNumber);
    expect(text).toContain("Tomasz Eberlin");
    const listed = sumRows(
      text,
      rows.map((r) => r.objectNumber),
    );
    const totals = totalsIn(text);
    expect(totals.size).toBeGreaterThan(0);
    expect(listed).toEqual(totals);
    // And the same against the records themselves, exactly in minor units.
    const byCurrency = new Map<string, number>();
    for (const r of rows) if (r.valuationMinor != null && r.valuationCurrency) byCurrency.set(r.valuationCurrency, (byCurrency.get(r.valuationCurrency) ?? 0) + r.valuationMinor);
    for (const [cur, minor] of byCurrency) expect(text).toContain(`Total ${formatMoney(minor, cur)}`);
  });

  it("answers 404 to a registrar asking for another client's schedule, and serves the collector their own", async () => {
    const res = await post(as.registrar, `/api/clients/${varga}/documents/schedule`);
    expect(res.status).toBe(404);
    const mine = await post(as.collector, `/api/clients/${varga}/documents/schedule`);
    await expectDocument(mine, "schedule-of-values");
    expect((await post(as.collector, `/api/clients/${wrenfold}/documents/schedule`)).status).toBe(404);
  });

  it("takes a filtered set, and refuses an object of another client as not found", async () => {
    const rows = t.db.select().from(objects).where(eq(objects.clientId, wrenfold)).all().slice(0, 2);
    const res = await post(as.framer, `/api/clients/${wrenfold}/documents/schedule`, { objectIds: rows.map((r) => r.id) });
    const { text } = await expectDocument(res, "schedule-of-values");
    expect(text).toContain("2 selected objects");
    const other = t.db.select().from(objects).where(eq(objects.clientId, varga)).get()!;
    expect((await post(as.framer, `/api/clients/${wrenfold}/documents/schedule`, { objectIds: [first(rows).id, other.id] })).status).toBe(404);
    expect((await post(as.framer, `/api/clients/${wrenfold}/documents/schedule`, { status: "nowhere" })).status).toBe(422);
  });

  it("gives per object its type and medium, sheet and framed size, valuation basis and date, and says when a total mixes bases or holds old values", async () => {
    const c = makeClient(t.db, { kind: "private", name: "Orla Fenwick-Hay" });
    const recent = new Date(Date.now() - 200 * 86_400_000).toISOString().slice(0, 10);
    const a = makeObject(t.db, c.id, {
      objectNumber: "SV-1",
      title: "Estuary at dusk",
      objectType: "print",
      medium: "Etching and aquatint",
      sheetWidthMm: 300,
      sheetHeightMm: 400,
      valuationMinor: 100_000,
      valuationCurrency: "GBP",
      valuationBasis: "market",
      valuationDate: "2015-04-01",
    } as never);
    makeObject(t.db, c.id, {
      objectNumber: "SV-2",
      title: "Two herons",
      objectType: "drawing",
      medium: "Graphite",
      valuationMinor: 50_000,
      valuationCurrency: "GBP",
      valuationBasis: "replacement",
      valuationDate: recent,
    } as never);
    makeObject(t.db, c.id, {
      objectNumber: "SV-3",
      title: "Pier, low tide",
      objectType: "photograph",
      medium: "Gelatin silver print",
      valuationMinor: 20_000,
      valuationCurrency: "EUR",
      valuationBasis: "agreed",
    } as never);
    makeObject(t.db, c.id, { objectNumber: "SV-4", title: "Unvalued sketch", objectType: "drawing" } as never);
    // Sheet 300 × 400, 5 mm overlap a side: window 290 × 390; 60 mm borders: outer 410 × 510. Rebate = outer + 2 mm
    // clearance = 412 × 512; sight = rebate − 2 × 6 mm lip = 400 × 500; frame outside = sight + 2 × 25 mm face = 450 × 550
    // (trade reference §8 and §15: common practice, no source).
    const data = {
      plan: { unit: "mm", sheet: { width: 300, height: 400 }, window: { all: { mode: "overlap", overlap: 5 } }, borders: { all: 60 } },
      boards: { window: { grade: "museum", buffered: true, ply: 4 }, backing: { grade: "museum", buffered: false, ply: 4 } },
      attachment: {
        method: "t-hinge",
        tissue: "Kozo",
        adhesive: "wheat-starch-paste",
        hinges: [
          { edge: "top", offsetMm: 60, widthMm: 25 },
          { edge: "top", offsetMm: 240, widthMm: 25 },
        ],
      },
      glazing: { type: "uv-acrylic", thicknessMm: 3 },
      frame: { moulding: "Oak, 25 mm flat", faceWidthMm: 25 },
      undoNotes: "Release the hinges with a damp blotter.",
    };
    const d = await as.framer.post(`/api/objects/${a}/mountings`).send({ reason: "first-mounting", mountedOn: "2026-02-01", data });
    expect(d.status, JSON.stringify(d.body)).toBe(201);
    expect((await as.framer.post(`/api/mountings/${d.body.id}/complete`).send({ version: d.body.version })).status).toBe(200);

    const { text } = await expectDocument(await post(as.admin, `/api/clients/${c.id}/documents/schedule`), "schedule-of-values");
    expect(text).toContain("Print · Etching and aquatint");
    expect(text).toContain("Photograph · Gelatin silver print");
    expect(text).toMatch(/SV-1 .*300 × 400 mm/);
    expect(text).toContain("Framed 450 × 550 mm");
    expect(text).toContain("Not mounted");
    expect(text).toContain("Market value");
    expect(text).toContain("Valued 1 Apr 2015");
    expect(text).toContain("Over 3 years old");
    expect(text).toContain("No valuation date");
    expect(text).toContain("Mixes bases: market value, replacement value.");
    // The total split by basis: the parts add up to the whole (£1,000 + £500 = £1,500).
    expect(text).toContain("Total £1,500.00");
    expect(text).toMatch(/Market value · 1 object £1,000\.00/);
    expect(text).toMatch(/Replacement value · 1 object £500\.00/);
    expect(text).not.toContain("Drawing · Drawing");
    expect(text).toContain("1 of the 2 values is more than 3 years old");
    expect(text).toContain("The value has no valuation date.");
    expect(text).toContain("EUR · 1 object · agreed value");
    expect(text).toContain("1 object has no valuation");
    expect(text.match(/Over 3 years old/g)).toHaveLength(1);
  });

  it("is produced for the register's filter, listing exactly the objects the register lists for it", async () => {
    for (const filter of [{ status: "in-studio" }, { objectType: "print" }, { method: "t-hinge" }, { q: "toller" }, { status: "with-owner", objectType: "photograph" }]) {
      const listed = await as.framer.get("/api/objects").query({ ...filter, clientId: wrenfold, pageSize: 200 });
      expect(listed.status).toBe(200);
      const want = (listed.body.items as { objectNumber: string }[]).map((o) => o.objectNumber);
      const all = t.db
        .select()
        .from(objects)
        .where(eq(objects.clientId, wrenfold))
        .all()
        .map((o) => o.objectNumber);
      const res = await post(as.framer, `/api/clients/${wrenfold}/documents/schedule`, filter);
      const { text } = await expectDocument(res, "schedule-of-values");
      const shown = all.filter((n) => new RegExp(`^\\s*${n}\\b`, "m").test(text));
      expect(shown.sort(), JSON.stringify(filter)).toEqual(want.sort());
      expect(text).toContain(`${want.length} object${want.length === 1 ? "" : "s"} (`);
    }
    const bad = await post(as.framer, `/api/clients/${wrenfold}/documents/schedule`, { type: "print" });
    expect(bad.status).toBe(422);
  });

  it("follows the studio's paper size", async () => {
    const before = getSettings(t.db);
    const a4 = await post(as.admin, `/api/clients/${wrenfold}/documents/schedule`);
    expect(poppler("pdfinfo", a4.body as Buffer)).toMatch(/Page size:\s+595\.2\d? x 841\.8\d? pts \(A4\)/);
    saveSettings(t.db, { ...before, paperSize: "Letter" });
    try {
      const letter = await post(as.admin, `/api/clients/${wrenfold}/documents/schedule`);
      expect(poppler("pdfinfo", letter.body as Buffer)).toMatch(/Page size:\s+612 x 792 pts \(letter\)/);
    } finally {
      saveSettings(t.db, before);
    }
  });

  it("renders 1,000 objects over many pages with the table header on each page (its time is measured by npm run bench)", async () => {
    const big = makeClient(t.db, { kind: "institution", name: "Large collection trust" });
    for (let i = 0; i < 1000; i++) {
      makeObject(t.db, big.id, {
        objectNumber: `BIG-${String(i).padStart(4, "0")}`,
        title: `Harbour study ${i}`,
        maker: i % 3 ? "Ilse Korrow" : null,
        valuationMinor: 1000 + i * 137,
        valuationCurrency: i % 5 === 0 ? "EUR" : "GBP",
        valuationDate: "2026-01-01",
        valuationBasis: "agreed",
      } as never);
    }
    const started = performance.now();
    const res = await post(as.admin, `/api/clients/${big.id}/documents/schedule`);
    const ms = performance.now() - started;
    const { text, pdf } = await expectDocument(res, "schedule-of-values");
    keep("schedule-1000", pdf);
    const pages = Number(poppler("pdfinfo", pdf).match(/Pages:\s+(\d+)/)![1]);
    expect(pages).toBeGreaterThan(10);
    expect(text.match(/Insured value/gi)!.length).toBeGreaterThanOrEqual(pages);
    const numbers = Array.from({ length: 1000 }, (_, i) => `BIG-${String(i).padStart(4, "0")}`);
    expect(sumRows(text, numbers)).toEqual(totalsIn(text));
    console.info(`schedule of 1,000 objects: ${pages} pages in ${Math.round(ms)} ms`);
    // The bench entry point renders the same without writing a record.
    const ids = t.db
      .select({ id: objects.id })
      .from(objects)
      .where(eq(objects.clientId, big.id))
      .all()
      .map((r) => r.id);
    const admin = t.db.select().from(user).where(eq(user.email, "admin@reversa.test")).get()!;
    const benchPdf = await renderScheduleForBench(t.db, { id: admin.id, name: admin.name, email: admin.email, role: "admin", clientId: null }, ids);
    expect(benchPdf.subarray(0, 5).toString()).toBe("%PDF-");
  });
});

describe("the custody receipt", () => {
  it("carries the hand-over, both signature lines and the handling cautions", async () => {
    const r = t.db.select().from(custodyReceipts).innerJoin(objects, eq(objects.id, custodyReceipts.objectId)).where(eq(objects.clientId, wrenfold)).get()!;
    const res = await post(as.framer, `/api/custody/${r.custody_receipts.id}/document`);
    const { text, pdf } = await expectDocument(res, "custody-receipt");
    keep("custody-receipt", pdf);
    expect(text).toContain(r.objects.objectNumber);
    expect(text).toContain(r.custody_receipts.fromParty);
    expect(text).toContain("Handed over by");
    expect(text).toContain("Received by");
    expect(text).toMatch(/qualified conservator/);
    // The owner's registrar may read it; another client's user may not even learn it exists.
    expect((await post(as.registrar, `/api/custody/${r.custody_receipts.id}/document`)).status).toBe(200);
    expect((await post(as.collector, `/api/custody/${r.custody_receipts.id}/document`)).status).toBe(404);
    expect((await post(as.framer, `/api/custody/no-such-receipt/document`)).status).toBe(404);
  });

  it("warns about glass where the current mounting is glazed with glass", async () => {
    const glazed = t.db
      .select()
      .from(objects)
      .where(and(isNotNull(objects.currentMountingId), eq(objects.currentGlazing, "uv-glass")))
      .all();
    const withReceipt = glazed.map((o) => ({ o, r: t.db.select().from(custodyReceipts).where(eq(custodyReceipts.objectId, o.id)).get() })).find((x) => x.r);
    expect(withReceipt, "the demo holds a glass-glazed object with a receipt").toBeDefined();
    const res = await post(as.framer, `/api/custody/${withReceipt!.r!.id}/document`);
    const { text } = await expectDocument(res, "custody-receipt");
    expect(text).toMatch(/Glass cuts if it breaks/);
    keep("custody-receipt-glass", res.body as Buffer);
    expect(text).toContain(withReceipt!.o.objectNumber);
  });

  it("asks for two people and never the top rail for a heavy frame, and says nothing of glass or weight where neither applies", () => {
    const heavy = handlingCautions({ glass: false, weightKg: 14.2 });
    expect(heavy.map((c) => c.title)).toEqual(["Heavy frame (about 14 kg)"]);
    expect(first(heavy).text).toMatch(/two people.*Never lift it by the top rail/s);
    expect(handlingCautions({ glass: false, weightKg: 3 })).toEqual([]);
    // Broken glass: the frame laid flat, nothing lifted off the work, the framer or a conservator called (common practice (no source)).
    const glass = first(handlingCautions({ glass: true, weightKg: null })).text;
    expect(glass).toMatch(/lay the frame flat/);
    expect(glass).toMatch(/do not lift pieces off the work/);
    expect(glass).toMatch(/Call the framer or a conservator/);
    expect(glass).toMatch(/gloves and eye protection.*sharps container/s);
  });
});

describe("the workshop sheet", () => {
  it("lists each mounting's sizes and boards and packs the outer sizes onto full sheets", async () => {
    const rows = t.db.select().from(mountings).innerJoin(objects, eq(objects.id, mountings.objectId)).all().slice(0, 4);
    expect(rows.length).toBeGreaterThan(0);
    const res = await post(as.framer, "/api/documents/workshop-sheet", { mountingIds: rows.map((r) => r.mountings.id) });
    const { text, pdf } = await expectDocument(res, "workshop-sheet");
    keep("workshop-sheet", pdf);
    for (const r of rows) expect(text).toContain(r.objects.objectNumber);
    expect(text).toContain("Cutting list");
    expect(text).toMatch(/\d+ sheets? · shaded: offcut · utilisation \d+\.\d %/);
    // The board sheet in the studio's unit, like every length on the sheet: 32 × 40 in = 812.8 × 1016 mm (1 in = 25.4 mm exactly), shown to the mm.
    const unit = getSettings(t.db).unit;
    expect(text).toContain(unit === "mm" ? "813 × 1016 mm" : "32 × 40 in");
    expect(text).toMatch(/sharps container/);
    const other = await post(as.framer, "/api/documents/workshop-sheet", { mountingIds: [first(rows).mountings.id], boardSheetId: "40x60in" });
    expect((await expectDocument(other, "workshop-sheet")).text).toContain(unit === "mm" ? "1016 × 1524 mm" : "40 × 60 in");
  });

  it("is the studio's only", async () => {
    const m = t.db.select().from(mountings).get()!;
    expect((await post(as.registrar, "/api/documents/workshop-sheet", { mountingIds: [m.id] })).status).toBe(403);
    expect((await post(as.framer, "/api/documents/workshop-sheet", { mountingIds: ["nope"] })).status).toBe(404);
    expect((await post(as.framer, "/api/documents/workshop-sheet", { mountingIds: [] })).status).toBe(422);
  });
});

describe("back labels", () => {
  it("prints a 100 × 70 mm label with the reversible-mount line and a QR code to the record", async () => {
    const o = t.db.select().from(objects).where(isNotNull(objects.currentMountingId)).get()!;
    const res = await post(as.framer, `/api/objects/${o.id}/documents/back-label`);
    const { text, pdf } = await expectDocument(res, "back-label");
    keep("back-label", pdf);
    expect(poppler("pdfinfo", pdf)).toMatch(/Page size:\s+283\.4\d* x 198\.4\d* pts/);
    expect(text).toContain(o.objectNumber);
    expect(text).toContain("Reversible mount — do not use pressure-sensitive tape");
    expect(poppler("pdftotext", pdf, false).replace(/\s+/g, "")).toContain(`http://reversa.example.test/objects/${o.id}`);
    expect(pdf.toString("latin1")).toContain(`/URI (http://reversa.example.test/objects/${o.id})`);
    expect(
      poppler("pdfimages", pdf)
        .split("\n")
        .filter((l) => /^\s*\d+\s+\d+\s+image/.test(l)).length,
    ).toBeGreaterThanOrEqual(1);
    expect((await post(as.registrar, `/api/objects/${o.id}/documents/back-label`)).status).toBe(403);
  });

  it("prints a sheet of labels, 8 to an A4 page, on the studio's paper size, with one code for the sheet", async () => {
    const os = t.db
      .select()
      .from(objects)
      .innerJoin(clients, eq(clients.id, objects.clientId))
      .all()
      .slice(0, 9)
      .map((r) => r.objects);
    const res = await post(as.framer, "/api/documents/label-sheet", { objectIds: os.map((o) => o.id) });
    const { text, pdf } = await expectDocument(res, "label-sheet");
    keep("label-sheet", pdf);
    const info = poppler("pdfinfo", pdf);
    expect(info).toMatch(/Pages:\s+2/);
    expect(info).toMatch(/\(A4\)/);
    for (const o of os) expect(text).toContain(o.objectNumber);
    // The reversible-mount line only on the labels of objects that have a mount.
    expect(text.match(/Reversible mount/g)?.length ?? 0).toBe(os.filter((o) => o.currentMountingId).length);
  });
});
