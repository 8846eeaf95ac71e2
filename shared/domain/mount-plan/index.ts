export { computePlan, type PlanContext, type PlanGeometry, type PlanResult } from "./compute.ts";
export { conservationChecks, worstVerdict } from "./checks.ts";
export { blanksPerSheet, cuttingList, STANDARD_BOARD_SHEETS } from "./yield.ts";
export { planDrawing, type DrawingModel } from "./drawing.ts";
export { FRAME_PRESETS, SHEET_PRESETS } from "./presets.ts";
