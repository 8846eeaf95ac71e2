import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { spawnSync } from "node:child_process";
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import sharp from "sharp";
import { createTestApp, demoAgents, type Agent, type RoleAgents } from "../setup/test-app.ts";
import { seedDemo } from "../../server/db/seed.ts";
import { findObjectIdByNumber } from "../../server/features/objects/objects.repo.ts";
import { formatMoney } from "../../shared/domain/money.ts";
import { can } from "../../shared/permissions.ts";
import { valuationLine } from "../../server/features/documents/record-blocks.tsx";
import type { ObjectRecord } from "../../shared/schemas/objects.ts";
import { first, present } from "../setup/lists.ts";
import { binary } from "../setup/http.ts";

const t = createTestApp();
let as: RoleAgents;
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-docs-"));

const post = (agent: Agent, url: string) =>
  agent
    .post(url)
    .buffer(true)
    .parse(binary as never);

/** Runs a poppler tool on the PDF's bytes. */
function poppler(tool: "pdftotext" | "pdffonts" | "pdfinfo", pdf: Buffer): string {
  const file = path.join(tmp, `${randomUUID()}.pdf`);
  fs.writeFileSync(file, pdf);
  const args = tool === "pdftotext" ? ["-layout", file, "-"] : [file];
  const r = spawnSync(`/usr/bin/${tool}`, args, { encoding: "utf8" });
  expect(r.status, r.stderr).toBe(0);
  return r.stdout;
}
/** pdftotext with runs of spaces closed up, so a phrase wrapped in a table cell still reads as one line. */
const textOf = (pdf: Buffer) => poppler("pdftotext", pdf).replace(/[ \t]+/g, " ");

const idOf = (n: string) => findObjectIdByNumber(t.db, n)!;

beforeAll(async () => {
  await seedDemo(t.db);
  as = await demoAgents(t);
});

