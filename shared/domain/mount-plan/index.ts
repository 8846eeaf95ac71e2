export { computePlan, UNBUILDABLE, type PlanContext, type PlanGeometry, type PlanResult } from "./compute.ts";
export { figureLength, figureSize, figureText, lengthText, type Figures } from "./figures.ts";
export { conservationChecks, hingesWanted, isFriable, worstVerdict } from "./checks.ts";
export { blanksPerSheet, cuttingList, STANDARD_BOARD_SHEETS } from "./yield.ts";
export { planDrawing, type DrawingModel } from "./drawing.ts";
export { FRAME_PRESETS, SHEET_PRESETS } from "./presets.ts";
