import fs from "node:fs";
import path from "node:path";
import zlib from "node:zlib";
import { createHash, randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { eq, sql } from "drizzle-orm";
import sharp from "sharp";
import exifr from "exifr";
import type { Response } from "supertest";
import { agentFor, agentsFor, createTestApp, expectErrorShape, makeObject, makeStudio, type Agent, type TestApp } from "../setup/test-app.ts";
import { conditionReports, photos } from "../../server/db/schema.ts";
import { uploadTempDir } from "../../server/features/photos/photos.routes.ts";
import type { Photo } from "../../shared/schemas/photos.ts";
import { at } from "../setup/lists.ts";
import { getBinary as binary } from "../setup/http.ts";
import { filesUnder } from "../setup/files.ts";

// Each app gets its own uploads folder, so "nothing was written" is judged against this file's uploads only.
const uploadsDir = (name: string) => path.join(inject("testDbDir"), `uploads-photos-${name}-${randomUUID().slice(0, 8)}`);
const UPLOADS = uploadsDir("default");
const t = createTestApp({ env: { UPLOADS_DIR: UPLOADS } });

type RoleName = "admin" | "framer" | "collector" | "registrar";
let as: Record<RoleName, Agent>;
let studio: Awaited<ReturnType<typeof makeStudio>>;
/** Objects of: the collector's client, the registrar's institution, another institution. */
let obj: { collector: string; institution: string; other: string };

// ── Fixtures, made here with sharp and Buffer ──────────────────────────────────
const plain = (w: number, h: number) => sharp({ create: { width: w, height: h, channels: 3, background: { r: 184, g: 152, b: 118 } } });
const noisy = (w: number, h: number) => sharp({ create: { width: w, height: h, channels: 3, background: "#808080", noise: { type: "gaussian", mean: 128, sigma: 40 } } });
const jpeg = (w = 64, h = 48) => plain(w, h).jpeg().toBuffer();
const pngBytes = (w = 64, h = 48) => plain(w, h).png().toBuffer();
const GPS_EXIF = {
  IFD0: { Make: "Reversa test", Model: "Copy stand camera" },
  IFD2: { DateTimeOriginal: "2026:11:20 14:03:05", OffsetTimeOriginal: "+01:00" },
  IFD3: { GPSLatitudeRef: "N", GPSLatitude: "51/1 30/1 0/1", GPSLongitudeRef: "W", GPSLongitude: "0/1 7/1 30/1" },
};
const SVG = Buffer.from(
  `<?xml version="1.0" encoding="UTF-8"?>\n<svg xmlns="http://www.w3.org/2000/svg" width="100" height="100"><rect width="100" height="100" fill="red"/></svg>\n`,
);

const CRC_TABLE = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});
function crc32(buf: Buffer): number {
  let c = 0xffffffff;
  for (const b of buf) c = at(CRC_TABLE, (c ^ b) & 0xff) ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}
function pngChunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, "latin1"), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([len, body, crc]);
}
/**
 * A real, valid PNG of width × height 1-bit grey pixels (all black): rows of zeros deflate to almost
 * nothing, so a 900-megapixel image is about 110 KB — a decompression bomb.
 */
async function bombPng(width: number, height: number): Promise<Buffer> {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 1; // bit depth
  ihdr[9] = 0; // greyscale
  const row = 1 + Math.ceil(width / 8);
  const deflate = zlib.createDeflate({ level: 9 });
  const parts: Buffer[] = [];
  deflate.on("data", (c: Buffer) => parts.push(c));
  const ended = new Promise((r) => deflate.on("end", r));
  const rows = 256;
  const zeros = Buffer.alloc(row * rows);
  for (let y = 0; y < height; y += rows) deflate.write(zeros.subarray(0, row * Math.min(rows, height - y)));
  deflate.end();
  await ended;
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    pngChunk("IHDR", ihdr),
    pngChunk("IDAT", Buffer.concat(parts)),
    pngChunk("IEND", Buffer.alloc(0)),
  ]);
}
/** A valid JPEG's start followed by padding up to `bytes`: big, but every header check would pass. */
async function paddedJpeg(bytes: number): Promise<Buffer> {
  const head = await jpeg();
  const out = Buffer.alloc(bytes);
  head.copy(out);
  return out;
}

