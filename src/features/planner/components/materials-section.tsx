import { ATTACHMENT_METHODS, ADHESIVES } from "@shared/schemas/mount-plan.ts";
import { OBJECT_TYPES, OBJECT_TYPE_LABELS, PHOTO_PROCESSES, PHOTO_PROCESS_LABELS, SENSITIVITIES, SENSITIVITY_LABELS } from "@shared/schemas/objects.ts";
import { ADHESIVE_LABELS, ATTACHMENT_METHOD_LABELS } from "@shared/schemas/mountings.ts";
import { SelectField, TextField } from "@/components/ui/field.tsx";
import { Group, type SectionProps } from "./planner-parts.tsx";
import { CheckboxGroup } from "@/components/ui/checkbox-group.tsx";
import { EnumOptions } from "@/components/ui/options.tsx";

/** The object and the materials, which the conservation checks read. */
export function MaterialsSection({ register, values }: SectionProps) {
  return (
    <Group title="Object and materials (for the checks)" open={false}>
      <div className="grid grid-cols-2 gap-3">
        <SelectField label="Object type" {...register("object.objectType")}>
          <EnumOptions values={OBJECT_TYPES} labels={OBJECT_TYPE_LABELS} blank="Not given" />
        </SelectField>
        <SelectField label="Photographic process" disabled={values.object.objectType !== "photograph"} {...register("object.photoProcess")}>
          <EnumOptions values={PHOTO_PROCESSES} labels={PHOTO_PROCESS_LABELS} blank="—" />
        </SelectField>
      </div>
      <CheckboxGroup legend="Sensitivities" look="compact" values={SENSITIVITIES} labels={SENSITIVITY_LABELS} field={register("object.sensitivities")} />
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
          <EnumOptions values={ATTACHMENT_METHODS} labels={ATTACHMENT_METHOD_LABELS} blank="Not chosen" />
        </SelectField>
        <SelectField label="Adhesive" {...register("materials.adhesive")}>
          <EnumOptions values={ADHESIVES} labels={ADHESIVE_LABELS} blank="Not chosen" />
        </SelectField>
        <TextField label="Number of hinges" inputMode="numeric" {...register("materials.hingeCount")} />
      </div>
    </Group>
  );
}
