/**
 * The mount's value lists that both the mounting contract and the object register use (the register filters
 * by the current mount's method, window-board grade and glazing). They live here, importing nothing, so that
 * objects.ts and mount-plan.ts / mountings.ts can all read them without an import cycle.
 */
export const BOARD_GRADES = ["museum", "conservation", "other"] as const;
export const ATTACHMENT_METHODS = [
  "t-hinge",
  "v-hinge",
  "pendant-hinge",
  "pass-through-hinge",
  "corners",
  "edge-strips",
  "sink-mount",
  "polyester-straps",
  "pressure-sensitive-tape",
] as const;
export const GLAZING_TYPES = ["float-glass", "uv-glass", "ar-uv-glass", "acrylic", "uv-acrylic", "none"] as const;