const sha256 = (b: Buffer) => createHash("sha256").update(b).digest("hex");

const photoCount = (app: TestApp) => app.db.select({ n: sql<number>`count(*)` }).from(photos).get()!.n;
const tempFiles = () => (fs.existsSync(uploadTempDir()) ? fs.readdirSync(uploadTempDir()) : []);

/** What is on disk and in the table now; a refused upload must leave both as they were. */
function snapshot(app: TestApp, dir: string) {
  return { uploads: filesUnder(dir), rows: photoCount(app), temp: tempFiles() };
}

type Attach = { buffer: Buffer; filename: string; contentType?: string };
function upload(agent: Agent, objectId: string, file: Attach | null, fields: Record<string, string> = { kind: "recto" }) {
  let req = agent.post(`/api/objects/${objectId}/photos`);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  if (file) req = req.attach("file", file.buffer, { filename: file.filename, ...(file.contentType ? { contentType: file.contentType } : {}) });
  return req;
}

/** Asserts the refusal: status, code, a full sentence in fields.file, and nothing left behind. */
async function expectRefused(app: TestApp, dir: string, send: () => Promise<Response>, status: number, code: string, message: RegExp) {
  const before = snapshot(app, dir);
  const res = await send();
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  const err = expectErrorShape(res.body, code);
  expect(err.fields?.file).toMatch(message);
  expect(err.fields?.file).toMatch(/^[A-Z].*\.$/);
  expect(snapshot(app, dir)).toEqual(before);
  return err;
}

// The worker is stopped without an "exit" event, so the private temporary folder is tidied here.
afterAll(() => fs.rmSync(uploadTempDir(), { recursive: true, force: true }));

beforeAll(async () => {
  studio = await makeStudio(t);
  as = await agentsFor(t, studio.people);
  obj = {
    collector: makeObject(t.db, studio.collectorClient.id),
    institution: makeObject(t.db, studio.institution.id),
    other: makeObject(t.db, studio.otherInstitution.id),
  };
});

