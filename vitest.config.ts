import { defineConfig } from "vitest/config";
import os from "node:os";
import { fileURLToPath } from "node:url";

// Unit and API tests. The e2e suite has its own config (vitest.e2e.config.ts).
// Forks, not threads: better-sqlite3 is a native module and each API file holds its own open database.
// Two cores are the floor we test on; password hashing (scrypt) is CPU-bound, so the timeouts leave room.
const cores = os.availableParallelism();

export default defineConfig({
  resolve: {
    alias: {
      "@shared": fileURLToPath(new URL("./shared", import.meta.url)),
      "@": fileURLToPath(new URL("./src", import.meta.url)),
    },
  },
  test: {
    include: ["tests/unit/**/*.test.ts", "tests/api/**/*.test.ts"],
    environment: "node",
    globalSetup: ["tests/setup/global-setup.ts"],
    setupFiles: ["tests/setup/fail-on-console-error.ts"],
    pool: "forks",
    maxWorkers: Math.max(1, Math.min(4, cores)),
    testTimeout: 600_000,
    hookTimeout: 300_000,
    teardownTimeout: 10_000,
    restoreMocks: true,
    unstubEnvs: true,
  },
});
