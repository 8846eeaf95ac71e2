import fs from "node:fs";
import { describe, expect, it } from "vitest";
import { DATASETS, MANIFEST_COLUMNS } from "../../../server/features/exports/exports.service.ts";
import { EXPORT_COLUMNS } from "../../../server/features/exports/exports.columns.ts";
import { at } from "../../setup/lists.ts";

// The contributor rule: every export column is described for the people who receive it (docs/exports.md).
describe("docs/exports.md", () => {
  const doc = fs.readFileSync("docs/exports.md", "utf8");
  for (const dataset of DATASETS) {
    it(`describes every column of the ${dataset} dataset, under its own heading`, () => {
      const start = doc.indexOf(`### ${dataset} `);
      expect(start, `a "### ${dataset} —" section`).toBeGreaterThan(0);
      const end = doc.indexOf("\n### ", start + 4);
      const section = doc.slice(start, end < 0 ? undefined : end);
      // A table row names the column, alone or in a list with others ("Border top / bottom / left / right (mm)" covers four).
      const named = section
        .split("\n")
        .filter((l) => l.startsWith("| "))
        .map((l) => at(l.split("|"), 1).trim());
      for (const { key } of EXPORT_COLUMNS[dataset]) {
        const covered = named.some((n) => n.split(", ").includes(key) || expandSlashes(n).includes(key));
        expect(covered, `${dataset}: "${key}"`).toBe(true);
      }
    });
  }
  it("names the manifest's columns' contents", () => {
    for (const c of MANIFEST_COLUMNS) expect(doc.toLowerCase()).toContain(c === "Bytes" ? "size in\n  bytes" : c.toLowerCase());
  });
});

/** "Border top / bottom (mm)" → ["Border top (mm)", "Border bottom (mm)"]; "Dimension: image border left / top (mm)" likewise. */
function expandSlashes(name: string): string[] {
  const m = /^(.*?)(\w+(?: \/ \w+)+)(.*)$/.exec(name);
  if (!m) return [];
  return at(m, 2)
    .split(" / ")
    .map((w) => `${m[1]}${w}${m[3]}`);
}
