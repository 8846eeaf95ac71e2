import { lightGuidance as guidanceFor } from "./light.ts";
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

/** Light and display guidance for the object's catalogue: see shared/domain/light.ts (docs/trade.md §7). */
export function lightGuidance(sensitivities: string[], objectType?: string, photoProcess?: string | null): string {
  return guidanceFor({ sensitivities, objectType, photoProcess });
}

/** When the next condition check falls due: the studio interval after the last check (or mounting), sooner on loan. */
export function nextCheckDue(from: string, status: string, intervals: { checkIntervalMonths: number; checkIntervalOnLoanMonths: number }): string {
  const months = status === "on-loan" ? intervals.checkIntervalOnLoanMonths : intervals.checkIntervalMonths;
  const [y = NaN, m = NaN, d = NaN] = from.split("-").map(Number);
  const target = new Date(Date.UTC(y, m - 1 + months, 1));
  const last = new Date(Date.UTC(target.getUTCFullYear(), target.getUTCMonth() + 1, 0)).getUTCDate();
  target.setUTCDate(Math.min(d, last));
  return target.toISOString().slice(0, 10);
}
