import { sql } from "drizzle-orm";
import type { Db } from "./client.ts";
import { conditionReports } from "./schema.ts";
import type { SessionUser } from "../../shared/schemas/auth.ts";
import { ConditionCreateSchema, type ConditionDataInput } from "../../shared/schemas/condition.ts";
import { findObjectIdByNumber } from "../features/objects/objects.repo.ts";
import { createConditionService } from "../features/condition/condition.service.ts";

type Demo = { number: string; context: string; reportDate: string; otherParty?: { name: string; role: string }; data: Omit<ConditionDataInput, "signatures"> };

type DemoFinding = NonNullable<Demo["data"]["findings"]>[number];
/** 2026-0001's findings on arrival; its periodic check carries them over (same ids, as the app does) and says what changed. */
const FOXING_0001: DemoFinding = {
  id: "f-0001-foxing",
  term: "foxing",
  location: { kind: "zone", zone: "bottom-centre" },
  extent: "Scattered spots under 2 mm in the lower margin",
  severity: "slight",
  notes: null,
};
const TEAR_0001: DemoFinding = {
  id: "f-0001-tear",
  term: "tear",
  location: { kind: "zone", zone: "edge-right" },
  extent: "12 mm, from the edge towards the image",
  severity: "moderate",
  notes: "Clean edges; not into the image.",
};

/**
 * Invented demo reports, oldest first per object. 2026-0001's two reports compare as: foxing unchanged,
 * tear worsened, abrasion new. 2026-0009 has mould, so its report shows the mould caution; 2026-0018 went
 * out on loan with a report signed by both parties.
 */
const DEMO: Demo[] = [
  {
    number: "2026-0001",
    context: "arrival",
    reportDate: "2026-03-02",
    data: {
      overallRating: "fair",
      summary: "Stable on the whole. Light foxing in the lower margin and a short tear at the right edge, outside the image. The old mount is acidic and its bevel has yellowed.",
      findings: [FOXING_0001, TEAR_0001],
      recommendations: {
        display: "Display at 50 lux or less, away from daylight.",
        handling: "Support the sheet on a board when moving it; do not lift by the torn edge.",
        environment: null,
        referral: "A conservator could mend the tear with Japanese tissue before it is mounted.",
      },
      lightNotes: "Watercolour: very sensitive to light.",
    },
  },
  {
    number: "2026-0001",
    context: "periodic-check",
    reportDate: "2026-11-19",
    data: {
      overallRating: "poor",
      summary:
        "Back in the studio after the frame was knocked in transit. The tear at the right edge has run further; the foxing is as before; a small abrasion at the top left corner where the frame was struck.",
      findings: [
        { ...FOXING_0001, notes: "No change since March." },
        { ...TEAR_0001, extent: "20 mm, now reaching the image edge", severity: "severe", notes: "Lengthened by about 8 mm since March." },
        {
          id: "f-0001-abrasion",
          term: "abrasion",
          location: { kind: "zone", zone: "top-left" },
          extent: "About 10 × 6 mm at the corner",
          severity: "slight",
          notes: "Surface fibres raised; no pigment lost.",
        },
      ],
      recommendations: {
        display: "Not to be displayed until the tear is mended.",
        handling: "Keep flat in a folder; move it on a board.",
        environment: null,
        referral: "Refer the tear to a paper conservator before remounting.",
      },
    },
  },
  {
    number: "2026-0009",
    context: "arrival",
    reportDate: "2026-10-02",
    data: {
      overallRating: "poor",
      summary: "Fragile. Small tears where the old folds cross; a patch of mould on the verso at the lower left, apparently dry; light surface dirt overall.",
      findings: [
        { id: "f-0009-tear", term: "tear", location: { kind: "zone", zone: "middle-left" }, extent: "Two tears of 5–8 mm at fold crossings", severity: "moderate", notes: null },
        {
          id: "f-0009-mould",
          term: "mould",
          location: { kind: "zone", zone: "verso" },
          extent: "About 30 × 20 mm, lower left of the verso",
          severity: "moderate",
          notes: "Looks dry and powdery; whether it is inactive is for a conservator to say.",
        },
        { id: "f-0009-crease", term: "crease", location: { kind: "zone", zone: "centre" }, extent: "Old horizontal fold across the sheet", severity: "slight", notes: null },
      ],
      recommendations: {
        display: null,
        handling: "Nitrile gloves and a respirator (N95 at least) to handle it; keep it in its sealed box, away from other works.",
        environment: "Keep below 50 % relative humidity while it waits.",
        referral: "Refer to a paper conservator for the mould and the tears before any mounting.",
      },
    },
  },
  {
    number: "2026-0018",
    context: "loan-out",
    reportDate: "2026-08-26",
    otherParty: { name: "Owen Taverner", role: "Registrar, Harbour Lights touring exhibition (invented)" },
    data: {
      overallRating: "good",
      summary: "Good. Colour even, sheet flat, frame and glazing sound. One faint scuff at the lower right, seen only in raking light.",
      findings: [
        {
          id: "f-0018-scuff",
          term: "emulsion abrasion",
          location: { kind: "zone", zone: "bottom-right" },
          extent: "Faint, about 4 mm",
          severity: "slight",
          notes: "Present on arrival in June.",
        },
      ],
      recommendations: {
        display: "Colour photograph: 50 lux or less, for no more than 12 weeks at a time.",
        handling: "Gloves; carry the frame upright by its sides.",
        environment: "35–50 % relative humidity.",
        referral: null,
      },
      lightNotes: "Chromogenic print: very sensitive to light.",
    },
  },
];

/**
 * Writes the demo condition reports through the same service as the app (drafted, then signed), so
 * each lands in its object's history and moves its check date. Call after the demo objects, mountings
 * and custody (the check interval depends on whether the object is on loan). Returns how many were written.
 */
export function seedCondition(db: Db, actor: SessionUser): number {
  const existing = db.select({ n: sql<number>`count(*)` }).from(conditionReports).get()?.n ?? 0;
  if (existing > 0) return 0;
  const service = createConditionService(db);
  let written = 0;
  for (const d of DEMO) {
    const objectId = findObjectIdByNumber(db, d.number);
    if (!objectId) continue;
    const signatures = {
      examiner: { name: actor.name, date: d.reportDate, role: actor.role === "admin" ? "Studio admin" : "Framer" },
      ...(d.otherParty ? { otherParty: { name: d.otherParty.name, date: d.reportDate, role: d.otherParty.role } } : {}),
    };
    const body = ConditionCreateSchema.parse({ context: d.context, reportDate: d.reportDate, data: { ...d.data, signatures } });
    const draft = service.create(actor, objectId, body);
    service.sign(actor, draft.id, draft.version);
    written++;
  }
  return written;
}
