import type { SideName } from "../../../schemas/mount-plan.ts";
import { parseLength, type Unit } from "../../units.ts";
import type { Formatters } from "../checks.ts";
import { figureLength, shownLength } from "../figures.ts";

export const SIDE_WORD: Record<SideName, string> = { left: "Left edge", top: "Top edge", right: "Right edge", bottom: "Bottom edge" };
export const AXIS_OF: Record<SideName, "width" | "height"> = { left: "width", right: "width", top: "height", bottom: "height" };
export const OPPOSITE: Record<SideName, SideName> = { left: "right", right: "left", top: "bottom", bottom: "top" };

export type BorderKind = "fitOuter" | "default" | "all" | "side" | "each";

/** The field a side's border comes from, for messages about it. */
export function borderPath(kind: BorderKind, s: SideName): string {
  if (kind === "fitOuter") return AXIS_OF[s] === "width" ? "fitOuter.width" : "fitOuter.height";
  if (kind === "default") return "borders";
  if (kind === "all") return "borders.all";
  if (kind === "side" && AXIS_OF[s] === "width") return "borders.side";
  return `borders.${s}`;
}

/**
 * Reads one plan's lengths into mm, collecting field errors, and shows lengths in the display unit.
 * A class rather than closures inside computePlan and its steps: the planner is a hot path, and the server's
 * TypeScript loader names every local function it creates on each call.
 */
export class PlanText implements Formatters {
  readonly fields: Record<string, string> = {};
  /** The studio minimum overlap as shown; set once the figures are known. */
  minText = "";
  constructor(
    readonly unit: Unit,
    readonly du: Unit,
  ) {}

  failed(): boolean {
    for (const _ in this.fields) return true;
    return false;
  }

  /** Reads a length into mm; records a field error and returns NaN when it is not one. */
  len(v: string | number | undefined, path: string, opts: { min?: number; positive?: boolean; label: string }): number {
    if (v === undefined) return NaN;
    const r = parseLength(v, this.unit);
    if (!r.ok) {
      this.fields[path] = `${opts.label}: ${r.message}`;
      return NaN;
    }
    if (opts.positive && !(r.mm > 0)) this.fields[path] = `${opts.label} must be greater than 0.`;
    else if (opts.min !== undefined && r.mm < opts.min) this.fields[path] = `${opts.label} cannot be negative.`;
    return r.mm;
  }

  /** Any length in the display unit, on the shown grid: for lengths that are not part of a sum. */
  length(mm: number, rounding: "nearest" | "down" | "up" = "nearest"): string {
    return figureLength(shownLength(mm, this.du, rounding), this.du);
  }

  /** A figure already on the shown grid, with its unit. */
  shown(mm: number): string {
    return figureLength(mm, this.du);
  }

  minimum(): string {
    return this.minText;
  }
}
