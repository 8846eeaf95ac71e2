import type { ReactNode } from "react";
import type { PlanResult } from "@shared/domain/mount-plan/compute.ts";
import type { planDrawing } from "@shared/domain/mount-plan/index.ts";
import { SIDES } from "@shared/schemas/mount-plan.ts";
import { formatLength, type Unit } from "@shared/domain/units.ts";
import { Button } from "@/components/ui/button.tsx";
import { Notice } from "@/components/ui/feedback.tsx";
import { PlanDrawing } from "@/components/plan-drawing.tsx";
import { ChecksList, FindingsList, LevelBadge } from "@/components/checks-list.tsx";
import { SIDE_LABEL } from "./planner-parts.tsx";
import type { PlannerSettings } from "./planner.tsx";

type Props = {
  result: PlanResult;
  errors: Record<string, string>;
  model: ReturnType<typeof planDrawing> | null;
  unit: Unit;
  settings: PlannerSettings;
  /** Present when the plan can be saved. */
  onSave?: () => void;
  saving: boolean;
  saveError: string | null;
  saveState?: ReactNode;
};

/** The plan as computed: its level, the drawing to scale, the numbers, the findings and the conservation checks. */
export function PlanResultView({ result, errors, model, unit, settings, onSave, saving, saveError, saveState }: Props) {
  const plan = result.ok ? result.plan : null;
  return (
    <section aria-label="Result" className="space-y-4 xl:sticky xl:top-6 xl:self-start print:space-y-2 print:text-[11px]">
      {!plan ? (
        <Notice tone="warn" title="Not computed yet">
          <ul className="list-disc pl-5">
            {Object.values(errors)
              .slice(0, 5)
              .map((m) => (
                <li key={m}>{m}</li>
              ))}
          </ul>
        </Notice>
      ) : (
        <>
          <div className="flex flex-wrap items-center justify-between gap-3">
            <LevelBadge level={plan.level} />
            <div className="flex gap-2 print:hidden">
              {onSave && (
                <Button onClick={onSave} disabled={saving}>
                  {saving ? "Saving…" : "Save draft"}
                </Button>
              )}
              <Button variant="secondary" onClick={() => window.print()}>
                Print
              </Button>
            </div>
          </div>
          {saveError && (
            <Notice tone="fail" title="Not saved">
              {saveError}
            </Notice>
          )}
          {saveState}
          <div className="rounded-card bg-paper-sheet p-4 shadow-card print:p-0 print:shadow-none">
            {model && <PlanDrawing model={model} title={`${settings.words.Mount} drawn to scale: window ${plan.display.aperture}, outer ${plan.display.outer}`} />}
          </div>
          <div className="grid gap-4 md:grid-cols-2">
            <dl className="rounded-card bg-paper-sheet p-4 text-sm shadow-card print:p-2 print:text-[11px] print:shadow-none" data-testid="plan-numbers">
              {(
                [
                  ["Window (aperture)", plan.display.aperture],
                  ...SIDES.map((s) => [
                    `${SIDE_LABEL[s]} ${plan.overlap[s] < 0 ? "reveal" : "overlap"}`,
                    plan.overlap[s] < 0 ? (plan.display[`overlap.${s}`] ?? "").replace("−", "") : plan.display[`overlap.${s}`],
                  ]),
                  ["Borders L · T · R · B", SIDES.map((s) => plan.display[`borders.${s}`]).join(" · ")],
                  ...(plan.display.topWindow ? [["Top board window", plan.display.topWindow]] : []),
                  [`Outer = glazing = backing`, plan.display.outer],
                  [`${settings.words.Rebate} size`, plan.display.rebate],
                  ["Sight size", plan.display.sight],
                  ["Moulding to order", plan.display.moulding],
                  ["Package thickness", formatLength(unit === "in" ? plan.package.thickness * 25.4 : plan.package.thickness, unit, { rounding: "up", denominator: 32 })],
                  ...(plan.package.weightKg !== undefined ? [["Glazing and boards", `about ${plan.package.weightKg.toFixed(1)} kg`]] : []),
                  ...(plan.yield ? [["Blanks per full sheet", `${plan.yield.perSheet} (${Math.round(plan.yield.utilisation * 100)} % used)`]] : []),
                ] as [string, string][]
              ).map(([k, v]) => (
                <div key={k} className="flex justify-between gap-3 border-b border-stone-light py-1.5 last:border-0 print:py-0.5">
                  <dt className="text-graphite">{k}</dt>
                  <dd className="text-right font-medium num" data-testid={`num-${k}`}>
                    {v}
                  </dd>
                </div>
              ))}
            </dl>
            <div className="space-y-2 rounded-card bg-paper-sheet p-4 text-sm shadow-card print:p-2 print:text-[11px] print:shadow-none">
              <h3 className="font-semibold">Findings</h3>
              <FindingsList findings={plan.findings} />
            </div>
          </div>
          <div className="rounded-card bg-paper-sheet p-4 text-sm shadow-card print:p-2 print:text-[10px] print:shadow-none">
            <h3 className="mb-2 font-semibold">Conservation checks</h3>
            <ChecksList checks={plan.checks} />
          </div>
        </>
      )}
    </section>
  );
}
