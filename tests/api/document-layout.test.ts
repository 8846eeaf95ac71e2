import fs from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { createTestApp, makeObject, signIn, type Agent } from "../setup/test-app.ts";
import { DEMO_PASSWORD, seedDemo } from "../../server/db/seed.ts";
import { mountings, user } from "../../server/db/schema.ts";
import { getSettings, saveSettings } from "../../server/features/settings/settings.repo.ts";
import { pdfFonts, pdfInfo, pdfPages, type PdfPage } from "../setup/pdf-layout.ts";
import { at } from "../setup/lists.ts";
import { binary } from "../setup/http.ts";

// Every document kind, rendered with a long record (many findings, many mountings, long unbroken
// words, typed line breaks) on A4 and US Letter, in mm and in inches, and read back page by page.
// Paper sizes: A4 210 × 297 mm = 595.28 × 841.89 pt (ISO 216); US Letter 8.5 × 11 in = 612 × 792 pt (ANSI/ASME Y14.1).
// The page's printable box is the documents' own layout (server/lib/pdf/theme.ts): 40 pt side
// margins, the body between 86 pt from the top and 54 pt from the bottom, the footer below.
const t = createTestApp({ env: { PUBLIC_URL: "http://records.example.test" } });
let framer: Agent;
let wrenfold: string;
let longId: string;
let receiptId: string;
let reportId: string;
let mountingIds: string[] = [];
const objectIds: string[] = [];

const LONG_WORD = "Unbrokenreferencecodewithoutanyspacesatallthatrunsonandonpastthewidthofacolumn";
const LINES = "First typed line of the note.\nSecond typed line, after a line break.\nThird line: ✕ ✓ ▲ — “quoted”.";

async function issue(url: string, body?: object): Promise<Buffer> {
  const r = framer.post(url);
  const res = await (body ? r.send(body) : r).buffer(true).parse(binary as never);
  expect(res.status, String(res.body)).toBe(200);
  return res.body as Buffer;
}

/** Writes the PDF into .tmp/document-layout when KEEP_PDFS is set, to look at it page by page. */
function keep(name: string, pdf: Buffer) {
  if (!process.env.KEEP_PDFS) return;
  const dir = path.resolve(".tmp/document-layout");
  fs.mkdirSync(dir, { recursive: true });
  fs.writeFileSync(path.join(dir, `${name}.pdf`), pdf);
}

const TERMS = ["foxing", "tear", "abrasion", "crease", "stain", "cockling", "flyspecks", "loss", "fading", "tide line"];

