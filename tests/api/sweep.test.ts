import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, makeObject, makeStudio, type Agent } from "../setup/test-app.ts";
import { startServer } from "../../scripts/lib/spawn-server.ts";
import { createStorage } from "../../server/lib/storage.ts";
import { sweepAfterCrash } from "../../server/lib/sweep.ts";
import { photos } from "../../server/db/schema.ts";

const uploads = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-sweep-"));
const t = createTestApp({ env: { UPLOADS_DIR: uploads } });
let framer: Agent;
let objectId: string;
const deadDir = path.join(os.tmpdir(), "reversa-upload-4194301-sweeptest");
const liveDir = path.join(os.tmpdir(), `reversa-upload-${process.pid}-sweeptest`);
afterAll(() => {
  for (const d of [uploads, deadDir, liveDir]) fs.rmSync(d, { recursive: true, force: true });
});
beforeAll(async () => {
  const s = await makeStudio(t);
  framer = await agentFor(t, s.people.framer);
  objectId = makeObject(t.db, s.institution.id);
});

describe("clean after a crash", () => {
  it("when files are left that no row names, half-written files and a dead process's upload folder, then the sweep quarantines the first, removes the rest, and keeps every file a record uses", async () => {
    const png = await sharp({ create: { width: 40, height: 30, channels: 3, background: { r: 200, g: 180, b: 150 } } })
      .png()
      .toBuffer();
    const up = await framer.post(`/api/objects/${objectId}/photos`).field("kind", "recto").attach("file", png, { filename: "recto.png" });
    expect(up.status).toBe(201);
    const row = t.db.select().from(photos).get()!;
    const used = [row.originalKey, row.fullKey, row.webKey, row.thumbKey];

    // A crash after the files were written and before the row: a stored file nobody names.
    const orphan = await createStorage(uploads).put(Buffer.from("bytes of a photo whose row was never written"), "jpg");
    fs.mkdirSync(path.join(uploads, ".incoming"), { recursive: true });
    fs.writeFileSync(path.join(uploads, ".incoming", "half-written"), "partial");
    // Upload folders: one of a process that is gone (pid 4194301 is above Linux's pid_max default), one of this one.
    fs.mkdirSync(deadDir, { recursive: true });
    fs.writeFileSync(path.join(deadDir, "upload"), "partial");
    fs.mkdirSync(liveDir, { recursive: true });

    const report = sweepAfterCrash(t.db, uploads, new Date("2026-12-03T10:00:00Z"));
    expect(report.quarantined).toEqual([orphan.key]);
    expect(fs.existsSync(path.join(uploads, orphan.key))).toBe(false);
    expect(fs.readFileSync(path.join(report.quarantineDir!, orphan.key), "utf8")).toBe("bytes of a photo whose row was never written");
    for (const k of used) expect(fs.existsSync(path.join(uploads, k)), k).toBe(true);
    expect(fs.readdirSync(path.join(uploads, ".incoming"))).toEqual([]);
    expect(report.incomingRemoved).toBe(1);
    expect(fs.existsSync(deadDir)).toBe(false);
    expect(fs.existsSync(liveDir)).toBe(true);
    // The photo still serves.
    expect((await framer.get(`/api/photos/${row.id}/thumb`)).status).toBe(200);
    // A second sweep finds nothing more.
    expect(sweepAfterCrash(t.db, uploads).quarantined).toEqual([]);
  });

  it("when the real server starts on a folder a crash left untidy, then it sweeps before answering and says so in its log", async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-sweep-server-"));
    try {
      const orphan = await createStorage(path.join(dir, "uploads")).put(Buffer.from("left by a crash"), "png");
      fs.mkdirSync(path.join(dir, "uploads", ".incoming"), { recursive: true });
      fs.writeFileSync(path.join(dir, "uploads", ".incoming", "partial"), "x");
      const server = await startServer({ SEED_DEMO: "false", LOG_LEVEL: "info" }, dir);
      try {
        expect(fs.existsSync(path.join(dir, "uploads", orphan.key))).toBe(false);
        expect(fs.readdirSync(path.join(dir, "uploads", ".quarantine"))).toHaveLength(1);
        expect(fs.readdirSync(path.join(dir, "uploads", ".incoming"))).toEqual([]);
        expect(server.output()).toMatch(/moved to quarantine/);
      } finally {
        await server.stop();
      }
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
