import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { spawnSync, spawn } from "node:child_process";
import Database from "better-sqlite3";
import sharp from "sharp";
import { afterAll, describe, expect, it } from "vitest";
import { signInCookie, startServer, type RunningServer } from "../../scripts/lib/spawn-server.ts";
import { DEMO_PASSWORD } from "../../server/db/seed.ts";

const work = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-backup-test-"));
const servers: RunningServer[] = [];
afterAll(async () => {
  for (const s of servers) await s.stop();
  fs.rmSync(work, { recursive: true, force: true });
});

const run = (script: string, args: string[], env: Record<string, string>) =>
  new Promise<{ code: number; out: string }>((resolve) => {
    const c = spawn(process.execPath, ["--import", "tsx", script, ...args], { env: { ...process.env, ...env }, stdio: ["ignore", "pipe", "pipe"] });
    let out = "";
    c.stdout.on("data", (d) => (out += d));
    c.stderr.on("data", (d) => (out += d));
    c.on("exit", (code) => resolve({ code: code ?? 1, out }));
  });

describe("npm run backup and npm run restore", () => {
  it("when a backup is taken while the app takes writes, then it restores every record acknowledged before it began and every file, and the restored app runs with the same secrets", async () => {
    const live = path.join(work, "live");
    const server = await startServer({ SEED_DEMO: "true" }, live);
    servers.push(server);
    const cookie = await signInCookie(server.baseUrl, "framer@reversa.test", DEMO_PASSWORD);
    const headers = { "content-type": "application/json", cookie, origin: server.baseUrl };
    const clientId = (await (await fetch(`${server.baseUrl}/api/clients`, { headers })).json()).items[0].id as string;
    let n = 0;
    const create = async () => {
      const number = `BK-${String(++n).padStart(5, "0")}`;
      const r = await fetch(`${server.baseUrl}/api/objects`, {
        method: "POST",
        headers,
        body: JSON.stringify({ objectNumber: number, title: `Backup study ${n}`, objectType: "print", sheetWidthMm: 210, sheetHeightMm: 297, clientId, status: "in-studio" }),
      });
      if (r.status !== 201) throw new Error(`create answered ${r.status}: ${await r.text()}`);
      return (await r.json()).id as string;
    };
    const before: string[] = [];
    for (let i = 0; i < 20; i++) before.push(await create());
    // A photo, so the uploads are part of it.
    const target = before[0];
    const form = new FormData();
    form.set("kind", "recto");
    form.set(
      "file",
      new Blob(
        [
          await sharp({ create: { width: 48, height: 32, channels: 3, background: { r: 120, g: 100, b: 80 } } })
            .png()
            .toBuffer(),
        ],
        { type: "image/png" },
      ),
      "recto.png",
    );
    const up = await fetch(`${server.baseUrl}/api/objects/${target}/photos`, { method: "POST", headers: { cookie, origin: server.baseUrl }, body: form });
    expect(up.status).toBe(201);
    const photo = await up.json();

    // Writes keep coming while the backup runs.
    let loading = true;
    const during: Promise<unknown>[] = [];
    const load = (async () => {
      while (loading) during.push(await create().catch((e) => e));
    })();
    const backupDir = path.join(work, "backup");
    const b = await run("scripts/backup.ts", [backupDir], { DATABASE_URL: path.join(live, "reversa.db"), UPLOADS_DIR: path.join(live, "uploads"), LOG_LEVEL: "silent" });
    loading = false;
    await load;
    expect(b.code, b.out).toBe(0);
    expect(during.filter((d) => d instanceof Error)).toEqual([]);

    const restored = path.join(work, "restored");
    const r = await run("scripts/restore.ts", [backupDir, restored], {});
    expect(r.code, r.out).toBe(0);

    const db = new Database(path.join(restored, "reversa.db"), { readonly: true });
    try {
      const ids = new Set((db.prepare("select id from objects").all() as { id: string }[]).map((x) => x.id));
      for (const id of before) expect(ids.has(id), id).toBe(true);
      expect(db.pragma("integrity_check", { simple: true })).toBe("ok");
      const keys = db.prepare("select original_key, full_key, web_key, thumb_key from photos").raw().all() as string[][];
      expect(keys.length).toBeGreaterThan(0);
      for (const k of keys.flat()) expect(fs.existsSync(path.join(restored, "uploads", k)), k).toBe(true);
    } finally {
      db.close();
    }
    // The secrets came too: the session cookie issued before the backup still works on the restored copy.
    expect(fs.existsSync(path.join(restored, ".auth-secret"))).toBe(true);
    const again = await startServer({ SEED_DEMO: "false" }, restored);
    servers.push(again);
    const me = await fetch(`${again.baseUrl}/api/me`, { headers: { cookie } });
    expect(me.status).toBe(200);
    expect((await fetch(`${again.baseUrl}${photo.urls.thumb}`, { headers: { cookie } })).status).toBe(200);
  });

  it("when a file in the backup was altered, then restore refuses it, names the file and writes nothing", async () => {
    const backupDir = path.join(work, "backup");
    const manifest = JSON.parse(fs.readFileSync(path.join(backupDir, "manifest.json"), "utf8")) as { files: { path: string }[] };
    const victim = manifest.files.find((f) => f.path.startsWith("uploads/"))!.path;
    fs.appendFileSync(path.join(backupDir, victim), "tampered");
    const target = path.join(work, "restore-2");
    const r = spawnSync(process.execPath, ["--import", "tsx", "scripts/restore.ts", backupDir, target], { encoding: "utf8" });
    expect(r.status).toBe(1);
    expect(r.stderr).toContain(victim);
    expect(fs.existsSync(target)).toBe(false);
  });
  it("when the checkpoints are kept elsewhere and the key comes from the environment, then the backup carries the checkpoints, says the key is the operator's to keep, and the restored history verifies", async () => {
    const live = path.join(work, "live-elsewhere");
    const checkpoints = path.join(work, "elsewhere", "checkpoints.log");
    fs.mkdirSync(path.dirname(checkpoints), { recursive: true });
    const env = { HISTORY_KEY: `${"k".repeat(40)}-backup-test-history-key`, HISTORY_CHECKPOINTS: checkpoints };
    const server = await startServer({ SEED_DEMO: "true", ...env }, live);
    servers.push(server);
    const cookie = await signInCookie(server.baseUrl, "framer@reversa.test", DEMO_PASSWORD);
    const headers = { "content-type": "application/json", cookie, origin: server.baseUrl };
    const clientId = (await (await fetch(`${server.baseUrl}/api/clients`, { headers })).json()).items[0].id as string;
    let n = 0;
    let loading = true;
    const failures: string[] = [];
    // Objects keep being made (each one an event and a checkpoint) while the backup runs.
    const load = (async () => {
      while (loading) {
        const r = await fetch(`${server.baseUrl}/api/objects`, {
          method: "POST",
          headers,
          body: JSON.stringify({
            objectNumber: `CP-${String(++n).padStart(5, "0")}`,
            title: `Checkpoint study ${n}`,
            objectType: "print",
            sheetWidthMm: 210,
            sheetHeightMm: 297,
            clientId,
            status: "in-studio",
          }),
        });
        if (r.status !== 201) failures.push(`${r.status} ${await r.text()}`);
      }
    })();
    await new Promise((r) => setTimeout(r, 300));
    expect(fs.statSync(checkpoints).size).toBeGreaterThan(0);
    expect(fs.existsSync(path.join(live, "history-checkpoints.log"))).toBe(false);

    const backupDir = path.join(work, "backup-elsewhere");
    const b = await run("scripts/backup.ts", [backupDir], { DATABASE_URL: path.join(live, "reversa.db"), UPLOADS_DIR: path.join(live, "uploads"), LOG_LEVEL: "silent", ...env });
    loading = false;
    await load;
    expect(b.code, b.out).toBe(0);
    expect(failures).toEqual([]);
    expect(b.out).toMatch(/HISTORY_KEY comes from the environment and is not in this backup/);
    expect(fs.existsSync(path.join(backupDir, "side", "history-checkpoints.log"))).toBe(true);
    expect(fs.existsSync(path.join(backupDir, "side", ".history-key"))).toBe(false);

    const restored = path.join(work, "restored-elsewhere");
    const r = await run("scripts/restore.ts", [backupDir, restored], {});
    expect(r.code, r.out).toBe(0);
    const withKey = await run("server/db/verify-history-cli.ts", [], { DATABASE_URL: path.join(restored, "reversa.db"), HISTORY_KEY: env.HISTORY_KEY, HISTORY_CHECKPOINTS: "" });
    expect(withKey.code, withKey.out).toBe(0);
    expect(Number(withKey.out.match(/and (\d+) objects' checkpointed heads agree/)?.[1] ?? 0), withKey.out).toBeGreaterThan(0);
    // The key is not in the backup: with another one the restored history does not check out.
    const wrongKey = await run("server/db/verify-history-cli.ts", [], { DATABASE_URL: path.join(restored, "reversa.db"), HISTORY_KEY: "w".repeat(40), HISTORY_CHECKPOINTS: "" });
    expect(wrongKey.code).toBe(1);
  });
});
