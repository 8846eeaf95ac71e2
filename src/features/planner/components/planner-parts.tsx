import type { ReactNode } from "react";
import type { Path, UseFormRegister } from "react-hook-form";
import type { SideName } from "@shared/schemas/mount-plan.ts";
import { SelectField } from "@/components/ui/field.tsx";
import type { PlannerValues } from "../lib/planner-values.ts";
import type { PlannerSettings } from "./planner.tsx";

/** A length field by its form path, its label and an optional hint, with its message from the live plan. */
export type LengthInput = (name: string, label: string, hint?: string) => ReactNode;
export type PresetKind = "sheet" | "fit" | "board";

/** What every section of the planner's form is given. */
export type SectionProps = {
  register: UseFormRegister<PlannerValues>;
  values: PlannerValues;
  settings: PlannerSettings;
  errors: Record<string, string>;
  /** A length field. */
  L: LengthInput;
  /** The form's unit as written in labels. */
  u: string;
  applyPreset: (which: PresetKind, id: string) => void;
};

export const SIDE_LABEL: Record<SideName, string> = { left: "Left", top: "Top", right: "Right", bottom: "Bottom" };

/** A section of the planner's form that folds away. */
export function Group({ title, children, open = true }: { title: string; children: ReactNode; open?: boolean }) {
  return (
    <details open={open} className="group rounded-card bg-paper-sheet shadow-card">
      <summary className="cursor-pointer select-none list-none px-4 py-3 font-semibold marker:hidden">
        <span aria-hidden="true" className="mr-2 inline-block text-graphite transition group-open:rotate-90">
          ›
        </span>
        {title}
      </summary>
      <div className="space-y-3 border-t border-stone-light px-4 py-4">{children}</div>
    </details>
  );
}

/** How the window meets the sheet on one side (or every side). */
export function SideEditor({
  name,
  label,
  mode,
  register,
  L,
  u,
}: {
  name: "all" | SideName;
  label: string;
  mode: string;
  register: UseFormRegister<PlannerValues>;
  L: LengthInput;
  u: string;
}) {
  return (
    <fieldset className="rounded-card border border-stone-light p-3">
      <legend className="px-1 text-sm font-semibold">{label}</legend>
      <div className="grid grid-cols-2 gap-3">
        <SelectField label="How" {...register(`${name}.mode` as Path<PlannerValues>)}>
          <option value="overlap">Overlap the edge</option>
          <option value="hide-border">Hide the border</option>
          <option value="float">Float (reveal)</option>
        </SelectField>
        {mode === "overlap" && L(`${name}.overlap`, `Overlap (${u})`)}
        {mode === "float" && L(`${name}.reveal`, `Reveal (${u})`)}
        {mode === "hide-border" && (
          <>
            {L(`${name}.border`, `Border of the sheet (${u})`)}
            {L(`${name}.into`, `Cover into the image (${u})`)}
          </>
        )}
      </div>
    </fieldset>
  );
}