beforeAll(async () => {
  await seedDemo(t.db);
  framer = await signIn(t.agent(), "framer@reversa.test", DEMO_PASSWORD);
  wrenfold = t.db.select().from(user).where(eq(user.email, "registrar@reversa.test")).get()!.clientId!;

  longId = makeObject(t.db, wrenfold, {
    objectNumber: "LONG-0001",
    title: `A very long title for a study of the estuary at low water with the old ferry landing, the ${LONG_WORD} and the mudflats beyond`,
    maker: "Ines Carrow-Lindqvist",
    objectType: "watercolour",
    medium: "Watercolour and graphite with gum arabic glazes",
    support: "Cotton rag paper, 300 g/m²",
    sheetWidthMm: 560,
    sheetHeightMm: 760,
    inscriptions: LINES,
    location: "Store B, plan chest 4, drawer 2",
    status: "in-studio",
    valuationMinor: 1_250_000,
    valuationCurrency: "GBP",
    valuationDate: "2019-05-01",
    valuationBasis: "market",
  } as never);
  objectIds.push(longId);

  // Five mountings in turn, each completed (a reframing ends the one before).
  for (let i = 0; i < 5; i++) {
    const data = {
      plan: { unit: "mm", sheet: { width: 560, height: 760 }, window: { all: { mode: "overlap", overlap: 6 + i } }, borders: { top: 80, side: 80, bottom: 95 } },
      boards: {
        window: { grade: "museum", buffered: true, ply: 4, patPassed: true, batch: `B-${LONG_WORD.slice(0, 30)}-${i}` },
        backing: { grade: "museum", buffered: false, ply: 4 },
      },
      attachment: {
        method: "t-hinge",
        tissue: "Kozo, 9 g/m²",
        adhesive: "wheat-starch-paste",
        hinges: [
          { edge: "top", offsetMm: 80, widthMm: 25 },
          { edge: "top", offsetMm: 280, widthMm: 25 },
          { edge: "top", offsetMm: 480, widthMm: 25 },
        ],
      },
      glazing: { type: "uv-acrylic", thicknessMm: 3 },
      undoNotes: `Release each hinge with a damp blotter.\nLift the sheet only once the paste has softened.\n${LONG_WORD}`,
    };
    const draft = await framer.post(`/api/objects/${longId}/mountings`).send({ reason: i === 0 ? "first-mounting" : "reframing", mountedOn: `202${i}-03-0${i + 1}`, data });
    expect(draft.status, JSON.stringify(draft.body)).toBe(201);
    const done = await framer.post(`/api/mountings/${draft.body.id}/complete`).send({ version: draft.body.version });
    expect(done.status, JSON.stringify(done.body)).toBe(200);
  }
  mountingIds = t.db
    .select({ id: mountings.id })
    .from(mountings)
    .all()
    .map((r) => r.id)
    .slice(0, 40);

  // A signed condition report with forty findings and every recommendation.
  const findings = Array.from({ length: 40 }, (_, i) => ({
    id: `f-long-${i}`,
    term: TERMS[i % TERMS.length],
    location: { kind: "zone", zone: "bottom-centre" },
    extent: i % 7 === 0 ? LONG_WORD : `About ${i + 2} mm`,
    severity: "slight",
    notes: i % 5 === 0 ? LINES : null,
  }));
  const report = await framer.post(`/api/objects/${longId}/condition`).send({
    context: "arrival",
    reportDate: "2026-03-02",
    data: {
      overallRating: "fair",
      summary: `Stable overall. ${LINES}`,
      findings,
      recommendations: {
        display: "Display at 50 lux or less, for no more than three months a year.",
        handling: `Handle in its mount only.\n${LONG_WORD}`,
        environment: "Keep at 40–55 % relative humidity.",
        referral: "Refer the tideline staining to a qualified conservator before any reframing.",
      },
      signatures: { examiner: { name: "Test framer", date: "2026-03-02" }, otherParty: { name: "Registrar of the collection", date: "2026-03-02", role: "Registrar" } },
    },
  });
  expect(report.status, JSON.stringify(report.body)).toBe(201);
  const signed = await framer.post(`/api/condition/${report.body.id}/sign`).send({ version: report.body.version });
  expect(signed.status, JSON.stringify(signed.body)).toBe(200);
  reportId = report.body.id;

  const receipt = await framer.post(`/api/objects/${longId}/custody`).send({
    kind: "loan-out",
    date: "2026-04-01",
    fromParty: "The studio",
    toParty: `Exhibitions department of a borrowing gallery, ${LONG_WORD}`,
    condition: "As in the condition report of 2 March 2026.",
    signedBy: "Test framer",
    notes: LINES,
    returnDue: "2026-09-30",
  });
  expect(receipt.status, JSON.stringify(receipt.body)).toBe(201);
  receiptId = receipt.body.id;

  // Enough objects for the schedule and the label sheet to run over several pages.
  for (let i = 0; i < 70; i++) {
    objectIds.push(
      makeObject(t.db, wrenfold, {
        objectNumber: `LONG-${String(i + 2).padStart(4, "0")}`,
        title: i % 9 === 0 ? `Study ${i} ${LONG_WORD}` : `Harbour study number ${i}, with a title long enough to wrap onto a second line in the table`,
        objectType: i % 3 ? "print" : "drawing",
        medium: "Etching",
        valuationMinor: 10_000 + i * 137,
        valuationCurrency: "GBP",
        valuationDate: i % 4 ? "2026-01-01" : "2018-06-30",
        valuationBasis: i % 2 ? "replacement" : "market",
      } as never),
    );
  }
});

const CONFIGS = [
  { paperSize: "A4", unit: "mm", width: 595.28, height: 841.89 },
  { paperSize: "Letter", unit: "in", width: 612, height: 792 },
  { paperSize: "A4", unit: "in", width: 595.28, height: 841.89 },
  { paperSize: "Letter", unit: "mm", width: 612, height: 792 },
] as const;

const MARGIN_X = 40;
const BODY_TOP = 86;
const BODY_BOTTOM = 54;
const FOOTER_BAND = 42;
const TOL = 1.5;

