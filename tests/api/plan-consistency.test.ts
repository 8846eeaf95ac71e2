import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { spawnSync } from "node:child_process";
import { beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, makeObject, makeStudio, type Agent } from "../setup/test-app.ts";
import { recordPlanInput } from "../../shared/domain/mounting.ts";
import type { MountingDataInput, MountingRecord } from "../../shared/schemas/mountings.ts";
import { MountingDataSchema } from "../../shared/schemas/mountings.ts";
import type { MountPlan } from "../../shared/schemas/mount-plan.ts";
import { binary } from "../setup/http.ts";

// One record, four surfaces: the record page's API, the dossier (read back with pdftotext), the
// registrar's mountings export and POST /api/mount-plans/calculate with the same input and
// catalogue must give the same checks.
// Sources of the rules: docs/trade.md §5–§7. A4 = 210 × 297 mm (ISO 216).
const t = createTestApp();
let framer: Agent;
let admin: Agent;
let clientId: string;
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), "reversa-consistency-"));

function pdfText(pdf: Buffer): string {
  const file = path.join(tmp, `${randomUUID()}.pdf`);
  fs.writeFileSync(file, pdf);
  const r = spawnSync("/usr/bin/pdftotext", [file, "-"], { encoding: "utf8" });
  expect(r.status, r.stderr).toBe(0);
  return r.stdout.replace(/\s+/g, " ");
}

const BASE: MountingDataInput = {
  plan: { unit: "mm", sheet: { width: 210, height: 297 }, window: { all: { mode: "overlap", overlap: 6 } }, borders: { all: 60 } },
  boards: { window: { grade: "museum", buffered: true, ply: 4, patPassed: true }, backing: { grade: "museum", buffered: false, ply: 4 } },
  attachment: {
    method: "t-hinge",
    tissue: "Kozo",
    adhesive: "wheat-starch-paste",
    hinges: [
      { edge: "top", offsetMm: 40, widthMm: 20 },
      { edge: "top", offsetMm: 150, widthMm: 20 },
    ],
  },
  glazing: { type: "float-glass", thicknessMm: 2 },
  undoNotes: "Release the hinges with a damp blotter.",
};

const CASES: [string, Parameters<typeof makeObject>[2], MountingDataInput][] = [
  ["a cyanotype photograph", { objectType: "photograph", photoProcess: "cyanotype" }, BASE],
  [
    "a float on V-hinges",
    { objectType: "print" },
    { ...BASE, plan: { ...BASE.plan, window: { all: { mode: "float", reveal: 12 } } }, attachment: { ...BASE.attachment, method: "v-hinge" } },
  ],
  [
    "a double mount of a pastel",
    { objectType: "pastel" },
    { ...BASE, plan: { ...BASE.plan, doubleMount: { reveal: 4 } }, boards: { ...BASE.boards, top: { grade: "museum", buffered: true, ply: 4 } } },
  ],
];

beforeAll(async () => {
  const studio = await makeStudio(t);
  framer = await agentFor(t, studio.people.framer);
  admin = await agentFor(t, studio.people.admin);
  clientId = studio.institution.id;
});

async function surfaces(objectOver: Parameters<typeof makeObject>[2], data: MountingDataInput) {
  const objectId = makeObject(t.db, clientId, objectOver);
  const draft = await framer.post(`/api/objects/${objectId}/mountings`).send({ reason: "first-mounting", mountedOn: "2026-03-02", data });
  expect(draft.status, JSON.stringify(draft.body)).toBe(201);
  const done = await framer.post(`/api/mountings/${draft.body.id}/complete`).send({ version: draft.body.version });
  expect(done.status, JSON.stringify(done.body)).toBe(200);
  const record = (await framer.get(`/api/mountings/${draft.body.id}`)).body as MountingRecord;
  const input = recordPlanInput(MountingDataSchema.parse(data), record.current.catalogue);
  const calc = (await framer.post("/api/mount-plans/calculate").send(input)).body as MountPlan;
  const dossier = await framer
    .post(`/api/objects/${objectId}/documents/dossier`)
    .buffer(true)
    .parse(binary as never);
  expect(dossier.status).toBe(200);
  const exported = (await framer.get(`/api/clients/${clientId}/exports/mountings.json`)).body as Record<string, string | number | null>[];
  const row = exported.find((r) => r["Mounting record id"] === draft.body.id)!;
  expect(row).toBeDefined();
  return { record: record.current.plan, calc, text: pdfText(dossier.body as Buffer), row };
}