describe("the object dossier", () => {
  let pdf: Buffer;
  let code: string;
  let text: string;
  const objectId = () => idOf("2026-0003");

  beforeAll(async () => {
    const res = await post(as.framer, `/api/objects/${objectId()}/documents/dossier`);
    expect(res.status, String(res.body)).toBe(200);
    pdf = res.body as Buffer;
    code = present(res.headers["x-verification-code"], "the x-verification-code header");
    text = textOf(pdf);
  });

  it("when the framer issues it, then it is a PDF attachment named with the object number and carrying the verification code", async () => {
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    expect(code).toMatch(/^[0-9A-F]{4}-[0-9A-F]{4}-[0-9A-F]{4}$/);
    const res = await post(as.framer, `/api/objects/${objectId()}/documents/dossier`);
    expect(res.headers["content-type"]).toMatch(/^application\/pdf/);
    expect(res.headers["content-disposition"]).toMatch(new RegExp(`^attachment; filename="dossier-2026-0003-${res.headers["x-verification-code"]}\\.pdf"$`));
    expect(res.headers["x-verification-code"]).not.toBe(code);
  });

  it("when poppler opens it, then Libre Franklin is embedded and the text holds the object number, the plan's window and the code", async () => {
    const fonts = poppler("pdffonts", pdf);
    // pdffonts columns: name type encoding emb sub uni object ID — every font is Libre Franklin, embedded.
    const rows = fonts
      .split("\n")
      .slice(2)
      .filter((l) => l.trim());
    expect(rows.length).toBeGreaterThan(0);
    for (const row of rows) expect(row).toMatch(/^[A-Z]{6}\+LibreFranklin\S*\s.*\syes\s+(yes|no)\s+(yes|no)\s+\d+\s+\d+\s*$/);

    expect(text).toContain("2026-0003");
    expect(text).toContain(code);
    // The window as the API computes it for the current mounting (318 × 408 mm in the demo), never typed here.
    const mountings = (await as.framer.get(`/api/objects/${objectId()}/mountings`)).body.items as {
      status: string;
      current: { plan: { display: Record<string, string> }; data: { undoNotes: string } };
    }[];
    const current = mountings.find((m) => m.status === "completed")!;
    expect(current.current.plan.display.aperture).toMatch(/^\d+(\.\d)? × \d+(\.\d)? mm$/);
    expect(text).toContain(current.current.plan.display.aperture);
    expect(text).toContain(current.current.plan.display.outer);
    expect(text).toContain("How to undo this mount");
    expect(text).toContain(first(current.current.data.undoNotes.split("\n")).split(" ").slice(0, 4).join(" "));
    expect(text).toContain("Conservation checks");
    expect(text).toContain("Mounting history");
    expect(text).toMatch(/Current\s/);
    expect(text).toContain("Produced by Reversa");
    expect(text).toMatch(/Page 1 of \d/);
  });

  it("when the studio sees valuations, then the dossier shows the insured value", async () => {
    const o = (await as.framer.get(`/api/objects/${objectId()}`)).body as ObjectRecord;
    expect(o.valuationVisible).toBe(true);
    expect(text).toContain(formatMoney(o.valuationMinor!, o.valuationCurrency!));
  });

  it("when the paper size setting changes, then the page size follows it", async () => {
    expect(poppler("pdfinfo", pdf)).toMatch(/Page size:.*\(A4\)/);
    const settings = (await as.admin.get("/api/settings")).body;
    const put = await as.admin.put("/api/settings").send({ ...settings, paperSize: "Letter" });
    expect(put.status).toBe(200);
    try {
      const res = await post(as.framer, `/api/objects/${objectId()}/documents/dossier`);
      expect(poppler("pdfinfo", res.body as Buffer)).toMatch(/Page size:.*\(letter\)/i);
    } finally {
      await as.admin.put("/api/settings").send({ ...settings, paperSize: "A4" });
    }
  });

  it("when its code is checked, then /api/verify confirms it, signed out too, and a made-up code is not valid", async () => {
    const signedOut = request(t.app);
    const ok = await signedOut.get(`/api/verify/${code}`);
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ valid: true, code, kind: "dossier", objectNumber: "2026-0003" });
    const made = await signedOut.get("/api/verify/ABCD-1234-EF00");
    expect(made.status).toBe(200);
    expect(made.body).toEqual({ valid: false, code: "ABCD-1234-EF00" });
  });

  it("when the code is typed in lower case or without its dashes, then it still checks, and the check shows the file's fingerprint and nothing more", async () => {
    const signedOut = request(t.app);
    for (const typed of [code.toLowerCase(), code.replace(/-/g, ""), ` ${code.replace(/-/g, " ").toLowerCase()} `]) {
      const res = await signedOut.get(`/api/verify/${encodeURIComponent(typed)}`);
      expect(res.body, typed).toMatchObject({ valid: true, code });
    }
    const res = await signedOut.get(`/api/verify/${code}`);
    // The fingerprint is the issued file's own: its SHA-256 (FIPS 180-4, as node:crypto and sha256sum compute it) and pdfinfo's page count.
    const { createHash } = await import("node:crypto");
    expect(res.body.sha256).toBe(createHash("sha256").update(pdf).digest("hex"));
    expect(res.body.pages).toBe(Number(/Pages:\s+(\d+)/.exec(poppler("pdfinfo", pdf))![1]));
    expect(Object.keys(res.body).sort()).toEqual(["code", "issuedAt", "kind", "kindLabel", "objectNumber", "pages", "sha256", "valid"]);
  });

  it("when it is issued, then the object's history and document list show it", async () => {
    const history = (await as.framer.get(`/api/objects/${objectId()}/history`)).body;
    const events = (history.items ?? history) as { type: string; summary: string }[];
    expect(events.some((e) => e.type === "document-issued" && e.summary.includes(code))).toBe(true);
    const docs = await as.framer.get(`/api/objects/${objectId()}/documents`);
    expect(docs.status).toBe(200);
    expect(docs.body.items.some((d: { code: string; kind: string; objectId: string }) => d.code === code && d.kind === "dossier" && d.objectId === objectId())).toBe(true);
    const all = await as.framer.get("/api/documents");
    expect(all.status).toBe(200);
    expect(all.body.items.some((d: { code: string }) => d.code === code)).toBe(true);
  });

  it("when a collector asks, then they get their own object's dossier and 404 for another client's", async () => {
    const own = await post(as.collector, `/api/objects/${objectId()}/documents/dossier`);
    expect(own.status).toBe(200);
    expect(textOf(own.body as Buffer)).toContain("2026-0003");
    const objects = (await as.admin.get("/api/objects?pageSize=100")).body.items as { id: string; clientName: string }[];
    const other = objects.find((o) => o.clientName !== "Odile Varga-Pennick")!;
    const refused = await as.collector.post(`/api/objects/${other.id}/documents/dossier`);
    expect(refused.status).toBe(404);
    expect((await as.collector.get(`/api/objects/${other.id}/documents`)).status).toBe(404);
    // The collector sees their object's documents, not the studio's register of documents.
    expect((await as.collector.get(`/api/objects/${objectId()}/documents`)).status).toBe(200);
    expect((await as.collector.get("/api/documents")).status).toBe(403);
    expect((await as.registrar.get("/api/documents")).status).toBe(403);
  });

  it("when signed out, then issuing answers 401", async () => {
    expect((await request(t.app).post(`/api/objects/${objectId()}/documents/dossier`).set("Origin", t.config.publicUrl)).status).toBe(401);
  });
});

