// The servers the bench measures: the app in this process (for the sequential API timings) and the server in
// a process of its own (for loads whose generator must not share the server's event loop), both on the bench
// database; sign-in cookies and the `measure` helper.
import type { AddressInfo } from "node:net";
import path from "node:path";
import { createApp } from "../../server/app.ts";
import type { DbHandle } from "../../server/db/client.ts";
import { loadConfig } from "../../server/lib/config.ts";
import { BENCH_HISTORY_KEY, BENCH_HISTORY_KEY_TEXT } from "./fixtures.ts";
import { nth } from "./nth.ts";
import { freePort, startServer } from "../lib/spawn-server.ts";

/** The auth secret both servers sign sessions with. */
const BENCH_AUTH_SECRET = "bench-secret-bench-secret-bench-secret-0000";

/** The app in this process on the bench database, listening on loopback. */
export async function startInProcessApp(file: string, database: DbHandle) {
  // The port is known before the app is made, so its trusted origins (the CSRF guard's) include it.
  const inProcessPort = await freePort();
  const config = {
    ...loadConfig({ LOG_LEVEL: "silent", LOGIN_RATE_LIMIT: "1000", DATABASE_URL: file, NODE_ENV: "test", PORT: String(inProcessPort) }),
    authSecret: BENCH_AUTH_SECRET,
    historyKey: BENCH_HISTORY_KEY,
    checkpointsFile: null,
  };
  const { app } = createApp({ config, database });
  const server = app.listen(inProcessPort, "127.0.0.1");
  await new Promise((r) => server.once("listening", r));
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  return { base, close: () => server.close() };
}

/** Signs in at `base` with the bench password and answers the session cookie. */
export async function cookieFor(base: string, email: string) {
  const r = await fetch(`${base}/api/session`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: base },
    body: JSON.stringify({ email, password: "bench-password" }),
  });
  if (!r.ok) throw new Error(`sign-in failed: ${r.status}`);
  return r.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
}

/** GETs `url` from `base` runs + 10 times (the first 10 warm up) and prints the p50 and p95 of the rest. */
export async function measure(base: string, runs: number, label: string, url: string, cookie: string) {
  const times: number[] = [];
  for (let i = 0; i < runs + 10; i++) {
    const t = performance.now();
    const r = await fetch(base + url, { headers: { cookie } });
    await r.arrayBuffer();
    if (!r.ok) throw new Error(`${url} answered ${r.status}`);
    if (i >= 10) times.push(performance.now() - t);
  }
  times.sort((a, b) => a - b);
  const p = (q: number) => nth(times, Math.min(times.length - 1, Math.floor(q * times.length))).toFixed(1);
  console.log(`${label.padEnd(44)} p50 ${p(0.5).padStart(6)} ms   p95 ${p(0.95).padStart(6)} ms`);
}

/** The server in its own process on the bench database (scripts/lib/spawn-server.ts), signed in as the framer. */
export async function spawnBenchServer(file: string) {
  const server = await startServer(
    { DATABASE_URL: file, SEED_DEMO: "false", LOG_LEVEL: "silent", BETTER_AUTH_SECRET: BENCH_AUTH_SECRET, HISTORY_KEY: BENCH_HISTORY_KEY_TEXT },
    path.dirname(file),
  );
  const cookie = await cookieFor(server.baseUrl, "framer@bench.test");
  return { base: server.baseUrl, cookie, stop: () => server.stop() };
}
