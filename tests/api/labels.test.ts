import { beforeAll, describe, expect, it } from "vitest";
import { isNotNull, isNull } from "drizzle-orm";
import sharp from "sharp";
import jsQR from "jsqr";
import { agentFor, createTestApp, makeMounting, makeObject, makeSignedInStudio, makeStudio, type Agent, type Person, type TestApp } from "../setup/test-app.ts";
import { pageImage, pdfFonts, pdfInfo, pdfPages } from "../setup/pdf-layout.ts";
import { issuedDocuments as documents, objects } from "../../server/db/schema.ts";
import { getSettings, saveSettings } from "../../server/features/settings/settings.repo.ts";
import { first, at as item, present } from "../setup/lists.ts";
import { binary } from "../setup/http.ts";

const PUBLIC = "http://records.example.test";
const t = createTestApp({ env: { PUBLIC_URL: PUBLIC } });
const unset = createTestApp();
const loopback = createTestApp({ env: { PUBLIC_URL: "http://127.0.0.1:3000" } });
let framer: Agent;

const post = (agent: Agent, url: string, body?: object) => (body ? agent.post(url).send(body) : agent.post(url)).buffer(true).parse(binary as never);
async function issue(url: string, body?: object): Promise<{ pdf: Buffer; code: string }> {
  const res = await post(framer, url, body);
  expect(res.status, String(res.body)).toBe(200);
  return { pdf: res.body as Buffer, code: present(res.headers["x-verification-code"], "the x-verification-code header") };
}
const words = (pdf: Buffer) => pdfPages(pdf).map((p) => p.lines.map((l) => l.text).join("\n"));
const flat = (pdf: Buffer) => words(pdf).join("\n").replace(/\s+/g, " ");

const MM = 72 / 25.4;
const DPI = 144;
const PX_PER_MM = DPI / 25.4;

/** A page as greyscale pixels, rendered by poppler. */
async function grey(pdf: Buffer, page: number) {
  const { data, info } = await sharp(pageImage(pdf, page, DPI))
    .greyscale()
    .raw()
    .toBuffer({ resolveWithObject: true });
  return { data, width: info.width, height: info.height };
}

/**
 * The sheet's cut lines, found in the rendered page: pixel columns (and rows) where a thin dashed grey line,
 * with white paper 3 px to either side, runs over a third of the page or more, in a hundred dashes or more
 * (text and QR codes are too dense to pass, a label's own solid rules have too few pieces). Neighbouring
 * hits are merged; positions are in pixels.
 */
function cutLines(img: { data: Buffer; width: number; height: number }, axis: "x" | "y"): number[] {
  const [n, m] = axis === "x" ? [img.width, img.height] : [img.height, img.width];
  // A pixel outside the image reads as 0 (it is neither line nor paper).
  const at = (i: number, j: number) => (axis === "x" ? img.data[j * img.width + i] : img.data[i * img.width + j]) ?? 0;
  const hits: number[] = [];
  for (let i = 3; i < n - 3; i++) {
    let count = 0;
    let dashes = 0;
    let on = false;
    for (let j = 0; j < m; j++) {
      const v = at(i, j);
      const line = v >= 100 && v <= 235 && at(i - 3, j) > 245 && at(i + 3, j) > 245;
      if (line) count++;
      if (line && !on) dashes++;
      on = line;
    }
    if (count > m / 3 && dashes >= 100) hits.push(i);
  }
  const lines: number[][] = [];
  for (const h of hits) {
    const last = lines.at(-1);
    if (last && h - item(last, -1) <= 2) last.push(h);
    else lines.push([h]);
  }
  return lines.map((l) => l.reduce((a, b) => a + b, 0) / l.length);
}

/** Decodes the one QR code in a region of a rendered page with jsQR (a well-known decoder, independent of the encoder). */
async function decodeQr(pdf: Buffer, page: number, region?: { left: number; top: number; width: number; height: number }): Promise<string | null> {
  let img = sharp(pageImage(pdf, page, 200));
  if (region) img = img.extract(region);
  const { data, info } = await img.ensureAlpha().raw().toBuffer({ resolveWithObject: true });
  return jsQR(new Uint8ClampedArray(data.buffer, data.byteOffset, data.length), info.width, info.height)?.data ?? null;
}

/** The collector's client, whose in-studio objects the register's filter picks. */
let collectorClientId: string;
/** The framer of each app that is not ready to print. */
const framers = new Map<TestApp, Person>();

