import { defineConfig } from "vitest/config";

// End-to-end journeys in Debian's Chromium through playwright-core, against the built app
// served by the real server on a fresh SQLite file with the demo studio.
export default defineConfig({
  test: {
    include: ["tests/e2e/**/*.e2e.ts"],
    environment: "node",
    globalSetup: ["tests/e2e/support/server.ts"],
    fileParallelism: false,
    testTimeout: 600_000,
    hookTimeout: 300_000,
  },
});