describe("POST /api/objects/:id/photos — refusals", () => {
  it("when a PNG is renamed .jpg, then it answers 422 naming both types, and nothing is written", async () => {
    const buffer = await pngBytes();
    const err = await expectRefused(t, UPLOADS, () => upload(as.framer, obj.collector, { buffer, filename: "recto.jpg" }), 422, "validation_failed", /JPEG/);
    expect(err.fields?.file).toBe("This file says it is a JPEG image, but its contents are a PNG image. Rename it to end in .png, then upload it again.");
  });

  it("when a PNG is named .png but sent as image/jpeg, then the declared type still has to agree", async () => {
    const buffer = await pngBytes();
    await expectRefused(
      t,
      UPLOADS,
      () => upload(as.framer, obj.collector, { buffer, filename: "recto.png", contentType: "image/jpeg" }),
      422,
      "validation_failed",
      /says it is a JPEG image, but its contents are a PNG image/,
    );
  });

  it("when a text file is renamed .png, then it answers 422 saying it is text", async () => {
    const buffer = Buffer.from("Condition notes: light foxing, lower left. Not a photograph.\n");
    const err = await expectRefused(t, UPLOADS, () => upload(as.framer, obj.collector, { buffer, filename: "notes.png" }), 422, "validation_failed", /text/);
    expect(err.fields?.file).toBe("This file says it is a PNG image, but its contents are text, not an image. Reversa accepts JPEG, PNG, WebP and TIFF photographs.");
  });

  it("when an SVG is sent, then it answers 422 saying it is an SVG drawing", async () => {
    const err = await expectRefused(
      t,
      UPLOADS,
      () => upload(as.framer, obj.collector, { buffer: SVG, filename: "drawing.svg", contentType: "image/svg+xml" }),
      422,
      "validation_failed",
      /SVG/,
    );
    expect(err.fields?.file).toBe("This file is an SVG drawing. Reversa accepts JPEG, PNG, WebP and TIFF photographs.");
  });

  it("when an SVG is renamed .jpg, then it is still refused as an SVG", async () => {
    await expectRefused(
      t,
      UPLOADS,
      () => upload(as.framer, obj.collector, { buffer: SVG, filename: "drawing.jpg" }),
      422,
      "validation_failed",
      /says it is a JPEG image, but its contents are an SVG drawing/,
    );
  });

  it("when a GIF is sent, then it answers 422 naming GIF", async () => {
    const gif = await plain(20, 20).gif().toBuffer();
    await expectRefused(
      t,
      UPLOADS,
      () => upload(as.framer, obj.collector, { buffer: gif, filename: "anim.gif" }),
      422,
      "validation_failed",
      /^This file is a GIF image\. Reversa accepts/,
    );
  });

  it("when a 0-byte file is sent, then it answers 422 saying it is empty", async () => {
    await expectRefused(t, UPLOADS, () => upload(as.framer, obj.collector, { buffer: Buffer.alloc(0), filename: "empty.jpg" }), 422, "validation_failed", /empty \(0 bytes\)/);
  });

  it("when a 60 MB file is sent at the default 40 MB cap, then it answers 413 for its size, and nothing is left on disk", async () => {
    const buffer = await paddedJpeg(60 * 1024 * 1024);
    const err = await expectRefused(t, UPLOADS, () => upload(as.framer, obj.collector, { buffer, filename: "huge.jpg" }), 413, "payload_too_large", /larger than 40 MB/);
    expect(err.message).toBe(err.fields?.file);
  });

  it("when an image of 30,000 × 30,000 pixels is sent, then it answers 422 from its header, before decoding it", async () => {
    const buffer = await bombPng(30_000, 30_000);
    expect(buffer.length).toBeLessThan(200_000);
    // The refusal quotes the header's size: decoding 900 megapixels (about 1 GB) is never tried.
    const err = await expectRefused(
      t,
      UPLOADS,
      () => upload(as.framer, obj.collector, { buffer, filename: "bomb.png" }),
      422,
      "validation_failed",
      /30,000 × 30,000 pixels \(900 megapixels\)/,
    );
    expect(err.fields?.file).toMatch(/up to 100 megapixels/);
  });

  it("when a JPEG is cut off half-way, then it answers 422 saying it may be damaged", async () => {
    const whole = await noisy(600, 400).jpeg().toBuffer();
    await expectRefused(
      t,
      UPLOADS,
      () => upload(as.framer, obj.collector, { buffer: whole.subarray(0, whole.length >> 1), filename: "cut.jpg" }),
      422,
      "validation_failed",
      /damaged or incomplete/,
    );
  });

  it("when no file comes with the request, then it answers 422 on the file field", async () => {
    await expectRefused(t, UPLOADS, () => upload(as.framer, obj.collector, null), 422, "validation_failed", /no file came with the request/);
  });

  it("when two files come in one request, then it answers 422: one photo per request", async () => {
    const buffer = await jpeg();
    await expectRefused(
      t,
      UPLOADS,
      () => as.framer.post(`/api/objects/${obj.collector}/photos`).field("kind", "recto").attach("file", buffer, "a.jpg").attach("file", buffer, "b.jpg"),
      422,
      "validation_failed",
      /one photo per request/,
    );
  });

  it("when the kind is missing or unknown, then it answers 422 on kind and nothing is written", async () => {
    const buffer = await jpeg();
    for (const fields of [{}, { kind: "x-ray" }] as Record<string, string>[]) {
      const before = snapshot(t, UPLOADS);
      const res = await upload(as.framer, obj.collector, { buffer, filename: "recto.jpg" }, fields);
      expect(res.status).toBe(422);
      expect(expectErrorShape(res.body, "validation_failed").fields?.kind).toBeTruthy();
      expect(snapshot(t, UPLOADS)).toEqual(before);
    }
  });

  it("when the report given is another object's, then it answers 422 on reportId and nothing is written", async () => {
    const reportId = randomUUID();
    t.db
      .insert(conditionReports)
      .values({ id: reportId, objectId: obj.institution, context: "arrival", reportDate: "2026-11-20", examinerName: "Test framer", rating: "good" })
      .run();
    const before = snapshot(t, UPLOADS);
    const res = await upload(as.framer, obj.collector, { buffer: await jpeg(), filename: "recto.jpg" }, { kind: "recto", reportId });
    expect(res.status).toBe(422);
    expect(expectErrorShape(res.body, "validation_failed").fields?.reportId).toBe("That condition report is not one of this object's reports.");
    expect(snapshot(t, UPLOADS)).toEqual(before);
  });

  it("when the object does not exist, then it answers 404", async () => {
    const res = await upload(as.framer, randomUUID(), { buffer: await jpeg(), filename: "recto.jpg" });
    expect(res.status).toBe(404);
    expectErrorShape(res.body, "not_found");
  });
});