beforeAll(async () => {
  const { studio, as } = await makeSignedInStudio(t);
  framer = as.framer;
  collectorClientId = studio.collectorClient.id;
  // The studio's address and contact, which every back label carries.
  saveSettings(t.db, {
    ...getSettings(t.db),
    studioName: "Tidewell & Marr Conservation Framing",
    studioAddress: "Unit 4, Ropewalk Yard, Eastharbour (an invented studio)",
    studioContact: "01632 960 417 · bench@tidewell-marr.example",
  });
  // Twelve objects (more than one A4 sheet of eight labels): the collector's, in and out of the studio, and an institution's; one mounted.
  const own = Array.from({ length: 6 }, (_, i) => makeObject(t.db, collectorClientId, { status: i % 3 === 2 ? "with-owner" : "in-studio" }));
  for (let i = 0; i < 6; i++) makeObject(t.db, studio.institution.id, { status: "in-studio" });
  makeMounting(t.db, studio.people.framer, first(own));
  for (const app of [unset, loopback]) {
    const s = await makeStudio(app);
    makeObject(app.db, s.collectorClient.id);
    framers.set(app, s.people.framer);
  }
});

describe("back labels point only at the studio's public address", () => {
  it("says the labels are ready when PUBLIC_URL is set", async () => {
    const r = await framer.get("/api/documents/labels/readiness");
    expect(r.status).toBe(200);
    expect(r.body).toEqual({ ready: true, publicUrl: PUBLIC, problem: null });
  });

  for (const [name, app, hint] of [
    ["unset", unset, /Set PUBLIC_URL/],
    ["a loopback address", loopback, /PUBLIC_URL is http:\/\/127\.0\.0\.1:3000/],
  ] as const) {
    it(`warns before printing and refuses to print, keeping no record, when PUBLIC_URL is ${name}`, async () => {
      const agent = await agentFor(app, present(framers.get(app), "the app's framer"));
      const ready = await agent.get("/api/documents/labels/readiness");
      expect(ready.body.ready).toBe(false);
      expect(ready.body.problem).toMatch(hint);
      const o = app.db.select().from(objects).get()!;
      const before = app.db.select().from(documents).all().length;
      const one = await agent.post(`/api/objects/${o.id}/documents/back-label`);
      expect(one.status).toBe(409);
      expect(one.body.error.message).toMatch(hint);
      const sheet = await agent.post("/api/documents/label-sheet").send({ objectIds: [o.id] });
      expect(sheet.status).toBe(409);
      expect(app.db.select().from(documents).all().length).toBe(before);
    });
  }
});

describe("the back label", () => {
  it("is 100 × 70 mm, with the studio's address and contact, the reversible-mount line for a mounted object, the full verify address and a QR code that decodes to the record", async () => {
    const o = t.db.select().from(objects).where(isNotNull(objects.currentMountingId)).get()!;
    const { pdf, code } = await issue(`/api/objects/${o.id}/documents/back-label`);
    const info = pdfInfo(pdf);
    // 100 × 70 mm = 283.46 × 198.43 pt (1 in = 25.4 mm = 72 pt, by definition).
    expect(info.width).toBeCloseTo(100 * MM, 1);
    expect(info.height).toBeCloseTo(70 * MM, 1);
    expect(pdfFonts(pdf).every((f) => f.name.includes("LibreFranklin") && f.embedded)).toBe(true);
    const text = flat(pdf);
    const s = getSettings(t.db);
    expect(text).toContain(s.studioContact!);
    expect(text).toContain(s.studioAddress!);
    expect(text).toContain("Reversible mount — do not use pressure-sensitive tape");
    expect(text).toContain(`${PUBLIC}/verify/${code}`);
    expect(text).not.toMatch(/localhost/);
    expect(await decodeQr(pdf, 1)).toBe(`${PUBLIC}/objects/${o.id}`);
  });

  it("leaves out the reversible-mount line when the object has no mount, and shortens a long title at a word", async () => {
    const clientId = t.db.select().from(objects).get()!.clientId;
    const title = "A very long title for a study of the estuary at low water with the old ferry landing, the mudflats and the distant church beyond the marsh";
    const id = makeObject(t.db, clientId, { objectNumber: "LBL-0001", title } as never);
    const { pdf } = await issue(`/api/objects/${id}/documents/back-label`);
    const text = flat(pdf);
    expect(text).not.toContain("Reversible mount");
    expect(text).toContain("No completed mounting on record");
    // Common practice (no source): a label shortens at a whole word and says so with an ellipsis.
    const shown = [...title.matchAll(/ /g)].map((m) => title.slice(0, m.index)).filter((p) => text.includes(`${p.replace(/[,]$/, "")}…`));
    expect(shown.length).toBeGreaterThan(0);
    expect(text).not.toContain(title);
    expect(await decodeQr(pdf, 1)).toBe(`${PUBLIC}/objects/${id}`);
  });
});

