import { STANDARD_BOARD_SHEETS } from "@shared/domain/mount-plan/index.ts";
import { SelectField, TextField } from "@/components/ui/field.tsx";
import { Group, type SectionProps } from "./planner-parts.tsx";
import { RecordOptions } from "@/components/ui/options.tsx";

/** Glazing, spacer and the frame's {rebate}, lip and moulding. */
export function FrameSection({ register, settings, L, u }: SectionProps) {
  return (
    <Group title={`Glazing and frame`} open={false}>
      <div className="grid grid-cols-2 gap-3">
        <SelectField label="Glazing" {...register("glazing.material")}>
          <option value="">Not chosen</option>
          <option value="glass">Glass</option>
          <option value="acrylic">Acrylic</option>
        </SelectField>
        {L("glazing.thickness", `Thickness (${u})`)}
      </div>
      <label className="flex items-center gap-2 text-sm">
        <input type="checkbox" className="h-4 w-4" {...register("glazing.uv")} /> UV-filtering
      </label>
      <div className="grid grid-cols-2 gap-3">
        {L("spacer", `Spacer depth (${u})`)}
        {L("frame.rebateDepth", `${settings.words.Rebate} depth (${u})`)}
        {L("frame.lip", `${settings.words.Rebate} lip (${u})`, "Default 6 mm")}
        {L("frame.faceWidth", `Moulding face (${u})`, "Default 20 mm")}
      </div>
      <TextField label="Waste allowance (%)" inputMode="decimal" hint="Default 10 %" {...register("frame.waste")} />
    </Group>
  );
}

/** A full board sheet, to say how many blanks it yields. */
export function BoardSection({ register, values, L, u, applyPreset }: SectionProps) {
  return (
    <Group title="Board sheet and yield" open={false}>
      <SelectField label="Full sheet" {...register("board.preset", { onChange: (e) => applyPreset("board", e.target.value) })}>
        <option value="">Not needed</option>
        <RecordOptions items={STANDARD_BOARD_SHEETS} text={(b) => b.label} />
        <option value="custom">Other size</option>
      </SelectField>
      {values.board.preset && (
        <div className="grid grid-cols-3 gap-2">
          {L("board.width", `Width (${u})`)}
          {L("board.height", `Height (${u})`)}
          {L("board.kerf", `Kerf (${u})`)}
        </div>
      )}
    </Group>
  );
}