describe("POST /api/objects/:id/photos — a small cap", () => {
  const SMALL = uploadsDir("small");
  const small = createTestApp({ env: { UPLOADS_DIR: SMALL, MAX_UPLOAD_MB: "1", MAX_UPLOAD_MEGAPIXELS: "0.5" } });
  let framer: Agent;
  let objectId: string;
  beforeAll(async () => {
    const s = await makeStudio(small);
    framer = await agentFor(small, s.people.framer);
    objectId = makeObject(small.db, s.collectorClient.id);
  });

  it("when a file over MAX_UPLOAD_MB is sent, then it answers 413 naming the configured cap", async () => {
    const buffer = await paddedJpeg(3 * 1024 * 1024);
    await expectRefused(small, SMALL, () => upload(framer, objectId, { buffer, filename: "big.jpg" }), 413, "payload_too_large", /larger than 1 MB/);
  });

  it("when an image over MAX_UPLOAD_MEGAPIXELS is sent, then it answers 422 naming the configured limit", async () => {
    const buffer = await jpeg(1000, 600);
    await expectRefused(
      small,
      SMALL,
      () => upload(framer, objectId, { buffer, filename: "wide.jpg" }),
      422,
      "validation_failed",
      /1,000 × 600 pixels \(0\.6 megapixels\); Reversa accepts photos of up to 0\.5 megapixels/,
    );
  });

  it("when a file just under both limits is sent, then it is accepted", async () => {
    const res = await upload(framer, objectId, { buffer: await jpeg(800, 600), filename: "ok.jpg" });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(filesUnder(SMALL)).toHaveLength(4);
  });
});