describe("the sheet of labels", () => {
  for (const paper of ["A4", "Letter"] as const) {
    it(`cuts into cells of exactly 100 × 70 mm on ${paper}, each QR code decoding to its own object`, async () => {
      const before = getSettings(t.db);
      saveSettings(t.db, { ...before, paperSize: paper });
      try {
        const ids = t.db
          .select({ id: objects.id })
          .from(objects)
          .all()
          .map((r) => r.id)
          .slice(0, 10);
        const { pdf } = await issue("/api/documents/label-sheet", { objectIds: ids });
        const info = pdfInfo(pdf);
        // ISO 216: A4 = 210 × 297 mm; US Letter = 8.5 × 11 in = 612 × 792 pt.
        if (paper === "A4") expect([info.width / MM, info.height / MM].map(Math.round)).toEqual([210, 297]);
        else expect([info.width, info.height]).toEqual([612, 792]);
        const img = await grey(pdf, 1);
        const xs = cutLines(img, "x");
        const ys = cutLines(img, "y");
        // Two columns of 100 mm on both papers; four rows of 70 mm fit A4's 297 mm, three fit Letter's 279.4 mm.
        expect(xs).toHaveLength(3);
        expect(ys).toHaveLength(paper === "A4" ? 5 : 4);
        for (let i = 1; i < xs.length; i++) expect(Math.abs((item(xs, i) - item(xs, i - 1)) / PX_PER_MM - 100)).toBeLessThan(0.3);
        for (let i = 1; i < ys.length; i++) expect(Math.abs((item(ys, i) - item(ys, i - 1)) / PX_PER_MM - 70)).toBeLessThan(0.3);
        // At least 5 mm of paper at every edge, where printers cannot print.
        expect(item(xs, 0) / PX_PER_MM).toBeGreaterThan(4.9);
        expect(item(ys, 0) / PX_PER_MM).toBeGreaterThan(4.9);
        expect((img.width - xs.at(-1)!) / PX_PER_MM).toBeGreaterThan(4.9);
        expect((img.height - ys.at(-1)!) / PX_PER_MM).toBeGreaterThan(4.9);

        const perPage = (xs.length - 1) * (ys.length - 1);
        expect(info.pages).toBe(Math.ceil(ids.length / perPage));
        const decoded: string[] = [];
        const scale = 200 / DPI;
        for (let p = 1; p <= info.pages; p++) {
          for (let r = 0; r + 1 < ys.length; r++) {
            for (let c = 0; c + 1 < xs.length; c++) {
              const region = {
                left: Math.round(item(xs, c) * scale) + 2,
                top: Math.round(item(ys, r) * scale) + 2,
                width: Math.round((item(xs, c + 1) - item(xs, c)) * scale) - 4,
                height: Math.round((item(ys, r + 1) - item(ys, r)) * scale) - 4,
              };
              const url = await decodeQr(pdf, p, region);
              if (url) decoded.push(url);
            }
          }
        }
        expect(decoded.sort()).toEqual(ids.map((id) => `${PUBLIC}/objects/${id}`).sort());
      } finally {
        saveSettings(t.db, before);
      }
    });
  }

  it("is produced for the register's filter, one label for each object the register lists", async () => {
    const filter = { clientId: collectorClientId, status: "in-studio" };
    const listed = await framer.get("/api/objects").query({ ...filter, pageSize: 200 });
    const want = (listed.body.items as { objectNumber: string }[]).map((o) => o.objectNumber);
    expect(want.length).toBeGreaterThan(1);
    const { pdf } = await issue("/api/documents/label-sheet", filter);
    const text = words(pdf).join("\n");
    const all = t.db
      .select()
      .from(objects)
      .all()
      .map((o) => o.objectNumber);
    expect(all.filter((n) => new RegExp(`(^|\\s)${n}(\\s|$)`, "m").test(text)).sort()).toEqual(want.sort());
    const none = await post(framer, "/api/documents/label-sheet", { clientId: collectorClientId, q: "nothing-matches-this" });
    expect(none.status).toBe(422);
    const unmounted = t.db.select().from(objects).where(isNull(objects.currentMountingId)).all().length;
    expect(unmounted).toBeGreaterThan(0);
  });
});
