import { SIDES } from "@shared/schemas/mount-plan.ts";
import { formatLength } from "@shared/domain/units.ts";
import { SelectField } from "@/components/ui/field.tsx";
import { Group, SideEditor, SIDE_LABEL, type SectionProps } from "./planner-parts.tsx";

/** The window: the same on every side, side by side, or a custom size and position. */
export function WindowSection({ register, values, settings, L, u }: SectionProps) {
  return (
    <Group title="Window">
      <SelectField label="Decide the window" {...register("windowMode")}>
        <option value="all">The same on every side</option>
        <option value="sides">Side by side</option>
        <option value="custom">Custom window (size and position)</option>
      </SelectField>
      {values.windowMode === "custom" ? (
        <div className="grid grid-cols-2 gap-3">
          {L("custom.width", `Window width (${u})`)}
          {L("custom.height", `Window height (${u})`)}
          {L("custom.left", `From the sheet's left edge (${u})`)}
          {L("custom.top", `From the sheet's top edge (${u})`)}
        </div>
      ) : (
        (values.windowMode === "all" ? (["all"] as const) : SIDES).map((s) => (
          <SideEditor key={s} name={s} label={s === "all" ? "Every side" : SIDE_LABEL[s]} mode={values[s].mode} register={register} L={L} u={u} />
        ))
      )}
      {L(
        "minOverlap",
        `Minimum overlap (${u})`,
        `Leave empty for the studio minimum (${formatLength(settings.minOverlapMm, values.unit, { rounding: "up", denominator: 32 })}); a side below it fails the check.`,
      )}
    </Group>
  );
}
