import { SIDES } from "@shared/schemas/mount-plan.ts";
import { SHEET_PRESETS } from "@shared/domain/mount-plan/index.ts";
import { SelectField } from "@/components/ui/field.tsx";
import { Group, SIDE_LABEL, type SectionProps } from "./planner-parts.tsx";
import { RecordOptions } from "@/components/ui/options.tsx";

/** The sheet: a standard size or its own, and the border around the image. */
export function SheetSection({ register, values, L, u, applyPreset }: SectionProps) {
  return (
    <Group title="Sheet">
      <SelectField label="Preset" value="" onChange={(e) => applyPreset("sheet", e.target.value)}>
        <option value="">Choose a standard size…</option>
        <RecordOptions items={SHEET_PRESETS} text={(p) => p.label} />
      </SelectField>
      <div className="grid grid-cols-2 gap-3">
        {L("sheetW", `Sheet width (${u})`)}
        {L("sheetH", `Sheet height (${u})`)}
      </div>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" className="h-4 w-4" {...register("hasImageBorders")} /> The sheet has a border around the image
      </label>
      {values.hasImageBorders && (
        <div className="grid grid-cols-4 gap-2">
          {SIDES.map((s) => (
            <div key={s}>{L(`ib.${s}`, `${SIDE_LABEL[s]}`)}</div>
          ))}
        </div>
      )}
    </Group>
  );
}
