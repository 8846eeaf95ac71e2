/**
 * Reversa's paper-and-ink palette, for code that draws without Tailwind (the PDF documents) and for
 * drawings both the screen and the PDF make. tailwind.config.ts takes its colours from here, so the
 * screen's classes (bg-paper, text-ink…) and the documents use the same tokens.
 */
export const PALETTE = {
  paper: { DEFAULT: "#f7f4ee", deep: "#efe9df", sheet: "#fbf8f2" },
  ink: { DEFAULT: "#1d1c1a", soft: "#3a3835" },
  graphite: { DEFAULT: "#5c5a56", light: "#8a877f" },
  stone: { DEFAULT: "#dcd5c8", light: "#e9e3d8" },
  accent: { DEFAULT: "#1f5c57", hover: "#174844", soft: "#e3efed" },
  pass: { DEFAULT: "#2e6a3c", soft: "#e4f0e4" },
  warn: { DEFAULT: "#7f5300", soft: "#f7ecd6" },
  fail: { DEFAULT: "#9a2b2b", soft: "#f6e1df" },
} as const;

/**
 * The tones of the materials in the plan drawing, between the palette's paper and stone: they fill
 * and edge the drawn board, sheet and hinges and are not interface colours, so they are not tokens.
 */
export const MATERIAL_TONES = {
  /** The backing board. */
  backing: "#e4ddd0",
  /** The sheet (the object), a touch whiter than the paper it lies on. */
  sheet: "#fffdf8",
  /** The edge of the image on the sheet. */
  imageEdge: "#a9a397",
  /** The hatching over the image on screen. */
  hatchLine: "#d8d0c1",
  /** The image's flat fill where no hatching can be drawn (the PDF): the hatch's tone at a glance. */
  imageFlat: "#f3eee4",
  /** The window board, and the top board of a double mount. */
  board: "#f1ece2",
  topBoard: "#e9e2d4",
  /** The bevel of the window's cut edge. */
  bevel: "#bdb4a3",
  /** Hinge tape. */
  hinge: "#e8d9a8",
} as const;
