import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import type { TestProject } from "vitest/node";
import { openDatabase } from "../../server/db/client.ts";

declare module "vitest" {
  export interface ProvidedContext {
    /** The migrated, empty template database that each API test file copies. */
    templateDb: string;
    /** A folder for this run's database copies; removed when the run ends. */
    testDbDir: string;
  }
}

/** Migrates one template database per run with the real drizzle/ migrations. */
export default function setup(project: TestProject) {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-tests-"));
  const templateDb = path.join(dir, "template.db");
  const handle = openDatabase(templateDb);
  // Fold the WAL into the main file so a plain file copy holds every table.
  handle.sqlite.pragma("wal_checkpoint(TRUNCATE)");
  handle.close();
  project.provide("templateDb", templateDb);
  project.provide("testDbDir", dir);
  return () => {
    fs.rmSync(dir, { recursive: true, force: true });
  };
}
