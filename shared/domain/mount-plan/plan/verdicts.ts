import type { Check, Finding, MountPlanParsed, Verdict } from "../../../schemas/mount-plan.ts";
import { SIDES } from "../../../schemas/mount-plan.ts";
import * as K from "../constants.ts";
import { conservationChecks, hingeEdges, worstVerdict, type Formatters } from "../checks.ts";
import { SIDE_WORD } from "./text.ts";
import type { PlanGeometry } from "./types.ts";

/** Step 7: cautions for the people who handle the package: cutting glass, and lifting and hanging its weight. */
export function cautions(g: PlanGeometry, input: MountPlanParsed, findings: Finding[]): void {
  const gl = input.glazing;
  const packageWeight = g.package.weightKg;
  if (gl?.material === "glass") {
    findings.push({
      code: "glass-handling",
      severity: "info",
      message: "Glass cuts: wear cut-resistant gloves and eye protection when handling and cutting it, and put offcuts in a glass bin.",
    });
  }
  if (packageWeight !== undefined) {
    const heavy = packageWeight >= K.HEAVY_PACKAGE_KG;
    findings.push({
      code: "hanging",
      severity: heavy ? "warn" : "info",
      message:
        `The glazing and boards weigh about ${packageWeight.toFixed(1)} kg before the frame is added. ` +
        (heavy ? "Lift it with two people and never by the top rail. " : "") +
        "Hang it from two wall points with hardware and fixings rated well above the framed weight, D-rings rather than screw eyes, and multi-strand wire; follow the hardware maker's ratings and local building codes.",
    });
  }
}

/**
 * Step 8: the conservation checks (checks.ts) and the plan's level, the worst of the checks and the
 * findings. A hinge that fails on a floated edge also becomes a finding on that side.
 */
export function checksAndLevel(g: PlanGeometry, input: MountPlanParsed, t: Formatters, findings: Finding[]): { checks: Check[]; level: Verdict } {
  const modes = g.modes;
  const checks: Check[] = conservationChecks(g, input, t);
  // A hinge that shows or cannot hold where the sheet floats: the check says why; the finding puts it on the side.
  const hingeCheck = checks.find((c) => c.id === "hinge-placement");
  if (hingeCheck && hingeCheck.verdict === "fail" && input.materials?.attachment === "t-hinge") {
    for (const s of SIDES) {
      if (modes[s] === "float" && hingeEdges(input).includes(s)) {
        const info = findings.findIndex((f) => f.code === "float" && f.side === s);
        if (info >= 0) findings.splice(info, 1);
        findings.push({
          code: "float-needs-float-hinge",
          severity: "error",
          side: s,
          field: "materials.attachment",
          message: `${SIDE_WORD[s]}: the sheet floats here, so T-hinges on this edge would show and the window does not cover them; use V-hinges, pass-through hinges or edge strips.`,
        });
      }
    }
  }
  const fromFindings: Verdict[] = findings.map((f) => (f.severity === "error" ? "fail" : f.severity === "warn" ? "warn" : "pass"));
  const level: Verdict = worstVerdict([...checks.map((c) => c.verdict), ...fromFindings]);
  return { checks, level };
}
