import path from "node:path";
import type { DbHandle } from "../../server/db/client.ts";
import { MountPlanInputSchema } from "../../shared/schemas/mount-plan.ts";
import { nth } from "./nth.ts";

// ── Documents: a dossier with 4 photos, and a schedule of values of 1,000 objects ──
export async function benchDocuments(opts: { dir: string; database: DbHandle; objectIds: string[]; framerId: string; collectorClientId: string }) {
  const { dir, objectIds, framerId, collectorClientId } = opts;
  const { db, sqlite } = opts.database;
  const { issueDossier } = await import("../../server/features/documents/dossier.tsx");
  const { renderScheduleForBench } = await import("../../server/features/documents/schedule.tsx");
  const { createConditionService } = await import("../../server/features/condition/condition.service.ts");
  const { createMountingsService } = await import("../../server/features/mountings/mountings.service.ts");
  const framer = { id: framerId, name: "Bench framer", email: "framer@bench.test", role: "framer" as const, clientId: null };
  const objectId = nth(objectIds, 0);
  const photoIds = (sqlite.prepare("select id from photos where object_id = ? order by created_at").all(objectId) as { id: string }[]).map((r) => r.id).slice(0, 4);
  const mountings = createMountingsService(db);
  const draft = mountings.create(framer, objectId, {
    reason: "first-mounting",
    mountedOn: "2026-11-02",
    data: {
      plan: MountPlanInputSchema.parse({
        unit: "mm",
        sheet: { width: 300, height: 400 },
        window: { all: { mode: "overlap", overlap: 6 } },
        borders: { all: 60 },
        glazing: { material: "glass", thickness: 2, uvFiltering: true },
      }),
      boards: {
        window: { grade: "museum", buffered: false, ply: 4, colour: null, maker: null, batch: "B-1" },
        backing: { grade: "museum", buffered: false, ply: 4, colour: null, maker: null, batch: "B-1" },
      },
      attachment: {
        method: "t-hinge",
        tissue: "Kozo",
        tissueWeightGsm: 9,
        adhesive: "wheat-starch-paste",
        hinges: [
          { edge: "top", offsetMm: 50, widthMm: 25 },
          { edge: "top", offsetMm: 225, widthMm: 25 },
        ],
      },
      glazing: { type: "uv-glass", thicknessMm: 2 },
      undoNotes: "Release the two hinges with a damp blotter.",
      notes: null,
    },
  } as never);
  mountings.complete(framer, draft.id, draft.version);
  const conditions = createConditionService(db);
  const report = conditions.create(framer, objectId, {
    context: "after-mounting",
    reportDate: "2026-11-02",
    mountingId: null,
    data: {
      overallRating: "fair",
      summary: "Stable; foxing in the upper margin.",
      findings: photoIds.map((p, i) => ({
        id: `f${i}`,
        term: "foxing",
        location: { kind: "marker", photoId: p, x: 0.2 + i * 0.15, y: 0.3 },
        extent: null,
        severity: "moderate",
        resolved: false,
        notes: null,
      })),
      recommendations: { display: null, handling: null, environment: null, referral: null },
      lightNotes: null,
      photoIds,
      signatures: { examiner: { name: "Bench framer", date: "2026-11-02", role: null } },
    },
  } as never);
  conditions.sign(framer, report.id, report.version);
  const times: number[] = [];
  for (let i = 0; i < 4; i++) {
    const t = performance.now();
    await issueDossier(db, { uploadsDir: path.join(dir, "uploads") }, () => new Date(), framer, objectId);
    if (i > 0) times.push(performance.now() - t);
  }
  times.sort((a, b) => a - b);
  console.log(
    `\nObject dossier with ${photoIds.length} photos (24 MP originals, web versions embedded), 3 warm runs: median ${nth(times, 1).toFixed(0)} ms, worst ${nth(times, 2).toFixed(0)} ms   (target < 1500 ms ${nth(times, 2) < 1500 ? "✓" : "✕ over target"})`,
  );

  const clientObjects = (sqlite.prepare("select id from objects where client_id = ? limit 1000").all(collectorClientId) as { id: string }[]).map((r) => r.id);
  const st: number[] = [];
  for (let i = 0; i < 3; i++) {
    const t = performance.now();
    await renderScheduleForBench(db, framer, clientObjects);
    st.push(performance.now() - t);
  }
  st.sort((a, b) => a - b);
  console.log(
    `Schedule of values, ${clientObjects.length} objects, 3 runs: median ${nth(st, 1).toFixed(0)} ms, worst ${nth(st, 2).toFixed(0)} ms   (target < 5000 ms ${nth(st, 2) < 5000 ? "✓" : "✕ over target"})`,
  );
}