describe("POST /api/objects/:id/photos — accepted", () => {
  it("when a JPEG with GPS tags is uploaded, then the original is kept byte for byte with its SHA-256 and no served version carries GPS or any EXIF", async () => {
    const buffer = await noisy(1200, 800).jpeg({ quality: 90 }).withExif(GPS_EXIF).toBuffer();
    expect(await exifr.gps(buffer)).toMatchObject({ latitude: 51.5, longitude: -0.125 });
    const res = await upload(as.framer, obj.collector, { buffer, filename: "IMG_0001.JPG" }, { kind: "raking-light", caption: "Cockling across the lower third" });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const p = res.body as Photo;
    expect(p).toMatchObject({
      objectId: obj.collector,
      reportId: null,
      kind: "raking-light",
      caption: "Cockling across the lower third",
      takenAt: "2026-11-20T14:03:05+01:00",
      mime: "image/jpeg",
      width: 1200,
      height: 800,
      bytes: buffer.length,
      sha256: sha256(buffer),
      urls: { full: `/api/photos/${p.id}/full`, web: `/api/photos/${p.id}/web`, thumb: `/api/photos/${p.id}/thumb` },
    });

    // The stored original: untouched, under its hash, GPS and all (it is never served).
    const row = t.db.select().from(photos).where(eq(photos.id, p.id)).get()!;
    expect(row.originalKey).toBe(`${p.sha256.slice(0, 2)}/${p.sha256.slice(2, 4)}/${p.sha256}.jpg`);
    const original = fs.readFileSync(path.join(UPLOADS, row.originalKey));
    expect(sha256(original)).toBe(sha256(buffer));
    expect(original.equals(buffer)).toBe(true);
    // No trace of the client's file name anywhere on disk.
    expect(filesUnder(UPLOADS).some((f) => f.includes("IMG_0001"))).toBe(false);

    const sizes = { full: [1200, 800], web: [1200, 800], thumb: [400, 267] };
    for (const v of ["full", "web", "thumb"] as const) {
      const r = await binary(as.framer, p.urls[v]);
      expect(r.status).toBe(200);
      expect(r.headers["content-type"]).toBe("image/jpeg");
      expect(r.headers["cache-control"]).toBe("private, no-store");
      expect(r.headers["x-content-type-options"]).toBe("nosniff");
      const bytes = r.body as Buffer;
      expect(await exifr.gps(bytes)).toBeUndefined();
      expect(await exifr.parse(bytes, { tiff: true, ifd0: {}, exif: true, gps: true, xmp: true, iptc: true })).toBeUndefined();
      const meta = await sharp(bytes).metadata();
      expect([meta.width, meta.height]).toEqual(sizes[v]);
      expect(meta.exif).toBeUndefined();
      expect(meta.xmp).toBeUndefined();
      expect(meta.iptc).toBeUndefined();
    }
  });

  it("when a photo is turned by its EXIF orientation, then its size and versions are upright", async () => {
    const buffer = await plain(60, 40).jpeg().withMetadata({ orientation: 6 }).toBuffer();
    const res = await upload(as.framer, obj.collector, { buffer, filename: "turned.jpg" });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ width: 40, height: 60, takenAt: null });
    const full = await binary(as.framer, (res.body as Photo).urls.full);
    const meta = await sharp(full.body as Buffer).metadata();
    expect([meta.width, meta.height, meta.orientation]).toEqual([40, 60, undefined]);
  });

  it("when a large photo is uploaded, then the web version fits inside 2048 px and the thumbnail inside 400 px", async () => {
    const res = await upload(as.framer, obj.collector, { buffer: await noisy(3000, 1500).jpeg().toBuffer(), filename: "recto.jpeg" });
    expect(res.status).toBe(201);
    const p = res.body as Photo;
    const dims = async (v: "full" | "web" | "thumb") => {
      const m = await sharp((await binary(as.framer, p.urls[v])).body as Buffer).metadata();
      return [m.width, m.height];
    };
    expect(await dims("full")).toEqual([3000, 1500]);
    expect(await dims("web")).toEqual([2048, 1024]);
    expect(await dims("thumb")).toEqual([400, 200]);
  });

  it.each([
    ["PNG", "image/png", "verso.png", () => pngBytes(), "image/jpeg"],
    [
      "PNG with transparency",
      "image/png",
      "detail.png",
      () =>
        sharp({ create: { width: 50, height: 50, channels: 4, background: { r: 10, g: 20, b: 30, alpha: 0.5 } } })
          .png()
          .toBuffer(),
      "image/png",
    ],
    ["WebP", "image/webp", "uv.webp", () => plain(50, 40).webp().toBuffer(), "image/jpeg"],
    ["TIFF", "image/tiff", "scan.tif", () => plain(50, 40).tiff().toBuffer(), "image/jpeg"],
  ])("when a %s is uploaded, then it is accepted and served as its web type", async (_what, mime, filename, make, served) => {
    const buffer = await make();
    const res = await upload(as.framer, obj.collector, { buffer, filename });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ mime, sha256: sha256(buffer), bytes: buffer.length });
    const r = await binary(as.framer, (res.body as Photo).urls.web);
    expect(r.status).toBe(200);
    expect(r.headers["content-type"]).toBe(served);
    expect((await sharp(r.body as Buffer).metadata()).format).toBe(served === "image/png" ? "png" : "jpeg");
  });

  it("when a file has no ending and a vague type, then its bytes alone decide and it is accepted", async () => {
    const buffer = await jpeg();
    const res = await upload(as.framer, obj.collector, { buffer, filename: "scan", contentType: "application/octet-stream" });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
  });

  it("when the same file is uploaded twice, then there are two photos sharing one stored original", async () => {
    const buffer = await noisy(120, 90).jpeg().toBuffer();
    const before = filesUnder(UPLOADS).length;
    const a = await upload(as.framer, obj.collector, { buffer, filename: "same.jpg" }, { kind: "recto" });
    const b = await upload(as.framer, obj.collector, { buffer, filename: "same.jpg" }, { kind: "detail" });
    expect([a.status, b.status]).toEqual([201, 201]);
    expect(a.body.id).not.toBe(b.body.id);
    expect(filesUnder(UPLOADS).length).toBe(before + 4);
  });

  it("when several photos are uploaded at once, then each gets its own answer and row", async () => {
    const files = await Promise.all(
      [1, 2, 3, 4].map((i) =>
        noisy(400 + i * 10, 300)
          .jpeg()
          .toBuffer(),
      ),
    );
    const rowsBefore = photoCount(t);
    const results = await Promise.all(
      files.map((buffer, i) => upload(as.framer, obj.institution, { buffer, filename: `p${i}.jpg` }, { kind: "detail", caption: `Detail ${i + 1}` })),
    );
    expect(results.map((r) => r.status)).toEqual([201, 201, 201, 201]);
    expect(photoCount(t)).toBe(rowsBefore + 4);
    expect(tempFiles()).toEqual([]);
  });

  it("when saving the row fails after the files were written, then the files this upload wrote are removed and no row is left", async () => {
    t.database.sqlite.exec(`create trigger photos_test_fail before insert on photos when new.caption = 'fail on insert' begin select raise(abort, 'test: refused'); end`);
    try {
      const before = snapshot(t, UPLOADS);
      const res = await upload(as.framer, obj.collector, { buffer: await noisy(200, 150).jpeg().toBuffer(), filename: "x.jpg" }, { kind: "recto", caption: "fail on insert" });
      expect(res.status).toBe(500);
      expectErrorShape(res.body, "internal");
      expect(snapshot(t, UPLOADS)).toEqual(before);
    } finally {
      t.database.sqlite.exec("drop trigger photos_test_fail");
    }
  });
});

