import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { spawnSync } from "node:child_process";
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import request from "supertest";
import sharp from "sharp";
import { createTestApp, expectErrorShape, makeMounting, makeObject, makeSignedInStudio, type Agent, type RoleAgents } from "../setup/test-app.ts";
import { binary } from "../setup/http.ts";

const t = createTestApp();
let as: RoleAgents;
/** A mounted object of the collector's, whose dossier shows the logo or not. */
let objectId: string;
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-logo-"));

const png = (width: number, height: number) =>
  sharp({ create: { width, height, channels: 4, background: { r: 180, g: 40, b: 60, alpha: 1 } } })
    .png()
    .toBuffer();

/** Images drawn on page 1 (pdfimages -list rows of type "image"; an alpha channel adds a "smask" row, not counted). */
function imagesOnPage1(pdf: Buffer): number {
  const file = path.join(tmp, `${randomUUID()}.pdf`);
  fs.writeFileSync(file, pdf);
  const r = spawnSync("/usr/bin/pdfimages", ["-list", "-f", "1", "-l", "1", file], { encoding: "utf8" });
  expect(r.status, r.stderr).toBe(0);
  return r.stdout.split("\n").filter((l) => /^\s*1\s+\d+\s+image\s/.test(l)).length;
}

const upload = (agent: Agent, bytes: Buffer, filename: string, contentType: string) => agent.put("/api/settings/logo").attach("file", bytes, { filename, contentType });

beforeAll(async () => {
  const signedIn = await makeSignedInStudio(t);
  as = signedIn.as;
  objectId = makeObject(t.db, signedIn.studio.collectorClient.id, { title: "Harbour at dusk" });
  makeMounting(t.db, signedIn.studio.people.framer, objectId);
});

describe("the studio's logo", () => {
  let dossierWithout: Buffer;
  const dossier = async () => {
    const res = await as.admin
      .post(`/api/objects/${objectId}/documents/dossier`)
      .buffer(true)
      .parse(binary as never);
    expect(res.status, String(res.body)).toBe(200);
    return res.body as Buffer;
  };

  it("when there is no logo, then settings say so and GET logo answers 404", async () => {
    expect((await as.admin.get("/api/settings")).body.hasLogo).toBe(false);
    const res = await as.framer.get("/api/settings/logo");
    expect(res.status).toBe(404);
    expectErrorShape(res.body, "not_found");
    dossierWithout = await dossier();
  });

  it("when a framer uploads a logo, then it answers 403", async () => {
    const res = await upload(as.framer, await png(100, 50), "logo.png", "image/png");
    expect(res.status).toBe(403);
    expectErrorShape(res.body, "forbidden");
  });

  it("when the file is not a PNG or JPEG, then it answers 422 on the file field", async () => {
    const svg = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><rect width="10" height="10"/></svg>');
    for (const [bytes, name, type] of [
      [svg, "logo.svg", "image/svg+xml"],
      [Buffer.from("just some text"), "logo.png", "image/png"],
      [
        await sharp({ create: { width: 20, height: 20, channels: 3, background: "#fff" } })
          .webp()
          .toBuffer(),
        "logo.webp",
        "image/webp",
      ],
    ] as const) {
      const res = await upload(as.admin, bytes, name, type);
      expect(res.status).toBe(422);
      const e = expectErrorShape(res.body, "validation_failed");
      expect(e.fields?.file).toMatch(/PNG or JPEG/);
    }
    const none = await as.admin.put("/api/settings/logo").field("other", "x");
    expect(none.status).toBe(422);
    expect(expectErrorShape(none.body, "validation_failed").fields?.file).toBeTruthy();
  });

  it("when the image is too large in pixels, then it answers 422", async () => {
    const big = await sharp({ create: { width: 4001, height: 10, channels: 3, background: "#fff" } })
      .png()
      .toBuffer();
    const res = await upload(as.admin, big, "wide.png", "image/png");
    expect(res.status).toBe(422);
    expect(expectErrorShape(res.body, "validation_failed").fields?.file).toMatch(/4000/);
  });

  it("when the admin uploads a PNG, then it is stored as a PNG at most 600 px wide and everyone can fetch it", async () => {
    const res = await upload(as.admin, await png(1200, 400), "logo.png", "image/png");
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.hasLogo).toBe(true);
    expect((await as.collector.get("/api/settings")).body.hasLogo).toBe(true);
    const img = await as.framer
      .get("/api/settings/logo")
      .buffer(true)
      .parse(binary as never);
    expect(img.status).toBe(200);
    expect(img.headers["content-type"]).toMatch(/^image\/png/);
    const meta = await sharp(img.body as Buffer).metadata();
    expect(meta.format).toBe("png");
    expect(meta.width).toBe(600);
  });

  it("when the settings are saved again, then the logo is kept", async () => {
    const current = (await as.admin.get("/api/settings")).body;
    const { hasLogo: _h, ...body } = current;
    const res = await as.admin.put("/api/settings").send({ ...body, studioName: "Renamed" });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ studioName: "Renamed", hasLogo: true });
  });

  it("when a dossier is issued, then page 1 has one more image: the logo", async () => {
    const withLogo = await dossier();
    expect(imagesOnPage1(withLogo)).toBe(imagesOnPage1(dossierWithout) + 1);
  });

  it("when the admin uploads a JPEG, then it replaces the logo", async () => {
    const jpeg = await sharp({ create: { width: 300, height: 100, channels: 3, background: "#123456" } })
      .jpeg()
      .toBuffer();
    const res = await upload(as.admin, jpeg, "logo.jpg", "image/jpeg");
    expect(res.status).toBe(200);
    const img = await as.admin
      .get("/api/settings/logo")
      .buffer(true)
      .parse(binary as never);
    expect((await sharp(img.body as Buffer).metadata()).width).toBe(300);
  });

  it("when the admin removes the logo, then it is gone (a framer may not)", async () => {
    expect((await as.framer.delete("/api/settings/logo")).status).toBe(403);
    const res = await as.admin.delete("/api/settings/logo");
    expect(res.status).toBe(200);
    expect(res.body.hasLogo).toBe(false);
    expect((await as.admin.get("/api/settings/logo")).status).toBe(404);
    expect(imagesOnPage1(await dossier())).toBe(imagesOnPage1(dossierWithout));
  });

  it("when signed out, then the logo is not served", async () => {
    expect((await request(t.app).get("/api/settings/logo")).status).toBe(401);
  });
});
