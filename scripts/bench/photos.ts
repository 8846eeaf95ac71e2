import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { nth } from "./nth.ts";

// ── Photos: a 24-megapixel JPEG through the upload's own processing ──────────
// Run in a fresh child process (as the server would), so its memory is the processing's and not the
// seeded database's: inspectUpload + renderVersions (full, web and thumbnail) as the route calls them,
// then the whole service.upload (checks, versions, SHA-256 and storage of the original, the row).
// Peak RSS is sampled every 20 ms and also read from the kernel (maxRSS).
export async function benchPhotos({ dir, file, objectIds, framerId }: { dir: string; file: string; objectIds: string[]; framerId: string }) {
  const sharp = (await import("sharp")).default;
  const photo = path.join(dir, "bench-24mp.jpg");
  const tg = performance.now();
  // Gaussian noise at sigma 20 compresses like a real camera file (about 11 MB at quality 90).
  await sharp({ create: { width: 6000, height: 4000, channels: 3, background: "#808080", noise: { type: "gaussian", mean: 128, sigma: 20 } } })
    .jpeg({ quality: 90 })
    .toFile(photo);
  const photoMb = fs.statSync(photo).size / 1e6;
  console.log(`\nPhotos: made a 6000 × 4000 JPEG (${photoMb.toFixed(1)} MB) in ${((performance.now() - tg) / 1000).toFixed(1)} s.`);
  const objectId = nth(objectIds, 0);
  const childCode = `
    import fs from "node:fs";
    import { inspectUpload } from "./server/features/photos/photos.inspect.ts";
    import { renderVersions } from "./server/features/photos/photos.versions.ts";
    import { createPhotosService } from "./server/features/photos/photos.service.ts";
    import { createStorage } from "./server/lib/storage.ts";
    import { openDatabase } from "./server/db/client.ts";
    const { BENCH_PHOTO: file, BENCH_DB: dbFile, BENCH_UPLOADS: uploads, BENCH_OBJECT: objectId, BENCH_USER: userId } = process.env;
    const limits = { maxUploadMb: 40, maxUploadMegapixels: 100 };
    const declared = { originalName: "IMG_0001.JPG", mimetype: "image/jpeg" };
    const base = process.memoryUsage().rss;
    let peak = base;
    const sampler = setInterval(() => { peak = Math.max(peak, process.memoryUsage().rss); }, 20);
    const render = [];
    for (let i = 0; i < 5; i++) {
      const t = performance.now();
      const info = await inspectUpload(file, declared, limits);
      const v = await renderVersions(file, info, limits, file + ".full");
      render.push({ ms: performance.now() - t, full: v.full.bytes, web: v.web.length, thumb: v.thumb.length });
      fs.rmSync(v.fullFile);
    }
    const renderPeak = peak;
    const database = openDatabase(dbFile, { migrate: false });
    const service = createPhotosService(database.db, createStorage(uploads), limits);
    const user = { id: userId, name: "Bench framer", email: "framer@bench.test", role: "framer", clientId: null };
    const size = fs.statSync(file).size;
    const upload = [];
    for (let i = 0; i < 4; i++) {
      const t = performance.now();
      await service.upload(user, objectId, { path: file, size, originalname: declared.originalName, mimetype: declared.mimetype }, { kind: "recto" });
      upload.push(performance.now() - t);
    }
    clearInterval(sampler);
    database.close();
    console.log(JSON.stringify({ base, renderPeak, peak: Math.max(peak, process.memoryUsage().rss), maxRss: process.resourceUsage().maxRSS * 1024, render, upload }));
  `;
  const out = spawnSync(process.execPath, ["--import", "tsx", "--input-type=module", "-e", childCode], {
    encoding: "utf8",
    env: { ...process.env, BENCH_PHOTO: photo, BENCH_DB: file, BENCH_UPLOADS: path.join(dir, "uploads"), BENCH_OBJECT: objectId, BENCH_USER: framerId },
    stdio: ["ignore", "pipe", "inherit"],
  });
  const line = out.stdout.trim().split("\n").pop() ?? "";
  if (out.status !== 0 || !line.startsWith("{")) throw new Error(`photo bench child failed (${out.status}): ${out.stdout}`);
  const r = JSON.parse(line) as {
    base: number;
    renderPeak: number;
    peak: number;
    maxRss: number;
    render: { ms: number; full: number; web: number; thumb: number }[];
    upload: number[];
  };
  const mb = (b: number) => `${Math.round(b / 1048576)} MB`;
  const med = (xs: number[]) =>
    nth(
      [...xs].sort((a, b) => a - b),
      Math.floor(xs.length / 2),
    );
  const renderMs = r.render.map((x) => x.ms);
  const ok = (v: boolean) => (v ? "✓" : "✕ over target");
  const worstRender = Math.max(...renderMs);
  console.log(
    `24 MP JPEG → full + web + thumbnail (inspectUpload + renderVersions), ${renderMs.length} runs: first ${nth(renderMs, 0).toFixed(0)} ms, median ${med(renderMs).toFixed(0)} ms, worst ${worstRender.toFixed(0)} ms   (target < 2000 ms ${ok(worstRender < 2000)})`,
  );
  const firstRender = nth(r.render, 0);
  console.log(`  versions: full ${(firstRender.full / 1e6).toFixed(1)} MB, web ${Math.round(firstRender.web / 1e3)} KB, thumbnail ${Math.round(firstRender.thumb / 1e3)} KB`);
  console.log(`  whole service.upload (checks, versions, SHA-256 + storage, row), 4 runs: median ${med(r.upload).toFixed(0)} ms`);
  console.log(
    `  process memory: ${mb(r.base)} before, peak ${mb(r.renderPeak)} while rendering, ${mb(r.peak)} with the uploads (sampled every 20 ms); kernel maxRSS ${mb(r.maxRss)}   (target < 400 MB ${ok(r.maxRss < 400 * 1048576)})`,
  );
}
