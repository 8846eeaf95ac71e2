import type { Finding, MountPlanParsed } from "../../../schemas/mount-plan.ts";
import { SIDES } from "../../../schemas/mount-plan.ts";
import { figureSize, shownLength } from "../figures.ts";
import { AXIS_OF, borderPath, OPPOSITE, SIDE_WORD, type BorderKind, type PlanText } from "./text.ts";
import type { PlanWindow } from "./window.ts";
import type { PlanGeometry, Sides } from "./types.ts";

/**
 * A window that covers more than this share of the image's width or height on one side hides a
 * large part of the picture: Reversa's own threshold (no source), to make the framer look again.
 */
export const LARGE_IMAGE_SHARE = 0.1;

/** Findings that mean the mount cannot be built as planned: a record of work done may not hold them. */
export const UNBUILDABLE = new Set(["sheet-past-outer", "window-off-sheet", "window-larger-than-sheet", "image-borders-exceed-sheet", "lip-covers-window", "board-too-small"]);

/** What the findings are worked out from, besides the geometry: how the window and the borders were asked for. */
export type FindingsInput = {
  g: PlanGeometry;
  input: MountPlanParsed;
  win: PlanWindow;
  borderKind: BorderKind;
  minB: number | undefined;
  clearance: number;
  t: PlanText;
};

/** Step 6: the plan's findings on its geometry, in order: what cannot be built, then each side's. */
export function geometryFindings(p: FindingsInput, findings: Finding[]): void {
  const { imageBorders } = p.g;
  const du = p.t.du;
  const shownImage: Sides | null = imageBorders
    ? { left: shownLength(imageBorders.left, du), top: shownLength(imageBorders.top, du), right: shownLength(imageBorders.right, du), bottom: shownLength(imageBorders.bottom, du) }
    : null;
  unbuildableFindings(p, shownImage, findings);
  sideFindings(p, shownImage, findings);
}

/** Geometry that cannot be built: errors that name the side and the field. */
function unbuildableFindings({ g, input, win, borderKind, clearance, t }: FindingsInput, shownImage: Sides | null, findings: Finding[]): void {
  const { sheet, imageBorders, overlap, borders, topWindow, doubleReveal } = g;
  const { custom, askedPath } = win;
  const fig = g.figures;
  const du = t.du;
  const lip = g.rebateLip;
  const fr = input.frame ?? {};
  const yieldResult = g.yield;
  if (imageBorders) {
    for (const [a, b, dim] of [
      ["left", "right", "width"],
      ["top", "bottom", "height"],
    ] as const) {
      if (imageBorders[a] + imageBorders[b] >= sheet[dim] - 1e-9) {
        findings.push({
          code: "image-borders-exceed-sheet",
          severity: "error",
          side: b,
          field: `imageBorders.${b}`,
          message: `The sheet's ${a} and ${b} borders (${t.shown(shownImage![a])} + ${t.shown(shownImage![b])}) add up to the sheet's whole ${dim} (${t.shown(fig.sheet[dim])}) or more, leaving no image: correct the borders on the object record.`,
        });
      }
    }
  }
  for (const s of SIDES) {
    // The sheet must lie inside the boards: an overlap wider than the border puts its edge past the outer edge.
    if (overlap[s] > borders[s] + 1e-9) {
      findings.push({
        code: "sheet-past-outer",
        severity: "error",
        side: s,
        field: borderPath(borderKind, s),
        message: `${SIDE_WORD[s]}: the sheet reaches ${t.length(overlap[s] - borders[s], "up")} past the outer edge of the boards (it runs ${t.shown(fig.overlap[s])} under a ${t.shown(fig.borders[s])} border), so it would stand proud of the boards and glazing. Widen the border or choose a larger outer size.`,
      });
    }
  }
  if (custom) {
    const offLeft = custom.left + custom.width <= 0 || custom.left >= sheet.width;
    const offTop = custom.top + custom.height <= 0 || custom.top >= sheet.height;
    if (offLeft || offTop) {
      findings.push({
        code: "window-off-sheet",
        severity: "error",
        field: offLeft ? "window.left" : "window.top",
        message: "The window lies wholly off the sheet: its position puts it clear of the sheet's edge. Place it over the sheet.",
      });
    } else {
      for (const s of SIDES) {
        if (overlap[s] < -1e-9) {
          findings.push({
            code: "window-off-sheet",
            severity: "error",
            side: s,
            field: askedPath[s],
            message: `${SIDE_WORD[s]}: the window runs ${t.length(-overlap[s], "up")} past the edge of the sheet, off the sheet. A custom window must lie within the sheet; to show the whole sheet, float it instead.`,
          });
        }
      }
    }
    for (const dim of ["width", "height"] as const) {
      if (custom[dim] > sheet[dim] + 1e-9) {
        findings.push({
          code: "window-larger-than-sheet",
          severity: "error",
          field: `window.${dim}`,
          message: `The window's ${dim} (${t.length(custom[dim])}) is larger than the sheet's (${t.shown(fig.sheet[dim])}): it cannot hold the sheet on that axis.`,
        });
      }
    }
  }
  // The frame's lip must not reach the window of any board: the top board's border is narrower by the reveal.
  const hidden = lip - clearance / 2;
  for (const s of SIDES) {
    const visible = topWindow ? borders[s] - (doubleReveal as number) : borders[s];
    if (visible <= hidden + 1e-9) {
      const shownVisible = topWindow ? fig.borders[s] - shownLength(doubleReveal as number, du) : fig.borders[s];
      findings.push({
        code: "lip-covers-window",
        severity: "error",
        side: s,
        field: fr.rebateLip !== undefined ? "frame.rebateLip" : borderPath(borderKind, s),
        message: topWindow
          ? `${SIDE_WORD[s]}: the frame's ${t.length(lip)} rebate lip would cover the top board's ${t.shown(shownVisible)} border and reach into its window.`
          : `${SIDE_WORD[s]}: the frame's ${t.length(lip)} rebate lip would cover the ${t.shown(fig.borders[s])} border and reach into the window.`,
      });
    }
  }
  if (yieldResult && yieldResult.perSheet === 0) {
    findings.push({
      code: "board-too-small",
      severity: "error",
      field: "boardSheet",
      message: `A ${figureSize(fig.outer, du)} board does not fit on a ${t.length(yieldResult.sheet.width)} × ${t.length(yieldResult.sheet.height)} sheet.`,
    });
  }
}