describe("valuations on documents", () => {
  it("when a user may not read valuations, then no valuation line is written (today every reader may, so the gate is checked directly)", () => {
    // Today everyone who may read an object may also see its valuation (docs/trade.md §13); the services strip the
    // fields whenever valuation:read says no, and the documents print only what is left.
    const studioUser = { id: "u", name: "U", email: "u@x.test", role: "framer" as const, clientId: null };
    expect(can(studioUser, "valuation:read", { clientId: "c" })).toBe(true);
    const stripped = { valuationVisible: false, valuationMinor: null, valuationCurrency: null } as unknown as ObjectRecord;
    expect(valuationLine(stripped)).toBeNull();
    const leaky = { valuationVisible: false, valuationMinor: 65000, valuationCurrency: "GBP" } as unknown as ObjectRecord;
    expect(valuationLine(leaky)).toBeNull();
    const shown = {
      valuationVisible: true,
      valuationMinor: 65000,
      valuationCurrency: "GBP",
      valuationBasis: "market",
      valuationDate: "2026-01-10",
      valuer: null,
    } as unknown as ObjectRecord;
    expect(valuationLine(shown)).toContain(formatMoney(65000, "GBP"));
  });
});

describe("the condition report for an insurer", () => {
  it("when the demo's latest report of 2026-0001 is issued, then it lists the findings, the comparison in words, the sentence on treatment and the code", async () => {
    const objectId = idOf("2026-0001");
    const reports = (await as.framer.get(`/api/objects/${objectId}/condition`)).body.items as {
      id: string;
      reportDate: string;
      status: string;
      current: { data: { findings: { term: string }[] } };
    }[];
    const latest = first(reports.filter((r) => r.status === "signed").sort((a, b) => (a.reportDate < b.reportDate ? 1 : -1)));
    const res = await post(as.collector, `/api/condition/${latest.id}/document`);
    expect(res.status).toBe(200);
    expect(res.headers["content-disposition"]).toMatch(/^attachment; filename="condition-report-2026-0001-/);
    const text = textOf(res.body as Buffer);
    for (const f of latest.current.data.findings) expect(text).toContain(f.term);
    // The demo's two reports of 2026-0001: foxing unchanged, tear worsened, abrasion new.
    expect(text).toMatch(/foxing\s+Unchanged/);
    expect(text).toMatch(/tear\s+Worsened/);
    expect(text).toMatch(/abrasion\s+New/);
    expect(text).toContain("Condition notes are observations, not conservation treatment; refer treatment to a qualified");
    expect(text).toContain("Examiner");
    const o = (await as.collector.get(`/api/objects/${objectId}`)).body as ObjectRecord;
    expect(text).toContain(formatMoney(o.valuationMinor!, o.valuationCurrency!));
    const v = await request(t.app).get(`/api/verify/${res.headers["x-verification-code"]}`);
    expect(v.body).toMatchObject({ valid: true, kind: "condition-report", objectNumber: "2026-0001" });
  });

  it("when a report has a photo with markers, then the photo is embedded with the findings' numbers, and the mould caution is shown", async () => {
    const objectId = idOf("2026-0003");
    const jpeg = await sharp({ create: { width: 600, height: 400, channels: 3, background: { r: 226, g: 214, b: 190 } } })
      .jpeg()
      .toBuffer();
    const up = await as.framer.post(`/api/objects/${objectId}/photos`).field("kind", "recto").field("caption", "Recto before mounting").attach("file", jpeg, "recto.jpg");
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const photoId = up.body.id as string;
    const terms = (await as.framer.get("/api/condition-terms?list=paper")).body;
    const list = (terms.items ?? terms) as { term: string; caution: string | null }[];
    const mould = list.find((x) => x.caution && /mould/i.test(x.term)) ?? list.find((x) => x.caution)!;
    const body = {
      context: "periodic-check",
      reportDate: "2026-11-20",
      data: {
        overallRating: "fair",
        summary: "Stable overall; two marked findings on the recto.",
        findings: [
          {
            id: "f-a",
            term: "foxing",
            location: { kind: "marker", photoId, x: 0.25, y: 0.3 },
            severity: "slight",
            extent: "scattered spots",
            notes: "Two spots near the plate mark.\nBoth small.",
          },
          { id: "f-b", term: mould.term, location: { kind: "marker", photoId, x: 0.7, y: 0.65 }, severity: "moderate", extent: "one patch" },
        ],
        photoIds: [photoId],
        signatures: { examiner: { name: "Jonah Pell", date: "2026-11-20", role: "Framer" } },
      },
    };
    const draft = await as.framer.post(`/api/objects/${objectId}/condition`).send(body);
    expect(draft.status, JSON.stringify(draft.body)).toBe(201);
    // A draft cannot be issued: it can still change.
    expect((await as.framer.post(`/api/condition/${draft.body.id}/document`)).status).toBe(409);
    // …and to a collector it does not exist.
    expect((await as.collector.post(`/api/condition/${draft.body.id}/document`)).status).toBe(404);
    const signed = await as.framer.post(`/api/condition/${draft.body.id}/sign`).send({ version: draft.body.version });
    expect(signed.status, JSON.stringify(signed.body)).toBe(200);

    const res = await post(as.framer, `/api/condition/${draft.body.id}/document`);
    expect(res.status).toBe(200);
    const pdf = res.body as Buffer;
    const text = textOf(pdf);
    expect(text).toContain("foxing");
    expect(text).toContain(mould.term);
    expect(text).toContain("Marked on photo 1");
    expect(text).toContain("markers 1, 2");
    // Typed notes with line breaks are set line by line, so no text falls back to an unembedded font.
    expect(text).toContain("Both small.");
    const fonts = poppler("pdffonts", pdf)
      .split("\n")
      .slice(2)
      .filter((l) => l.trim());
    for (const row of fonts) expect(row).toMatch(/^[A-Z]{6}\+LibreFranklin\S*\s.*\syes\s+(yes|no)\s+(yes|no)\s+\d+\s+\d+\s*$/);
    expect(text).toContain(mould.caution!.slice(0, 40).replace(/\s+/g, " "));
    // The markers are drawn over the photo: their numbers are text on the page, and the photo is an image.
    const file = path.join(tmp, "marked.pdf");
    fs.writeFileSync(file, pdf);
    const images = spawnSync("/usr/bin/pdfimages", ["-list", file], { encoding: "utf8" });
    expect(images.status).toBe(0);
    expect(images.stdout.split("\n").filter((l) => /^\s*\d+\s+\d+\s+image/.test(l)).length).toBeGreaterThanOrEqual(1);
    // 2026-0003 had no signed report before this one, so there is nothing to compare with, and the document says so.
    expect(text).toContain("This is the first signed condition report of this object in Reversa.");
  });
});
