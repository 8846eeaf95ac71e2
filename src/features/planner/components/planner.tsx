import { useMemo, useRef, useState, type ReactNode } from "react";
import { useForm, useWatch, type Path } from "react-hook-form";
import { computePlan, planDrawing, FRAME_PRESETS, SHEET_PRESETS, STANDARD_BOARD_SHEETS } from "@shared/domain/mount-plan/index.ts";
import type { PlanResult } from "@shared/domain/mount-plan/compute.ts";
import { MountPlanInputSchema, type MountPlanInput } from "@shared/schemas/mount-plan.ts";
import { issuesToFields } from "@shared/schemas/errors.ts";
import { lengthInputValue, type Unit } from "@shared/domain/units.ts";
import { TextField } from "@/components/ui/field.tsx";
import { Segmented } from "@/components/ui/segmented.tsx";
import { useServerErrors } from "@/lib/form-errors.ts";
import { convertLength, defaultValues, fieldForPath, LENGTH_FIELDS, ROUND_UP_FIELDS, toInput, type PlannerValues } from "../lib/planner-values.ts";
import type { PresetKind, SectionProps } from "./planner-parts.tsx";
import { SheetSection } from "./sheet-section.tsx";
import { WindowSection } from "./window-section.tsx";
import { BordersSection } from "./borders-section.tsx";
import { BoardSection, FrameSection } from "./frame-section.tsx";
import { MaterialsSection } from "./materials-section.tsx";
import { PlanResultView } from "./plan-result.tsx";

export type PlannerSettings = {
  unit: Unit;
  minOverlapMm: number;
  rebateClearanceMm: number;
  framePresets: { label: string; widthMm: number; heightMm: number }[];
  words: { mount: string; Mount: string; rebate: string; Rebate: string };
};

type Props = {
  settings: PlannerSettings;
  initial?: PlannerValues;
  /** Shown above the form: e.g. the object the plan is for. */
  context?: ReactNode;
  /** Present when the plan can be saved (as a draft on an object). */
  onSave?: (input: MountPlanInput) => Promise<void>;
  saveState?: ReactNode;
};

function compute(values: PlannerValues, s: PlannerSettings): { input: MountPlanInput; result: PlanResult } {
  const input = toInput(values);
  const parsed = MountPlanInputSchema.safeParse(input);
  if (!parsed.success) return { input, result: { ok: false, fields: issuesToFields(parsed.error.issues) } };
  return { input, result: computePlan(parsed.data, { minOverlapMm: s.minOverlapMm, rebateClearanceMm: s.rebateClearanceMm }) };
}

/** The mount planner: the form in sections, and the plan recomputed as the framer types. */
export function Planner({ settings, initial, context, onSave, saveState }: Props) {
  const form = useForm<PlannerValues>({ defaultValues: initial ?? defaultValues(settings.unit, settings.minOverlapMm) });
  const { register, control, setValue, getValues } = form;
  const values = useWatch({ control }) as PlannerValues;
  const unit = values.unit;
  const canonical = useRef<Record<string, { text: string; mm: number }>>({});
  const [saving, setSaving] = useState(false);
  const server = useServerErrors(form);

  const { input, result } = useMemo(() => compute(values, settings), [values, settings]);
  const errors = useMemo(() => {
    const map: Record<string, string> = {};
    if (!result.ok) for (const [path, msg] of Object.entries(result.fields)) map[fieldForPath(path, values)] ??= msg;
    // Geometry that cannot be built is an error on its field as well as in the findings.
    else for (const f of result.plan.findings) if (f.severity === "error" && f.field) map[fieldForPath(f.field, values)] ??= f.message;
    return map;
  }, [result, values]);
  const model = useMemo(() => (result.ok ? planDrawing(result.geometry) : null), [result]);

  function switchUnit(next: Unit) {
    const from = getValues("unit");
    if (from === next) return;
    for (const f of LENGTH_FIELDS) {
      const text = getValues(f as Path<PlannerValues>) as string;
      const r = convertLength(text, from, next, canonical.current[f], ROUND_UP_FIELDS.includes(f) ? "up" : "nearest");
      if (r.mm !== null) canonical.current[f] = { text: r.text, mm: r.mm };
      setValue(f as Path<PlannerValues>, r.text as never);
    }
    setValue("unit", next);
  }

  function applyPreset(which: PresetKind, id: string) {
    const studio = settings.framePresets.map((p, i) => ({ id: `studio-${i}`, label: p.label, width: p.widthMm, height: p.heightMm }));
    const list = which === "board" ? STANDARD_BOARD_SHEETS : which === "sheet" ? SHEET_PRESETS : [...studio, ...FRAME_PRESETS];
    const p = list.find((x) => x.id === id);
    if (!p) return;
    const put = (field: string, mm: number) => {
      const text = lengthInputValue(mm, getValues("unit"));
      canonical.current[field] = { text, mm };
      setValue(field as Path<PlannerValues>, text as never);
    };
    const [w, h] = which === "sheet" ? ["sheetW", "sheetH"] : which === "fit" ? ["fit.width", "fit.height"] : ["board.width", "board.height"];
    put(w, p.width);
    put(h, p.height);
    if (which === "fit") setValue("bordersMode", "fit");
  }

  const lengthField = (name: string, label: string, hint?: string) => (
    <TextField label={label} inputMode="decimal" className="num" autoComplete="off" error={errors[name]} hint={hint} {...register(name as Path<PlannerValues>)} />
  );
  const u = unit === "in" ? "in" : "mm";

  async function save() {
    if (!onSave) return;
    setSaving(true);
    await server.run(() => onSave(input));
    setSaving(false);
  }

  const sectionProps: SectionProps = { register, values, settings, errors, L: lengthField, u, applyPreset };

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(22rem,26rem)_1fr]">
      <form className="space-y-4 print:hidden" onSubmit={(e) => e.preventDefault()} aria-label={`${settings.words.Mount} plan`}>
        {context}
        <div className="flex items-center justify-between gap-3">
          <Segmented label="Unit" options={["mm", "in"] as const} value={unit} onChange={switchUnit} optionLabel={(x) => (x === "mm" ? "mm" : "inches")} padding="px-3 py-1.5" />
          <p className="text-xs text-graphite">{unit === "in" ? "Type 7 5/8, 7-5/8 or 7.625" : "Millimetres"}</p>
        </div>
        <SheetSection {...sectionProps} />
        <WindowSection {...sectionProps} />
        <BordersSection {...sectionProps} />
        <FrameSection {...sectionProps} />
        <BoardSection {...sectionProps} />
        <MaterialsSection {...sectionProps} />
      </form>
      <PlanResultView
        result={result}
        errors={errors}
        model={model}
        unit={unit}
        settings={settings}
        onSave={onSave ? save : undefined}
        saving={saving}
        saveError={server.error?.message ?? null}
        saveState={saveState}
      />
    </div>
  );
}
