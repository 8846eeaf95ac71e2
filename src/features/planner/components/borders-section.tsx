import { SIDES } from "@shared/schemas/mount-plan.ts";
import { FRAME_PRESETS } from "@shared/domain/mount-plan/index.ts";
import { SelectField, TextField } from "@/components/ui/field.tsx";
import { Group, SIDE_LABEL, type SectionProps } from "./planner-parts.tsx";
import { RecordOptions } from "@/components/ui/options.tsx";

/** The borders: all round, top-sides-bottom, each side, or fitted to a frame; weighting and a double mount. */
export function BordersSection({ register, values, settings, errors, L, u, applyPreset }: SectionProps) {
  return (
    <Group title="Borders">
      <SelectField label="Borders" {...register("bordersMode")}>
        <option value="all">The same all round</option>
        <option value="tsb">Top, sides and bottom</option>
        <option value="sides">Each side</option>
        <option value="fit">Fit to an outer size (a ready-made frame)</option>
      </SelectField>
      {values.bordersMode === "all" && L("b.all", `Border (${u})`)}
      {values.bordersMode === "tsb" && (
        <div className="grid grid-cols-3 gap-2">
          {L("b.top", "Top")}
          {L("b.side", "Sides")}
          {L("b.bottom", "Bottom")}
        </div>
      )}
      {values.bordersMode === "sides" && (
        <div className="grid grid-cols-4 gap-2">
          {SIDES.map((s) => (
            <div key={s}>{L(`b.${s}`, SIDE_LABEL[s])}</div>
          ))}
        </div>
      )}
      {values.bordersMode === "fit" && (
        <>
          <SelectField label="Frame size" value="" onChange={(e) => applyPreset("fit", e.target.value)}>
            <option value="">Choose a standard size…</option>
            {settings.framePresets.length > 0 && (
              <optgroup label="The studio's sizes">
                {settings.framePresets.map((p, i) => (
                  // biome-ignore lint/suspicious/noArrayIndexKey: the option's value is its position in the studio's list
                  <option key={i} value={`studio-${i}`}>
                    {p.label}
                  </option>
                ))}
              </optgroup>
            )}
            {[...new Set(FRAME_PRESETS.map((p) => p.group))].map((g) => (
              <optgroup key={g} label={g}>
                <RecordOptions items={FRAME_PRESETS.filter((p) => p.group === g)} text={(p) => p.label} />
              </optgroup>
            ))}
          </SelectField>
          <div className="grid grid-cols-2 gap-3">
            {L("fit.width", `Outer width (${u})`)}
            {L("fit.height", `Outer height (${u})`)}
          </div>
        </>
      )}
      <SelectField label="Bottom weighting" {...register("weightMode")}>
        <option value="none">None</option>
        <option value="amount">Add an amount to the bottom</option>
        <option value="percent">Bottom larger by a percentage</option>
      </SelectField>
      {values.weightMode === "amount" && L("weight", `Extra at the bottom (${u})`, "Often 10–20 mm.")}
      {values.weightMode === "percent" && (
        <TextField label="Bottom larger by (%)" inputMode="decimal" error={errors.bottomWeightPercent} hint="Often 10–15 %." {...register("weightPct")} />
      )}
      {L("minBorder", `Warn below a border of (${u})`)}
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" className="h-4 w-4" {...register("double")} /> Double {settings.words.mount} (a top board with a reveal)
      </label>
      {values.double && L("doubleReveal", `Reveal of the inner board (${u})`, "Commonly 3–6 mm a side.")}
    </Group>
  );
}