function expectSame(s: Awaited<ReturnType<typeof surfaces>>) {
  expect(s.calc.checks.map((c) => [c.id, c.verdict])).toEqual(s.record.checks.map((c) => [c.id, c.verdict]));
  expect(s.calc.level).toBe(s.record.level);
  for (const c of s.record.checks) {
    // Each reason as the record page shows it is printed in the dossier (its first words; the PDF wraps lines).
    const start = c.reason.split(" ").slice(0, 6).join(" ");
    expect(s.text, c.id).toContain(start);
  }
  // The export: the same verdicts counted, each one not passed named with its reason.
  const count = (v: string) => s.record.checks.filter((c) => c.verdict === v).length;
  const words = (
    [
      ["pass", "pass"],
      ["warn", "caution"],
      ["fail", "fail"],
    ] as const
  )
    .filter(([v]) => count(v) > 0)
    .map(([v, w]) => `${count(v)} ${w}`);
  expect(s.row["Conservation checks"]).toBe(words.join(", "));
  for (const c of s.record.checks.filter((c) => c.verdict !== "pass")) expect(s.row["Checks not passed"], c.id).toContain(`${c.rule} (`);
  // Its figures are in mm on every studio, and the parts add up: border + window + border = outer.
  const n = (k: string) => s.row[k] as number;
  expect(Math.round((n("Border left (mm)") + n("Window width (mm)") + n("Border right (mm)")) * 10) / 10).toBe(n("Outer width (mm)"));
  expect(Math.round((n("Border top (mm)") + n("Window height (mm)") + n("Border bottom (mm)")) * 10) / 10).toBe(n("Outer height (mm)"));
}

describe("the same checks on the record page, in the dossier, in the export and from calculate", () => {
  it.each(CASES)("when the object is %s, then the four agree", async (_name, obj, data) => {
    const s = await surfaces(obj, data);
    expectSame(s);
    if (obj?.objectType === "photograph") expect(s.record.checks.find((c) => c.id === "photo-board")!.verdict).toBe("fail");
    if (obj?.objectType === "pastel") expect(s.record.checks.find((c) => c.id === "friable-glazing")!.reason).not.toContain("does not apply");
    // Plain float glass on a work on paper: very sensitive by default, so the UV check fails everywhere.
    expect(s.record.checks.find((c) => c.id === "uv-glazing")!.verdict).toBe("fail");
  });

  it("when the studio works in inches and the record was made in mm, then the verdicts are unchanged and every figure shown is in inches", async () => {
    const mm = await surfaces({ objectType: "photograph", photoProcess: "gelatin-silver" }, BASE);
    const before = (await admin.get("/api/settings")).body;
    try {
      expect((await admin.put("/api/settings").send({ ...before, unit: "in" })).status).toBe(200);
      const inch = await surfaces({ objectType: "photograph", photoProcess: "gelatin-silver" }, BASE);
      expectSame(inch);
      expect(inch.record.checks.map((c) => c.verdict)).toEqual(mm.record.checks.map((c) => c.verdict));
      // As built: the same window in mm whatever the display (200 − 2 × 6 = 198, 297 − 12 = 285).
      expect(inch.record.aperture).toEqual({ width: 198, height: 285 });
      expect(inch.record.displayUnit).toBe("in");
      for (const v of Object.values(inch.record.display)) expect(v).toMatch(/ in$/);
      expect(inch.text).toContain(inch.record.display.aperture);
      // The registrar's export stays in mm, as its headers say: the as-built window, 198 × 285 mm.
      expect([inch.row["Window width (mm)"], inch.row["Window height (mm)"]]).toEqual([198, 285]);
      expect([inch.row["Outer width (mm)"], inch.row["Outer height (mm)"]]).toEqual([318, 405]);
    } finally {
      await admin.put("/api/settings").send(before);
    }
  });
});