describe("who may upload, list, edit and fetch", () => {
  let collectorPhoto: Photo;
  let institutionPhoto: Photo;
  let otherPhoto: Photo;
  beforeAll(async () => {
    collectorPhoto = (await upload(as.framer, obj.collector, { buffer: await jpeg(), filename: "c.jpg" }, { kind: "recto", caption: "Front" })).body;
    institutionPhoto = (await upload(as.framer, obj.institution, { buffer: await jpeg(70, 50), filename: "i.jpg" }, { kind: "verso" })).body;
    otherPhoto = (await upload(as.framer, obj.other, { buffer: await jpeg(80, 50), filename: "o.jpg" }, { kind: "uv" })).body;
    expect([collectorPhoto.id, institutionPhoto.id, otherPhoto.id].every(Boolean)).toBe(true);
  });

  it.each([
    ["framer", "collector", 201],
    ["admin", "institution", 201],
    ["registrar", "institution", 201],
    ["registrar", "other", 404],
    ["collector", "collector", 403],
    ["collector", "other", 404],
  ] as const)("when a %s uploads to the %s object, then it answers %i", async (role, target, status) => {
    const before = snapshot(t, UPLOADS);
    const res = await upload(as[role], obj[target], { buffer: await noisy(40, 30).jpeg().toBuffer(), filename: "r.jpg" });
    expect(res.status, JSON.stringify(res.body)).toBe(status);
    if (status !== 201) {
      expectErrorShape(res.body, status === 403 ? "forbidden" : "not_found");
      expect(snapshot(t, UPLOADS)).toEqual(before);
    }
  });

  it("when signed out, then uploading, listing and fetching answer 401", async () => {
    const anon = t.agent();
    const before = snapshot(t, UPLOADS);
    const up = await upload(anon, obj.collector, { buffer: await jpeg(), filename: "a.jpg" });
    expect(up.status).toBe(401);
    expectErrorShape(up.body, "unauthenticated");
    expect(snapshot(t, UPLOADS)).toEqual(before);
    expect((await anon.get(`/api/objects/${obj.collector}/photos`)).status).toBe(401);
    expect((await anon.get(collectorPhoto.urls.thumb)).status).toBe(401);
    expect((await anon.put(`/api/photos/${collectorPhoto.id}`).send({ kind: "detail" })).status).toBe(401);
  });

  it("when the collector lists and fetches their own object's photos, then they get them", async () => {
    const list = await as.collector.get(`/api/objects/${obj.collector}/photos`);
    expect(list.status).toBe(200);
    const items = list.body.items as Photo[];
    expect(items.map((p) => p.id)).toContain(collectorPhoto.id);
    expect(items.every((p) => p.objectId === obj.collector)).toBe(true);
    // Oldest first: the order they were added.
    expect(items.map((p) => p.createdAt)).toEqual([...items.map((p) => p.createdAt)].sort());
    for (const v of ["full", "web", "thumb"] as const) expect((await binary(as.collector, collectorPhoto.urls[v])).status).toBe(200);
    expect((await as.collector.get(`/api/photos/${collectorPhoto.id}`)).body).toMatchObject({ id: collectorPhoto.id, caption: "Front" });
  });

  it("when a collector requests another client's photo file by its URL, then it answers 404 in the error shape, exactly as for a photo that does not exist", async () => {
    for (const v of ["full", "web", "thumb"] as const) {
      const res = await as.collector.get(otherPhoto.urls[v]);
      expect(res.status).toBe(404);
      expect(res.headers["content-type"]).toMatch(/application\/json/);
      expect(expectErrorShape(res.body, "not_found").message).toBe("That photo was not found.");
      expect(res.headers["cache-control"]).toBeUndefined();
    }
    const missing = await as.collector.get(`/api/photos/${randomUUID()}/web`);
    expect(missing.status).toBe(404);
    expect(missing.body).toEqual((await as.collector.get(otherPhoto.urls.web)).body);
    expect((await as.collector.get(`/api/objects/${obj.other}/photos`)).status).toBe(404);
    expect((await as.collector.get(`/api/photos/${otherPhoto.id}`)).status).toBe(404);
    expect((await as.registrar.get(otherPhoto.urls.thumb)).status).toBe(404);
    expect((await as.registrar.get(institutionPhoto.urls.thumb)).status).toBe(200);
  });

  it("when anyone asks for the original, or a version that does not exist, then it answers 404", async () => {
    for (const v of ["original", "raw", "..", "full.jpg"]) {
      const res = await as.framer.get(`/api/photos/${collectorPhoto.id}/${v}`);
      expect(res.status, v).toBe(404);
      expectErrorShape(res.body, "not_found");
    }
  });

  it("when a framer edits a photo's kind and caption, then it answers 200 with the change", async () => {
    const res = await as.framer.put(`/api/photos/${collectorPhoto.id}`).send({ kind: "detail", caption: "  Foxing, upper right  " });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ id: collectorPhoto.id, kind: "detail", caption: "Foxing, upper right", sha256: collectorPhoto.sha256 });
    const cleared = await as.framer.put(`/api/photos/${collectorPhoto.id}`).send({ kind: "recto", caption: "" });
    expect(cleared.body).toMatchObject({ kind: "recto", caption: null });
  });

  it("when a registrar edits their institution's photo, then it answers 200; another institution's, 404", async () => {
    expect((await as.registrar.put(`/api/photos/${institutionPhoto.id}`).send({ kind: "uv", caption: "UV fluorescence" })).status).toBe(200);
    expect((await as.registrar.put(`/api/photos/${otherPhoto.id}`).send({ kind: "uv" })).status).toBe(404);
  });

  it("when a collector edits their own photo, then it answers 403; another client's, 404", async () => {
    const own = await as.collector.put(`/api/photos/${collectorPhoto.id}`).send({ kind: "verso" });
    expect(own.status).toBe(403);
    expectErrorShape(own.body, "forbidden");
    expect((await as.collector.put(`/api/photos/${otherPhoto.id}`).send({ kind: "verso" })).status).toBe(404);
  });

  it("when an edit names an unknown kind, then it answers 422 on kind", async () => {
    const res = await as.framer.put(`/api/photos/${collectorPhoto.id}`).send({ kind: "x-ray", caption: null });
    expect(res.status).toBe(422);
    expect(expectErrorShape(res.body, "validation_failed").fields?.kind).toBeTruthy();
  });

  it("when photos are listed for one report, then only that report's photos come back", async () => {
    const reportId = randomUUID();
    t.db.insert(conditionReports).values({ id: reportId, objectId: obj.other, context: "arrival", reportDate: "2026-11-21", examinerName: "Test framer", rating: "fair" }).run();
    const res = await upload(as.framer, obj.other, { buffer: await jpeg(30, 30), filename: "r.jpg" }, { kind: "detail", reportId });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.reportId).toBe(reportId);
    const list = await as.framer.get(`/api/objects/${obj.other}/photos?reportId=${reportId}`);
    expect(list.body.items.map((p: Photo) => p.id)).toEqual([res.body.id]);
    const all = await as.framer.get(`/api/objects/${obj.other}/photos`);
    expect(all.body.items.length).toBeGreaterThan(1);
  });
});

