import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import Database from "better-sqlite3";
import { afterAll, describe, expect, it } from "vitest";
import { pollUntil } from "../setup/poll.ts";
import { signInCookie, startServer, type RunningServer } from "../../scripts/lib/spawn-server.ts";
import { DEMO_PASSWORD } from "../../server/db/seed.ts";

// Archive jobs live in SQLite (export_jobs), so a server that dies mid-build leaves a row behind. On the
// next start that job is marked failed and its partial ZIP removed: half an archive is never resumed
// or handed out, and it does not hold the client's one-at-a-time slot.
const work = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-archive-restart-"));
const servers: RunningServer[] = [];
afterAll(async () => {
  for (const s of servers) await s.stop();
  fs.rmSync(work, { recursive: true, force: true });
});

describe("an archive job when the server is killed while it is built", () => {
  it("when the server restarts, then the job reads failed with a reason, its partial file is gone, and a new archive runs to done", async () => {
    const first = await startServer({ SEED_DEMO: "true" }, work);
    servers.push(first);
    const cookie = await signInCookie(first.baseUrl, "framer@reversa.test", DEMO_PASSWORD);
    const headers = { cookie, origin: first.baseUrl };
    const clientId = (await (await fetch(`${first.baseUrl}/api/clients`, { headers })).json()).items[0].id as string;

    const start = await fetch(`${first.baseUrl}/api/clients/${clientId}/exports/archive`, { method: "POST", headers });
    expect(start.status).toBe(202);
    const { jobId } = (await start.json()) as { jobId: string };
    await first.stop("SIGKILL");

    // What the crash left behind: the job's row, still running, and its folder.
    const db = new Database(path.join(work, "reversa.db"), { readonly: true });
    const left = db.prepare("select state, dir from export_jobs where id = ?").get(jobId) as { state: string; dir: string };
    db.close();
    expect(left.state, "the archive finished before the kill, so this run shows nothing; the demo client's archive takes far longer than a kill").toBe("running");

    const second = await startServer({ SEED_DEMO: "false" }, work);
    servers.push(second);
    const after = await fetch(`${second.baseUrl}/api/exports/${jobId}`, { headers: { cookie } });
    expect(after.status).toBe(200);
    const status = await after.json();
    expect(status.state).toBe("failed");
    expect(status.message).toMatch(/restarted/);
    expect(fs.existsSync(left.dir)).toBe(false);
    expect((await fetch(`${second.baseUrl}/api/exports/${jobId}/download`, { headers: { cookie } })).status).toBe(409);

    // The failed job does not hold the client's slot: a new archive starts and is built whole.
    const again = await fetch(`${second.baseUrl}/api/clients/${clientId}/exports/archive`, { method: "POST", headers: { cookie, origin: second.baseUrl } });
    expect(again.status).toBe(202);
    const { jobId: newId } = (await again.json()) as { jobId: string };
    const { state } = await pollUntil(
      async () => (await (await fetch(`${second.baseUrl}/api/exports/${newId}`, { headers: { cookie } })).json()) as { state: string },
      (s) => s.state !== "running",
      { intervalMs: 100 },
    );
    expect(state).toBe("done");
    const zip = await fetch(`${second.baseUrl}/api/exports/${newId}/download`, { headers: { cookie } });
    expect(zip.status).toBe(200);
    expect(
      Buffer.from(await zip.arrayBuffer())
        .subarray(0, 2)
        .toString("latin1"),
    ).toBe("PK");
  }, 900_000);
});