type Expect = { tableHeaders?: { header: RegExp; row: RegExp }[] };

const allText = (pages: PdfPage[]) => pages.flatMap((p) => p.lines.map((l) => l.text)).join(" ");

function bodyLines(page: PdfPage) {
  return page.lines.filter((l) => l.yMin >= BODY_TOP - TOL && l.yMin < page.height - FOOTER_BAND);
}

/** The checks every document page must pass. */
function expectReadable(name: string, pdf: Buffer, paper: { width: number; height: number }, opts: Expect = {}) {
  keep(name, pdf);
  const fonts = pdfFonts(pdf);
  expect(fonts.length, name).toBeGreaterThan(0);
  for (const f of fonts) {
    expect(f.name, `${name}: every font is Libre Franklin`).toMatch(/LibreFranklin/);
    expect(f.embedded, `${name}: ${f.name} embedded`).toBe(true);
  }
  const info = pdfInfo(pdf);
  expect(info.width, name).toBeCloseTo(paper.width, 0);
  expect(info.height, name).toBeCloseTo(paper.height, 0);
  const pages = pdfPages(pdf);
  expect(pages.length).toBe(info.pages);
  const heights = pages.flatMap((p) => bodyLines(p).map((l) => l.height)).sort((a, b) => a - b);
  const body = at(heights, Math.floor(heights.length / 2));
  pages.forEach((page, i) => {
    const where = `${name}, page ${i + 1} of ${pages.length}`;
    for (const line of page.lines) {
      for (const w of line.words) {
        expect(w.xMin, `${where}: "${line.text}" starts left of the margin`).toBeGreaterThanOrEqual(MARGIN_X - TOL);
        expect(w.xMax, `${where}: "${line.text}" runs past the right margin`).toBeLessThanOrEqual(page.width - MARGIN_X + TOL);
      }
      const inHeader = line.yMax <= BODY_TOP + TOL;
      const inFooter = line.yMin >= page.height - FOOTER_BAND;
      const inBody = line.yMin >= BODY_TOP - TOL && line.yMax <= page.height - BODY_BOTTOM + TOL;
      expect(inHeader || inFooter || inBody, `${where}: "${line.text}" (y ${line.yMin.toFixed(1)}–${line.yMax.toFixed(1)}) is outside the printable box`).toBe(true);
    }
    const lines = bodyLines(page);
    if (i < pages.length - 1 && lines.length) {
      // A heading (set larger than the body text) is never the last line of a page.
      const last = at(lines, -1);
      expect(last.height, `${where}: the heading "${last.text}" is the last line of the page`).toBeLessThan(body * 1.12);
      // A block too tall for what is left moves on, but it never leaves more than 40% of a page empty behind it.
      const bodyHeight = page.height - BODY_BOTTOM - BODY_TOP;
      const used = (last.yMax - BODY_TOP) / bodyHeight;
      expect(used, `${where}: the page is left ${Math.round((1 - used) * 100)}% empty after "${last.text}"`).toBeGreaterThan(0.6);
    }
    if (i === pages.length - 1 && pages.length > 1) expect(lines.length, `${where}: a near-empty last page`).toBeGreaterThanOrEqual(3);
    for (const { header, row } of opts.tableHeaders ?? []) {
      const firstRow = lines.findIndex((l) => row.test(l.text));
      if (firstRow < 0) continue;
      const head = lines.findIndex((l) => header.test(l.text));
      expect(head >= 0 && head < firstRow, `${where}: the table's rows continue here without its header ${header}`).toBe(true);
    }
  });
  return pages;
}

