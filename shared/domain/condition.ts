import type { ConditionData, Finding, FindingSeverity, Rating } from "../schemas/condition.ts";
import { RATINGS, SEVERITIES, SEVERITY_CAP } from "../schemas/condition.ts";

/** The best overall rating the findings allow (the worst finding's). */
export function ratingFloor(findings: Pick<Finding, "severity">[]): Rating {
  return findings.reduce<Rating>((w, f) => (RATINGS.indexOf(SEVERITY_CAP[f.severity]) > RATINGS.indexOf(w) ? SEVERITY_CAP[f.severity] : w), "good");
}

export type ComparisonStatus = "new" | "unchanged" | "worsened" | "improved" | "no-longer-seen";
export type ComparedFinding = { status: ComparisonStatus; before?: Finding; after?: Finding };

const rank = (s: FindingSeverity) => SEVERITIES.indexOf(s);
const key = (f: Finding) => f.id;
/** A finding carried over from an earlier report keeps its id; one written again by hand matches on term and place. */
const place = (f: Finding) => `${f.term.toLowerCase()}|${f.location.kind === "zone" ? f.location.zone : `photo:${f.location.photoId}`}`;

/** Compares two reports of one object: each finding new, unchanged, worsened, improved or no longer seen. */
export function compareFindings(earlier: ConditionData, later: ConditionData): ComparedFinding[] {
  const out: ComparedFinding[] = [];
  const matched = new Set<Finding>();
  const byId = new Map(earlier.findings.map((f) => [key(f), f]));
  const byPlace = new Map(earlier.findings.map((f) => [place(f), f]));
  for (const a of later.findings) {
    const b = byId.get(key(a)) ?? byPlace.get(place(a));
    if (!b || matched.has(b)) {
      out.push({ status: "new", after: a });
      continue;
    }
    matched.add(b);
    const d = rank(a.severity) - rank(b.severity);
    out.push({ status: a.resolved && !b.resolved ? "improved" : d > 0 ? "worsened" : d < 0 ? "improved" : "unchanged", before: b, after: a });
  }
  for (const b of earlier.findings) if (!matched.has(b)) out.push({ status: "no-longer-seen", before: b });
  return out;
}

/**
 * Light and display guidance for the object's sensitivity (NISO Z39.79, as summarised by NEDCC
 * Preservation 101; CIE 157:2004 as quoted for the annual budget — verify). Guidance, never a guarantee.
 */
export function lightGuidance(sensitivities: string[], objectType?: string, photoProcess?: string | null): string {
  const very = sensitivities.includes("light-sensitive") || objectType === "watercolour" || objectType === "pastel" || (objectType === "photograph" && photoProcess !== "gelatin-silver");
  const lines = very
    ? [
        "Very sensitive to light: display at 50 lux or less, for no more than 12 weeks at a time and 52 weeks in all, then rest it in the dark.",
        "An annual budget of about 150,000 lux·hours at 50 lux is often used for works on paper (CIE 157:2004 as quoted).",
      ]
    : ["Moderately sensitive to light: display at 100 lux or less and limit the time on display."];
  lines.push("UV from the light source at most 75 µW/lm; keep relative humidity at 35–50 % (± 5 %).");
  lines.push("This is guidance from published standards, not a guarantee; a conservator can advise on a particular object.");
  return lines.join(" ");
}

/** When the next condition check falls due: the studio interval after the last check (or mounting), sooner on loan. */
export function nextCheckDue(from: string, status: string, intervals: { checkIntervalMonths: number; checkIntervalOnLoanMonths: number }): string {
  const months = status === "on-loan" ? intervals.checkIntervalOnLoanMonths : intervals.checkIntervalMonths;
  const [y, m, d] = from.split("-").map(Number);
  const target = new Date(Date.UTC(y, m - 1 + months, 1));
  const last = new Date(Date.UTC(target.getUTCFullYear(), target.getUTCMonth() + 1, 0)).getUTCDate();
  target.setUTCDate(Math.min(d, last));
  return target.toISOString().slice(0, 10);
}
