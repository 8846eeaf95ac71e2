import { MM_PER_INCH } from "../units.ts";

export type SizePreset = { id: string; label: string; width: number; height: number; group: string };

/** ISO 216 A sizes, portrait, in mm. */
export const SHEET_PRESETS: SizePreset[] = [
  { id: "A5", label: "A5 · 148 × 210 mm", width: 148, height: 210, group: "ISO A sizes" },
  { id: "A4", label: "A4 · 210 × 297 mm", width: 210, height: 297, group: "ISO A sizes" },
  { id: "A3", label: "A3 · 297 × 420 mm", width: 297, height: 420, group: "ISO A sizes" },
  { id: "A2", label: "A2 · 420 × 594 mm", width: 420, height: 594, group: "ISO A sizes" },
  { id: "A1", label: "A1 · 594 × 841 mm", width: 594, height: 841, group: "ISO A sizes" },
];

const inch = (w: number, h: number, group: string): SizePreset => ({
  id: `${w}x${h}in`,
  label: `${w} × ${h} in`,
  width: w * MM_PER_INCH,
  height: h * MM_PER_INCH,
  group,
});

/** Ready-made frame sizes: CCI Notes 11/5 lists 8×10, 10×12, 14×18, 16×22, 22×28, 28×36 in; 11×14 and 16×20 in are common practice (no source). */
export const FRAME_PRESETS: SizePreset[] = [
  inch(8, 10, "Frame sizes (in)"),
  inch(10, 12, "Frame sizes (in)"),
  inch(11, 14, "Frame sizes (in)"),
  inch(14, 18, "Frame sizes (in)"),
  inch(16, 20, "Frame sizes (in)"),
  inch(16, 22, "Frame sizes (in)"),
  inch(22, 28, "Frame sizes (in)"),
  inch(28, 36, "Frame sizes (in)"),
  ...SHEET_PRESETS.map((p) => ({ ...p, group: "ISO A sizes" })),
];
