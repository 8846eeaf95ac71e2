import { describe, expect, it } from "vitest";
import { compareFindings, lightGuidance, nextCheckDue, ratingFloor } from "../../../shared/domain/condition.ts";
import { ConditionDataSchema, type ConditionData, type Finding } from "../../../shared/schemas/condition.ts";
import { first } from "../../setup/lists.ts";

const finding = (over: Partial<Finding> & Pick<Finding, "id" | "term">): Finding => ({
  location: { kind: "zone", zone: "centre" },
  extent: null,
  severity: "slight",
  resolved: false,
  notes: null,
  ...over,
});
const report = (findings: Finding[]): ConditionData => ConditionDataSchema.parse({ overallRating: ratingFloor(findings), summary: "Examined under raking light.", findings });
const statuses = (r: ReturnType<typeof compareFindings>) => r.map((c) => [c.status, (c.after ?? c.before)!.id]);

describe("ratingFloor", () => {
  // Spectrum 5.0 "Condition": the overall rating is the worst finding's.
  it("when there are no findings, then the best rating allowed is good", () => {
    expect(ratingFloor([])).toBe("good");
  });

  it("when the findings are slight, then good is still allowed", () => {
    expect(ratingFloor([{ severity: "slight" }, { severity: "slight" }])).toBe("good");
  });

  it("when each severity is the worst, then the rating follows it: moderate fair, severe poor, critical unstable", () => {
    expect(ratingFloor([{ severity: "slight" }, { severity: "moderate" }])).toBe("fair");
    expect(ratingFloor([{ severity: "severe" }, { severity: "moderate" }])).toBe("poor");
    expect(ratingFloor([{ severity: "slight" }, { severity: "critical" }, { severity: "severe" }])).toBe("unstable");
  });

  it("when the findings come in another order, then the floor is the same", () => {
    const fs = [{ severity: "moderate" as const }, { severity: "severe" as const }, { severity: "slight" as const }];
    expect(ratingFloor([...fs].reverse())).toBe(ratingFloor(fs));
  });
});

describe("the rating rule in the contract", () => {
  it("when the overall rating is better than the worst finding's, then the data is refused at overallRating", () => {
    const r = ConditionDataSchema.safeParse({ overallRating: "good", summary: "Torn.", findings: [finding({ id: "a", term: "tear", severity: "severe" })] });
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.path.join("."))).toEqual(["overallRating"]);
    expect(first(r.error?.issues ?? []).message).toContain("poor");
  });

  it("when the overall rating is worse than the findings require, then it is accepted (the examiner may judge it worse)", () => {
    expect(ConditionDataSchema.safeParse({ overallRating: "poor", summary: "Brittle.", findings: [finding({ id: "a", term: "brittleness" })] }).success).toBe(true);
  });
});

describe("compareFindings", () => {
  const foxing = finding({ id: "f1", term: "foxing", location: { kind: "zone", zone: "bottom-centre" } });
  const tear = finding({ id: "f2", term: "tear", location: { kind: "zone", zone: "edge-right" }, severity: "moderate" });

  it("when a finding appears only in the later report, then it is new", () => {
    const abrasion = finding({ id: "f3", term: "abrasion", location: { kind: "zone", zone: "top-left" } });
    expect(statuses(compareFindings(report([foxing]), report([foxing, abrasion])))).toEqual([
      ["unchanged", "f1"],
      ["new", "f3"],
    ]);
  });

  it("when a finding's severity rose, then it is worsened, with both versions given", () => {
    const later = { ...tear, severity: "severe" as const };
    const [c] = compareFindings(report([tear]), report([later]));
    expect(c).toEqual({ status: "worsened", before: tear, after: later });
  });

  it("when a finding's severity fell or it was marked resolved, then it is improved", () => {
    expect(first(compareFindings(report([tear]), report([{ ...tear, severity: "slight" }]))).status).toBe("improved");
    expect(first(compareFindings(report([tear]), report([{ ...tear, resolved: true }]))).status).toBe("improved");
  });

  it("when a finding of the earlier report is not in the later one, then it is no longer seen", () => {
    expect(statuses(compareFindings(report([foxing, tear]), report([foxing])))).toEqual([
      ["unchanged", "f1"],
      ["no-longer-seen", "f2"],
    ]);
  });

  it("when a finding is written again by hand with a new id, then it matches on term and place", () => {
    const again = { ...tear, id: "typed-again", term: "Tear", severity: "severe" as const };
    expect(compareFindings(report([tear]), report([again]))).toEqual([{ status: "worsened", before: tear, after: again }]);
  });

  it("when the same term is found in another place, then it is a new finding, and the old one no longer seen", () => {
    const elsewhere = { ...tear, id: "f9", location: { kind: "zone" as const, zone: "edge-left" as const } };
    expect(statuses(compareFindings(report([tear]), report([elsewhere])))).toEqual([
      ["new", "f9"],
      ["no-longer-seen", "f2"],
    ]);
  });

  it("when both reports have no findings, then there is nothing to compare", () => {
    expect(compareFindings(report([]), report([]))).toEqual([]);
  });
});