describe("photos of a draft condition report", () => {
  it("when a photo is taken for a draft report, then those who cannot see drafts do not see it either, until the report is signed", async () => {
    const reportId = randomUUID();
    t.db
      .insert(conditionReports)
      .values({ id: reportId, objectId: obj.collector, context: "arrival", reportDate: "2026-11-20", examinerName: "Test framer", rating: "good", status: "draft" })
      .run();
    const up = await upload(as.framer, obj.collector, { buffer: await jpeg(66, 44), filename: "draft.jpg" }, { kind: "detail", reportId });
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const photo = up.body as Photo;
    // The studio sees it; the collector (who cannot see drafts) gets nothing: not listed, 404 as for no photo.
    expect((await as.framer.get(`/api/objects/${obj.collector}/photos`)).body.items.map((p: Photo) => p.id)).toContain(photo.id);
    expect((await as.collector.get(`/api/objects/${obj.collector}/photos`)).body.items.map((p: Photo) => p.id)).not.toContain(photo.id);
    expect((await as.collector.get(`/api/photos/${photo.id}`)).status).toBe(404);
    for (const v of ["full", "web", "thumb"] as const) expect((await binary(as.collector, photo.urls[v])).status).toBe(404);
    // Signed, the report and its photos are the owner's to see.
    t.db.update(conditionReports).set({ status: "signed" }).where(eq(conditionReports.id, reportId)).run();
    expect((await as.collector.get(`/api/objects/${obj.collector}/photos`)).body.items.map((p: Photo) => p.id)).toContain(photo.id);
    expect((await binary(as.collector, photo.urls.thumb)).status).toBe(200);
  });
});
