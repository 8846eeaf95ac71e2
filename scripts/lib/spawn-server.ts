import { spawn, type ChildProcess } from "node:child_process";
import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.listen(0, "127.0.0.1", () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
    s.on("error", reject);
  });
}

export type RunningServer = {
  baseUrl: string;
  dir: string;
  child: ChildProcess;
  /** The server process's resident memory in MB, read from /proc. */
  rssMb: () => number;
  output: () => string;
  /** Stops the server: SIGTERM, or SIGKILL for a crash. */
  stop: (signal?: NodeJS.Signals) => Promise<void>;
};

/**
 * Starts the real API server (server/index.ts through tsx) as its own process, on a free port, with a new
 * database in a temporary folder (or `dir`, to start again on the same data). Waits for /api/health with a
 * deadline generous enough for a loaded machine.
 */
export async function startServer(env: Record<string, string> = {}, dir?: string): Promise<RunningServer> {
  const folder = dir ?? fs.mkdtempSync(path.join(os.tmpdir(), "reversa-server-"));
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  let output = "";
  const child = spawn(process.execPath, ["--import", "tsx", "server/index.ts"], {
    env: {
      ...process.env,
      NODE_ENV: "test",
      PORT: String(port),
      HOST: "127.0.0.1",
      PUBLIC_URL: baseUrl,
      DATABASE_URL: path.join(folder, "reversa.db"),
      UPLOADS_DIR: path.join(folder, "uploads"),
      LOG_LEVEL: "warn",
      LOGIN_RATE_LIMIT: "1000",
      ...env,
    },
    stdio: ["ignore", "pipe", "pipe"],
  });
  child.stdout?.on("data", (d) => (output += d));
  child.stderr?.on("data", (d) => (output += d));
  const deadline = Date.now() + 90_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`The server stopped while starting:\n${output}`);
    try {
      const r = await fetch(`${baseUrl}/api/health`);
      if (r.ok) break;
    } catch {
      /* not up yet */
    }
    if (Date.now() > deadline) throw new Error(`The server did not answer within 90 s:\n${output}`);
    await new Promise((r) => setTimeout(r, 200));
  }
  return {
    baseUrl,
    dir: folder,
    child,
    output: () => output,
    rssMb: () => {
      const status = fs.readFileSync(`/proc/${child.pid}/status`, "utf8");
      return Number(/VmRSS:\s+(\d+) kB/.exec(status)![1]) / 1024;
    },
    stop: async (signal: NodeJS.Signals = "SIGTERM") => {
      if (child.exitCode !== null || child.signalCode !== null) return;
      const exited = new Promise((r) => child.once("exit", r));
      child.kill(signal);
      await exited;
    },
  };
}

/** Signs in over real HTTP and returns the session cookie to send with later requests. */
export async function signInCookie(baseUrl: string, email: string, password: string): Promise<string> {
  const r = await fetch(`${baseUrl}/api/session`, { method: "POST", headers: { "content-type": "application/json", origin: baseUrl }, body: JSON.stringify({ email, password }) });
  if (r.status !== 200) throw new Error(`Sign-in as ${email} answered ${r.status}: ${await r.text()}`);
  return r.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
}