describe("nextCheckDue", () => {
  const intervals = { checkIntervalMonths: 24, checkIntervalOnLoanMonths: 12 };

  it("when the object is in the studio, then the check falls due the studio interval later", () => {
    expect(nextCheckDue("2026-03-02", "in-studio", intervals)).toBe("2028-03-02");
    expect(nextCheckDue("2026-03-02", "with-owner", intervals)).toBe("2028-03-02");
  });

  it("when the object is on loan, then the shorter loan interval applies", () => {
    expect(nextCheckDue("2026-08-26", "on-loan", intervals)).toBe("2027-08-26");
  });

  it("when the day does not exist in the target month, then it falls on that month's last day (31 Jan + 1 month = 28 Feb)", () => {
    const monthly = { checkIntervalMonths: 1, checkIntervalOnLoanMonths: 1 };
    expect(nextCheckDue("2026-01-31", "in-studio", monthly)).toBe("2026-02-28");
    expect(nextCheckDue("2028-01-31", "in-studio", monthly)).toBe("2028-02-29");
    expect(nextCheckDue("2026-03-31", "in-studio", monthly)).toBe("2026-04-30");
    expect(nextCheckDue("2024-02-29", "in-studio", { checkIntervalMonths: 12, checkIntervalOnLoanMonths: 12 })).toBe("2025-02-28");
  });

  it("when the interval crosses a year end, then the year rolls over", () => {
    expect(nextCheckDue("2026-11-30", "in-studio", { checkIntervalMonths: 3, checkIntervalOnLoanMonths: 3 })).toBe("2027-02-28");
    expect(nextCheckDue("2026-12-15", "on-loan", { checkIntervalMonths: 24, checkIntervalOnLoanMonths: 1 })).toBe("2027-01-15");
  });
});

describe("lightGuidance", () => {
  // Values: NISO Z39.79 via NEDCC Preservation 101 (≤ 50 lux very sensitive, ≤ 100 lux moderate,
  // 12 weeks at a time and 52 weeks in all, UV ≤ 75 µW/lm, RH 35–50 % ± 5 %).
  it("when the object is light-sensitive, then it says 50 lux, 12 weeks at a time and 52 weeks in all", () => {
    const g = lightGuidance(["light-sensitive"], "print");
    expect(g).toContain("50 lux");
    expect(g).toContain("12 weeks");
    expect(g).toContain("52 weeks");
    expect(g).not.toContain("100 lux");
  });

  it("when the object is a watercolour, pastel or colour photograph, then it is treated as very sensitive (50 lux)", () => {
    expect(lightGuidance([], "watercolour")).toContain("50 lux");
    expect(lightGuidance([], "pastel")).toContain("50 lux");
    expect(lightGuidance([], "photograph", "chromogenic")).toContain("50 lux");
  });

  it("when a work on paper is not flagged, then it is treated as very sensitive (50 lux), the cautious default", () => {
    // docs/trade.md §7: an unflagged work on paper is treated as very sensitive; NISO Z39.79 via NEDCC: ≤ 50 lux.
    for (const g of [lightGuidance([], "print"), lightGuidance([], "drawing"), lightGuidance([], "document"), lightGuidance([], "photograph", "gelatin-silver")]) {
      expect(g).toContain("50 lux");
      expect(g).not.toContain("100 lux");
    }
  });

  it("when any guidance is given, then it names the UV and humidity limits and says it is not a guarantee", () => {
    for (const g of [lightGuidance(["light-sensitive"]), lightGuidance([])]) {
      expect(g).toContain("75 µW/lm");
      expect(g).toContain("35–50 %");
      expect(g).toMatch(/not a guarantee/);
    }
  });

  it("when the yearly exposure is given, then it follows the responsivity category (CIE 157:2004 as quoted; from memory, verify)", () => {
    // High responsivity (fugitive colour, watercolours, colour photographs, flagged light-sensitive): about 15,000 lux·h a year.
    expect(lightGuidance(["light-sensitive"])).toContain("15,000 lux·hours");
    expect(lightGuidance([], "watercolour")).toContain("15,000 lux·hours");
    expect(lightGuidance([], "photograph", "chromogenic")).toContain("15,000 lux·hours");
    expect(lightGuidance([], "photograph", "albumen")).toContain("15,000 lux·hours");
    // Medium (most other works on paper, black-and-white silver prints): about 150,000 lux·h a year.
    expect(lightGuidance([], "print")).toContain("150,000 lux·hours");
    expect(lightGuidance([], "photograph", "gelatin-silver")).toContain("150,000 lux·hours");
  });
});
