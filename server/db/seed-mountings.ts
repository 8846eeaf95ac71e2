import { eq } from "drizzle-orm";
import type { Db } from "./client.ts";
import { objects } from "./schema.ts";
import type { SessionUser } from "../../shared/schemas/auth.ts";
import type { MountingDataInput } from "../../shared/schemas/mountings.ts";
import { MountingCreateSchema } from "../../shared/schemas/mountings.ts";
import type { MountPlanInput } from "../../shared/schemas/mount-plan.ts";
import { createMountingsService } from "../features/mountings/mountings.service.ts";

/** Invented demo mountings, entered through the same service as the app, so their history is written too. */
const museum = (batch: string, extra: object = {}) => ({
  grade: "museum" as const,
  buffered: false,
  ply: 4 as const,
  colour: "Warm white",
  maker: "Demo board mill",
  batch,
  ...extra,
});
const topHinges = (w: number, n = 2) => Array.from({ length: n }, (_, i) => ({ edge: "top" as const, offsetMm: Math.round(((i + 0.5) * w) / n - 12), widthMm: 25 }));
/** Window and backing cut from the same batch of museum board. */
const museumBoards = (batch: string, extra: object = {}) => ({ window: museum(batch, extra), backing: museum(batch, extra) });
/** Two (or n) T-hinges of kozo tissue with wheat starch paste along the top of a sheet w mm wide. */
const kozoTHinges = (w: number, tissueWeightGsm: number) => ({
  method: "t-hinge" as const,
  tissue: "Kozo tissue",
  tissueWeightGsm,
  adhesive: "wheat-starch-paste" as const,
  hinges: topHinges(w),
});

type DemoMounting = { reason: string; mountedOn: string; plan: MountPlanInput; data: Omit<MountingDataInput, "plan"> };
type Demo = { number: string; mountings: DemoMounting[] };

/** 2026-0003's first mounting (2021); its 2026 glazing change keeps the hinges and the plan, with UV glass. */
const harbourWall2021: DemoMounting = {
  reason: "first-mounting",
  mountedOn: "2021-03-10",
  plan: {
    unit: "mm",
    sheet: { width: 330, height: 420 },
    imageBorders: { left: 52, top: 48, right: 52, bottom: 70 },
    window: { all: { mode: "overlap", overlap: 6 } },
    borders: { all: 70 },
    bottomWeight: 15,
    glazing: { material: "glass", thickness: 2, uvFiltering: false },
  },
  data: {
    boards: museumBoards("WB-2011-07"),
    attachment: kozoTHinges(330, 11),
    glazing: { type: "float-glass", thicknessMm: 2 },
    backing: { type: "archival-corrugated" },
    sealing: { type: "gummed-tape" },
    hanging: { hardware: "D-rings", wire: "Multi-strand wire" },
    undoNotes: "Two T-hinges at the top edge, wheat starch paste. Release each hinge with a damp blotter from the back; do not pull.",
  },
};
const harbourWall2026: DemoMounting = {
  reason: "glazing-change",
  mountedOn: "2026-10-02",
  plan: { ...harbourWall2021.plan, glazing: { material: "glass", thickness: 2, uvFiltering: true } },
  data: {
    ...harbourWall2021.data,
    boards: museumBoards("MB-2026-114"),
    attachment: kozoTHinges(330, 11),
    glazing: { type: "uv-glass", thicknessMm: 2 },
    sealing: { type: "barrier-film" },
    undoNotes: "The 2021 hinges were kept. Release each T-hinge with a damp blotter from the back; the new UV glass lifts out once the barrier film is slit.",
  },
};

const DEMO: Demo[] = [
  { number: "2026-0003", mountings: [harbourWall2021, harbourWall2026] },
  {
    number: "2026-0005",
    mountings: [
      {
        reason: "first-mounting",
        mountedOn: "2025-05-02",
        plan: {
          unit: "in",
          sheet: { width: 8, height: 10 },
          window: { all: { mode: "float", reveal: "1/4" } },
          fitOuter: { width: 16, height: 20 },
          bottomWeightPercent: 10,
          glazing: { material: "glass", thickness: "3/32", uvFiltering: true },
        },
        data: {
          boards: museumBoards("PB-2024-03", { patPassed: true }),
          attachment: { method: "corners", adhesive: "none", hinges: [] },
          glazing: { type: "ar-uv-glass", thicknessMm: 2.5 },
          spacer: { type: "Hidden spacer", depthMm: 6 },
          backing: { type: "fluted-polypropylene" },
          sealing: { type: "barrier-film" },
          undoNotes: "Held in four polyester corners, no adhesive on the print. Lift the corners off the backing board; the print comes free.",
        },
      },
    ],
  },
  {
    number: "2026-0014",
    mountings: [
      {
        reason: "first-mounting",
        mountedOn: "2024-09-16",
        plan: {
          unit: "mm",
          sheet: { width: 230, height: 310 },
          imageBorders: { left: 30, top: 28, right: 30, bottom: 45 },
          window: { all: { mode: "overlap", overlap: 8 } },
          borders: { top: 60, side: 60, bottom: 75 },
          glazing: { material: "glass", thickness: 2, uvFiltering: true },
        },
        data: {
          boards: museumBoards("MB-2024-88"),
          attachment: kozoTHinges(230, 9),
          glazing: { type: "uv-glass", thicknessMm: 2 },
          backing: { type: "archival-corrugated" },
          sealing: { type: "barrier-film" },
          undoNotes: "Two T-hinges at the top, wheat starch paste. Release with a damp blotter from the back.",
        },
      },
    ],
  },
  {
    number: "2026-0020",
    mountings: [
      {
        reason: "first-mounting",
        mountedOn: "2025-02-20",
        plan: {
          unit: "mm",
          sheet: { width: 432, height: 559 },
          imageBorders: { left: 38, top: 38, right: 38, bottom: 38 },
          window: { all: { mode: "float", reveal: 12 } },
          borders: { all: 80 },
          bottomWeight: 10,
          glazing: { material: "acrylic", thickness: 3, uvFiltering: true },
        },
        data: {
          boards: museumBoards("MB-2024-91"),
          attachment: { method: "v-hinge", tissue: "Gampi tissue", tissueWeightGsm: 12, adhesive: "methyl-cellulose", hinges: topHinges(432, 3) },
          glazing: { type: "uv-acrylic", thicknessMm: 3 },
          spacer: { type: "Wooden spacer, sealed", depthMm: 8 },
          backing: { type: "fluted-polypropylene" },
          sealing: { type: "barrier-film" },
          undoNotes: "Floated on three V-hinges with methyl cellulose; the hinges sit behind the top edge. Moisten each hinge from the back to release.",
        },
      },
    ],
  },
];

export function seedMountings(db: Db, framer: SessionUser) {
  const service = createMountingsService(db);
  for (const d of DEMO) {
    const o = db.select({ id: objects.id }).from(objects).where(eq(objects.objectNumber, d.number)).get();
    if (!o) continue;
    for (const m of d.mountings) {
      const body = MountingCreateSchema.parse({ reason: m.reason, mountedOn: m.mountedOn, data: { ...m.data, plan: m.plan } });
      const draft = service.create(framer, o.id, body);
      service.complete(framer, draft.id, draft.version);
    }
  }
}
