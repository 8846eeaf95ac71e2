import type { MountPlan, SideName } from "../../../schemas/mount-plan.ts";
import type { Unit } from "../../units.ts";
import type { Figures } from "../figures.ts";

/**
 * The studio's settings the plan needs. `displayUnit` is the unit every figure and message is
 * shown in (the studio's, or the one the user chose); the plan is computed in its own unit either
 * way, so a record's as-built sizes never change with the display.
 */
export type PlanContext = { minOverlapMm: number; rebateClearanceMm: number; displayUnit?: Unit };
export type Box = { width: number; height: number };
export type Sides = Record<SideName, number>;
export type SideMode = "overlap" | "hide-border" | "float" | "custom";

/** The plan in millimetres: what the drawing and the checks work from. */
export type PlanGeometry = {
  unit: Unit;
  stepMm: number;
  minOverlapMm: number;
  sheet: Box;
  imageBorders: Sides | null;
  modes: Record<SideName, SideMode>;
  aperture: Box;
  overlap: Sides;
  windowOnSheet: { left: number; top: number };
  borders: Sides;
  outer: Box;
  topWindow: Box | null;
  doubleReveal: number | null;
  glazing: Box & { weightKg?: number; material?: "glass" | "acrylic"; thickness?: number; uvFiltering?: boolean };
  rebate: Box;
  rebateLip: number;
  sight: Box;
  moulding: { length: number; faceWidth: number; wastePercent: number };
  package: { thickness: number; rebateDepth?: number; weightKg?: number };
  yield?: { perSheet: number; sheet: Box; kerf: number; utilisation: number };
  spacerDepth: number;
  /** The figures as shown: one unit, rounded once, adding up (figures.ts). */
  figures: Figures;
};

export type PlanResult = { ok: true; plan: MountPlan; geometry: PlanGeometry } | { ok: false; fields: Record<string, string> };
