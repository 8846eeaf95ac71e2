// `npm start`: builds the client when dist/ is missing or older than the sources, then runs the server in production mode.
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";

function newest(dir: string): number {
  let t = 0;
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, entry.name);
    t = Math.max(t, entry.isDirectory() ? newest(p) : fs.statSync(p).mtimeMs);
  }
  return t;
}

const built = "dist/client/index.html";
const stale = !fs.existsSync(built) || Math.max(newest("src"), newest("shared"), fs.statSync("index.html").mtimeMs) > fs.statSync(built).mtimeMs;
if (stale) {
  console.log("Building the client…");
  const r = spawnSync("npx", ["vite", "build", "--logLevel", "warn"], { stdio: "inherit" });
  if (r.status !== 0) process.exit(r.status ?? 1);
}
process.env.NODE_ENV = "production";
await import("../server/index.ts");
