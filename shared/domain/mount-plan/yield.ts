/**
 * Board yield and cutting list (docs/trade.md §11): how many blanks a full board sheet gives, and how a
 * batch of blanks packs onto the fewest sheets, with guillotine (edge-to-edge) cuts and blade kerf.
 *
 * The two algorithms live in yield/: blanksPerSheet (blanks-per-sheet.ts) and cuttingList
 * (cutting-list.ts, with its exact search in exact-pack.ts); what they share, including the kerf
 * trick both work in, is in yield/common.ts.
 */
export { STANDARD_BOARD_SHEETS, type CutPiece, type CuttingList, type CuttingSheet, type Placement, type Size } from "./yield/common.ts";
export { blanksPerSheet, MAX_PLACEMENTS } from "./yield/blanks-per-sheet.ts";
export { cuttingList } from "./yield/cutting-list.ts";
export { EXACT_MAX_BLANKS, exactPack } from "./yield/exact-pack.ts";