describe.each(CONFIGS)("documents on $paperSize in $unit, with a long record", (cfg) => {
  beforeAll(() => {
    saveSettings(t.db, { ...getSettings(t.db), paperSize: cfg.paperSize, unit: cfg.unit });
  });
  const tag = `${cfg.paperSize}-${cfg.unit}`;

  it("the object dossier is readable page by page", async () => {
    const pdf = await issue(`/api/objects/${longId}/documents/dossier`);
    const text = allText(pdfPages(pdf));
    // For the owner: the report's recommendations with the referral, and undoing is bench work, not theirs.
    expect(text).toContain("Referral to a conservator Refer the tideline staining to a qualified conservator");
    expect(text).toMatch(/undoing it is bench work, not something for the owner/);
    expect(text).toContain("T-hinges");
    expect(text).not.toMatch(/t-hinge|wheat-starch-paste/);
    expectReadable(`dossier-${tag}`, pdf, cfg, {
      tableHeaders: [{ header: /^(No\.?|#)?\s*Finding\b.*Severity/, row: /^\d+ (foxing|tear|abrasion|crease|stain|cockling|flyspecks|loss|fading|tide line)\b/i }],
    });
  });

  it("the condition report is readable page by page", async () => {
    const pdf = await issue(`/api/condition/${reportId}/document`);
    const text = allText(pdfPages(pdf));
    // For the insurer: the support, the mount in place on the day, where it was examined.
    expect(text).toContain("Support Cotton rag paper, 300 g/m²");
    expect(text).toMatch(/Framed or unframed In its mount and glazed frame: .* \(mounted 2024-03-05\)/);
    expect(text).toMatch(/Location at examination Store B, plan chest 4, drawer 2/);
    expectReadable(`condition-${tag}`, pdf, cfg, {
      tableHeaders: [{ header: /^(No\.?|#)?\s*Finding\b.*Severity/, row: /^\d+ (foxing|tear|abrasion|crease|stain|cockling|flyspecks|loss|fading|tide line)\b/i }],
    });
  });

  it("the schedule of values is readable page by page", async () => {
    const pdf = await issue(`/api/clients/${wrenfold}/documents/schedule`);
    // An object with no signed condition report says so, rather than claiming it was never examined.
    expect(allText(pdfPages(pdf))).toMatch(/No signed (\S+ )*?report/);
    expect(allText(pdfPages(pdf))).not.toMatch(/Not examined/);
    expectReadable(`schedule-${tag}`, pdf, cfg, { tableHeaders: [{ header: /insured value/i, row: /^LONG-\d{4}\b/ }] });
  });

  it("the custody receipt is readable page by page", async () => {
    const pdf = await issue(`/api/custody/${receiptId}/document`);
    const pages = expectReadable(`custody-${tag}`, pdf, cfg);
    // A loan's receipt carries the agreed return date and the value it travels at (the object's insured value).
    const text = pages.flatMap((p) => p.lines.map((l) => l.text)).join(" ");
    expect(text).toContain("Agreed return 30 September 2026");
    expect(text).toContain("Value in transit £12,500.00 (market value), valued 2019-05-01");
  });

  it("the workshop sheet is readable page by page", async () => {
    const pdf = await issue("/api/documents/workshop-sheet", { mountingIds });
    expectReadable(`workshop-${tag}`, pdf, cfg);
  });

  it("a short workshop sheet (4 mountings) leaves no half-empty page before its cutting list", async () => {
    const pdf = await issue("/api/documents/workshop-sheet", { mountingIds: mountingIds.slice(0, 4) });
    expectReadable(`workshop-short-${tag}`, pdf, cfg);
  });

  it("the label sheet is readable page by page", async () => {
    const pdf = await issue("/api/documents/label-sheet", { objectIds: objectIds.slice(0, 20) });
    keep(`labels-${tag}`, pdf);
    const fonts = pdfFonts(pdf);
    for (const f of fonts) expect(f.name).toMatch(/LibreFranklin/);
    const info = pdfInfo(pdf);
    expect(info.width).toBeCloseTo(cfg.width, 0);
    expect(info.height).toBeCloseTo(cfg.height, 0);
    for (const [i, page] of pdfPages(pdf).entries()) {
      for (const line of page.lines) {
        for (const w of line.words) {
          expect(w.xMin, `labels page ${i + 1}: "${line.text}"`).toBeGreaterThanOrEqual(0);
          expect(w.xMax, `labels page ${i + 1}: "${line.text}"`).toBeLessThanOrEqual(page.width);
          expect(w.yMax, `labels page ${i + 1}: "${line.text}"`).toBeLessThanOrEqual(page.height);
        }
      }
    }
  });

  it("the back label keeps every word on the label", async () => {
    const pdf = await issue(`/api/objects/${longId}/documents/back-label`);
    keep(`label-${tag}`, pdf);
    for (const f of pdfFonts(pdf)) expect(f.name).toMatch(/LibreFranklin/);
    for (const page of pdfPages(pdf)) {
      for (const line of page.lines) for (const w of line.words) expect(w.xMax, `"${line.text}"`).toBeLessThanOrEqual(page.width - 4);
    }
  });
});
