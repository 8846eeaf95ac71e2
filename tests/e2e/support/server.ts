import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import type { TestProject } from "vitest/node";

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.listen(0, "127.0.0.1", () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
    s.on("error", reject);
  });
}

let child: ChildProcess | undefined;
let dir: string | undefined;

/** Starts the production server (built client + API) on a free port with a new database and the demo seed. */
export async function setup(project: TestProject) {
  if (!fs.existsSync("dist/client/index.html")) throw new Error("Build the client first (npm run build); test:e2e does it.");
  dir = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-e2e-"));
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  let output = "";
  child = spawn(process.execPath, ["--import", "tsx", "server/index.ts"], {
    env: {
      ...process.env,
      NODE_ENV: "production",
      PORT: String(port),
      HOST: "127.0.0.1",
      PUBLIC_URL: baseUrl,
      DATABASE_URL: path.join(dir, "e2e.db"),
      UPLOADS_DIR: path.join(dir, "uploads"),
      LOG_LEVEL: "warn",
      LOGIN_RATE_LIMIT: "100",
    },
    stdio: ["ignore", "pipe", "pipe"],
  });
  child.stdout?.on("data", (d) => (output += d));
  child.stderr?.on("data", (d) => (output += d));
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`The server stopped while starting:\n${output}`);
    try {
      const r = await fetch(`${baseUrl}/api/health`);
      if (r.ok) break;
    } catch {
      /* not up yet */
    }
    if (Date.now() > deadline) throw new Error(`The server did not answer within 30 s:\n${output}`);
    await new Promise((r) => setTimeout(r, 200));
  }
  project.provide("baseUrl", baseUrl);
}

export async function teardown() {
  if (child && child.exitCode === null) {
    child.kill("SIGTERM");
    await new Promise((r) => child!.once("exit", r));
  }
  if (dir) fs.rmSync(dir, { recursive: true, force: true });
}
