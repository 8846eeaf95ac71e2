import { ATTACHMENT_METHODS, ADHESIVES } from "@shared/schemas/mount-plan.ts";
import { OBJECT_TYPES, OBJECT_TYPE_LABELS, PHOTO_PROCESSES, PHOTO_PROCESS_LABELS, SENSITIVITIES, SENSITIVITY_LABELS } from "@shared/schemas/objects.ts";
import { ADHESIVE_LABELS, ATTACHMENT_METHOD_LABELS } from "@shared/schemas/mountings.ts";
import { SelectField, TextField } from "@/components/ui/field.tsx";
import { Group, type SectionProps } from "./planner-parts.tsx";

/** The object and the materials, which the conservation checks read. */
export function MaterialsSection({ register, values }: SectionProps) {
  return (
    <Group title="Object and materials (for the checks)" open={false}>
      <div className="grid grid-cols-2 gap-3">
        <SelectField label="Object type" {...register("object.objectType")}>
          <option value="">Not given</option>
          {OBJECT_TYPES.map((t) => (
            <option key={t} value={t}>
              {OBJECT_TYPE_LABELS[t]}
            </option>
          ))}
        </SelectField>
        <SelectField label="Photographic process" disabled={values.object.objectType !== "photograph"} {...register("object.photoProcess")}>
          <option value="">—</option>
          {PHOTO_PROCESSES.map((p) => (
            <option key={p} value={p}>
              {PHOTO_PROCESS_LABELS[p]}
            </option>
          ))}
        </SelectField>
      </div>
      <fieldset>
        <legend className="mb-1 text-sm font-medium text-ink-soft">Sensitivities</legend>
        <div className="flex flex-wrap gap-3">
          {SENSITIVITIES.map((s) => (
            <label key={s} className="inline-flex items-center gap-1.5 text-sm">
              <input type="checkbox" value={s} className="h-4 w-4" {...register("object.sensitivities")} />
              {SENSITIVITY_LABELS[s]}
            </label>
          ))}
        </div>
      </fieldset>
      <div className="grid grid-cols-2 gap-3">
        <SelectField label="Board grade" {...register("materials.boardGrade")}>
          <option value="">Not chosen</option>
          <option value="museum">Museum (cotton)</option>
          <option value="conservation">Conservation (purified pulp)</option>
          <option value="other">Other</option>
        </SelectField>
        <SelectField label="Buffered" {...register("materials.buffered")}>
          <option value="">Not given</option>
          <option value="yes">Buffered</option>
          <option value="no">Unbuffered</option>
        </SelectField>
        <SelectField label="Passed the PAT" {...register("materials.pat")}>
          <option value="">Not given</option>
          <option value="yes">Yes</option>
          <option value="no">No</option>
        </SelectField>
        <SelectField label="Attachment" {...register("materials.attachment")}>
          <option value="">Not chosen</option>
          {ATTACHMENT_METHODS.map((m) => (
            <option key={m} value={m}>
              {ATTACHMENT_METHOD_LABELS[m]}
            </option>
          ))}
        </SelectField>
        <SelectField label="Adhesive" {...register("materials.adhesive")}>
          <option value="">Not chosen</option>
          {ADHESIVES.map((a) => (
            <option key={a} value={a}>
              {ADHESIVE_LABELS[a]}
            </option>
          ))}
        </SelectField>
        <TextField label="Number of hinges" inputMode="numeric" {...register("materials.hingeCount")} />
      </div>
    </Group>
  );
}
