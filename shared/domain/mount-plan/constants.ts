/**
 * Trade values the planner uses, each with where it comes from.
 */
/** Float glass density 2,500 kg/m³, i.e. 2.5 kg/m² per mm of thickness (EN 572-1, as quoted in glass makers' data sheets). */
export const GLASS_KG_PER_M2_PER_MM = 2.5;
/** Acrylic (PMMA) about 1,190 kg/m³ (from memory). */
export const ACRYLIC_KG_PER_M2_PER_MM = 1.19;
/** Mount board about 750 kg/m³ (from memory), for the package weight estimate only. */
export const BOARD_KG_PER_M2_PER_MM = 0.75;
/** 4-ply board ≈ 1.3–1.5 mm (Saitzyk, Art Hardware); 1.4 mm is used when no thickness is given. */
export const FOUR_PLY_MM = 1.4;
/** Minimum overlap of the window over the sheet: 5 mm a side, common practice (no source); a studio setting. */
export const DEFAULT_MIN_OVERLAP_MM = 5;
/** Total rebate clearance 1–3 mm depending on size, common practice (no source); default 2 mm, a studio setting. */
export const DEFAULT_CLEARANCE_MM = 2;
/** Borders used when none are given: 50 mm, common practice (no source). */
export const DEFAULT_BORDER_MM = 50;
/** A rebate lip of about 6 mm, a moulding face of 20 mm and 10 % waste: common practice (no source). */
export const DEFAULT_REBATE_LIP_MM = 6;
export const DEFAULT_FACE_WIDTH_MM = 20;
export const DEFAULT_WASTE_PERCENT = 10;
/** A knife or wall cutter removes next to no board, so the kerf is 0 unless given (common practice, no source). */
export const DEFAULT_KERF_MM = 0;
/** Package weight above which two people should lift it: common practice (no source). */
export const HEAVY_PACKAGE_KG = 10;