/** Findings on each side: borders below the minimum, a shallow rebate, overlaps, floats, and what the window hides or shows. */
function sideFindings({ g, win, borderKind, minB, t }: FindingsInput, shownImage: Sides | null, findings: Finding[]): void {
  const { sheet, imageBorders, overlap, borders, modes, minOverlapMm } = g;
  const { into, hideBorder, askedPath } = win;
  const fig = g.figures;
  const { rebateDepth, thickness } = g.package;
  if (minB !== undefined) {
    for (const s of SIDES) {
      if (borders[s] < minB - 1e-9)
        findings.push({
          code: "border-below-minimum",
          severity: "warn",
          side: s,
          field: borderPath(borderKind, s),
          message: `${SIDE_WORD[s]}: the border comes out at ${t.shown(fig.borders[s])}, below the ${t.length(minB)} you asked for.`,
        });
    }
  }
  if (rebateDepth !== undefined && rebateDepth + 1e-9 < thickness) {
    findings.push({
      code: "rebate-too-shallow",
      severity: "warn",
      field: "frame.rebateDepth",
      message: `The rebate is ${t.length(rebateDepth)} deep but the package (glazing, spacer, boards and backing) is ${t.length(thickness, "up")} thick.`,
    });
  }
  for (const s of SIDES) {
    const o = overlap[s];
    const mode = modes[s];
    const word = SIDE_WORD[s];
    if (mode !== "float" && o >= -1e-9 && o < minOverlapMm - 1e-9) {
      findings.push({
        code: "overlap-below-minimum",
        severity: "error",
        side: s,
        field: askedPath[s],
        message: `${word}: the window covers ${t.shown(Math.max(0, fig.overlap[s]))} of the sheet; the studio minimum is ${t.minimum()}.`,
      });
    }
    if (mode === "float") {
      findings.push({ code: "float", severity: "info", side: s, message: `${word}: the sheet floats, with a ${t.shown(-fig.overlap[s])} reveal between its edge and the window.` });
    }
    if (mode === "hide-border") {
      const c = into[s] as number;
      if (c < 0) {
        findings.push({
          code: "window-shows-border",
          severity: "error",
          side: s,
          field: askedPath[s],
          message: `${word}: the window edge sits ${t.length(-c, "up")} outside the image, so the border shows.`,
        });
      } else {
        // How much of the image this side's window edge hides, against the image's size on that axis.
        const dim = AXIS_OF[s];
        const o = OPPOSITE[s];
        const image = sheet[dim] - (hideBorder[s] ?? imageBorders?.[s] ?? 0) - (hideBorder[o] ?? imageBorders?.[o] ?? 0);
        if (image > 0 && c > LARGE_IMAGE_SHARE * image + 1e-9) {
          findings.push({
            code: "window-hides-image",
            severity: "warn",
            side: s,
            field: askedPath[s],
            message: `${word}: hiding the border, the window also covers ${t.length(c, "up")} of the image, ${Math.round((c / image) * 100)} % of its ${dim}. Check that this is the crop you want.`,
          });
        }
      }
    }
    if (imageBorders && shownImage && mode !== "float" && mode !== "hide-border" && o >= -1e-9) {
      const b = imageBorders[s];
      if (o < b - 1e-9) {
        findings.push({
          code: "window-shows-border",
          severity: "info",
          side: s,
          message: `${word}: ${t.shown(Math.max(0, shownImage[s] - fig.overlap[s]))} of the sheet's border shows inside the window.`,
        });
      } else if (o > b + 1e-9 && b > 0) {
        findings.push({
          code: "window-covers-image",
          severity: "warn",
          side: s,
          message: `${word}: the window covers ${t.shown(Math.max(0, fig.overlap[s] - shownImage[s]))} of the image itself, past the ${t.shown(shownImage[s])} border.`,
        });
      }
    }
  }
}
