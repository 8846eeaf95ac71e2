import fs from "node:fs";
import type { TestProject } from "vitest/node";
import { startServer, type RunningServer } from "../../../scripts/lib/spawn-server.ts";

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
  }
}

let server: RunningServer | undefined;

/** Starts the production server (built client + API) on a free port with a new database and the demo seed. */
export async function setup(project: TestProject) {
  if (!fs.existsSync("dist/client/index.html")) throw new Error("Build the client first (npm run build); test:e2e does it.");
  server = await startServer({ NODE_ENV: "production", SEED_DEMO: "true", LOG_LEVEL: "warn", LOGIN_RATE_LIMIT: "100" });
  project.provide("baseUrl", server.baseUrl);
}

export async function teardown() {
  await server?.stop();
  if (server) fs.rmSync(server.dir, { recursive: true, force: true });
}
