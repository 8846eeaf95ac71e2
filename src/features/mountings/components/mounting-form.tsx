import { useMemo } from "react";
import { type FieldPath, useFieldArray, useForm, useWatch } from "react-hook-form";
import { studioToday } from "@/lib/today.ts";
import {
  BACKING_TYPES,
  BACKING_TYPE_LABELS,
  BOARD_GRADE_LABELS,
  GLAZING_TYPES,
  GLAZING_TYPE_LABELS,
  MOUNTING_REASONS,
  MOUNTING_REASON_LABELS,
  MountingCorrectionSchema,
  MountingCreateSchema,
  MountingDataSchema,
  SEALING_TYPES,
  SEALING_TYPE_LABELS,
  type MountingCreate,
  type MountingData,
  type MountingDataInput,
} from "@shared/schemas/mountings.ts";
import { ADHESIVES, ATTACHMENT_METHODS, MountPlanInputSchema, SIDES, type MountPlanInput } from "@shared/schemas/mount-plan.ts";
import { draftPlan, planObjectOf, recordPlan, type CatalogueFacts, type PlanSettings } from "@shared/domain/mounting.ts";
import { hingesWanted, planDrawing } from "@shared/domain/mount-plan/index.ts";
import { SelectField, TextAreaField, TextField } from "@/components/ui/field.tsx";
import { Button, FormActions } from "@/components/ui/button.tsx";
import { Notice } from "@/components/ui/feedback.tsx";
import { PlanDrawing } from "@/components/plan-drawing.tsx";
import { ChecksList, LevelBadge } from "@/components/checks-list.tsx";
import { errorAt, useServerErrors } from "@/lib/form-errors.ts";
import { RevisionedFormHead } from "@/components/revisioned.tsx";
import { revisionedResolver, type RevisionedFormMode } from "@/lib/revisioned.ts";
import { ADHESIVE_LABELS, ATTACHMENT_METHOD_LABELS as ATTACHMENT_LABELS } from "@shared/schemas/mountings.ts";
import { EnumOptions } from "@/components/ui/options.tsx";

type FormData = Omit<MountingDataInput, "plan">;
export type MountingFormValues = { reason: string; mountedOn: string; correctionReason: string; data: FormData };
export type MountingFormMode = RevisionedFormMode;

const HINGED = ["t-hinge", "v-hinge", "pendant-hinge", "pass-through-hinge"];
const num = { setValueAs: (v: unknown) => (v === "" || v === null || v === undefined ? null : Number(v)) };
// Option values are "true"/"false", so the stored boolean selects its option and reads back as a boolean.
const bool = { setValueAs: (v: unknown) => v === "true" || v === true };

export function emptyMountingData(planInput: MountPlanInput, hasTopBoard: boolean): FormData {
  const board = { grade: "museum" as const, buffered: false, ply: 4 as const, colour: "", maker: "", batch: "" };
  return {
    boards: { window: { ...board, colour: "Warm white" }, backing: { ...board }, ...(hasTopBoard ? { top: { ...board } } : {}) },
    attachment: { method: "t-hinge", tissue: "Japanese tissue (kozo)", tissueWeightGsm: null, adhesive: "wheat-starch-paste", hinges: [] },
    glazing: { type: planInput.glazing?.uvFiltering === false ? "float-glass" : planInput.glazing?.material === "acrylic" ? "uv-acrylic" : "uv-glass", thicknessMm: null },
    spacer: { type: "", depthMm: null },
    frame: { moulding: "", finish: "", faceWidthMm: null, rebateDepthMm: null },
    backing: { type: "archival-corrugated", notes: "" },
    sealing: { type: "barrier-film", notes: "" },
    hanging: { hardware: "D-rings, two wall points", wire: "", notes: "" },
    undoNotes: "",
    notes: "",
  };
}

/** The plan is not typed here: it comes from the planner (or the record), so the body gets it added. */
const resolverFor = (planInput: MountPlanInput, mode: MountingFormMode) =>
  revisionedResolver<MountingFormValues, typeof MountingCreateSchema>(
    { create: MountingCreateSchema, correction: MountingCorrectionSchema },
    (values) => ({ reason: values.reason, mountedOn: values.mountedOn, data: { ...values.data, plan: planInput } }),
    mode === "correct",
  );

type Props = {
  mode: MountingFormMode;
  planInput: MountPlanInput;
  settings: PlanSettings;
  /** The object's catalogue: the live checks read it, as the record page's do. */
  catalogue: CatalogueFacts;
  initial?: { reason: string; mountedOn: string; data: MountingData | FormData };
  onSubmit: (values: MountingCreate & { correctionReason: string }) => Promise<void>;
  onCancel: () => void;
};

export function MountingForm({ mode, planInput, settings, catalogue, initial, onSubmit, onCancel }: Props) {
  const hasTop = !!planInput.doubleMount;
  const defaults: MountingFormValues = {
    reason: initial?.reason ?? "first-mounting",
    mountedOn: initial?.mountedOn ?? studioToday(),
    correctionReason: "",
    data: initial ? stripPlan(initial.data) : emptyMountingData(planInput, hasTop),
  };
  const form = useForm<MountingFormValues, unknown, MountingCreate & { correctionReason: string }>({ defaultValues: defaults, resolver: resolverFor(planInput, mode) });
  const { register, control, setValue, getValues, formState } = form;
  const server = useServerErrors(form);
  const hinges = useFieldArray({ control, name: "data.attachment.hinges" });
  const watched = useWatch({ control }) as MountingFormValues;
  const e = formState.errors;
  const err = (p: string) => errorAt(e, p);
  /** A measure typed as a decimal; an emptied field is null. */
  const measure = (path: FieldPath<MountingFormValues>, label: string, className?: string) => (
    <TextField label={label} inputMode="decimal" className={className} error={err(path)} {...register(path, num)} />
  );

  // Live: the plan recomputed with the materials as they are chosen, the same function the server uses.
  const live = useMemo(() => {
    const parsed = MountingDataSchema.safeParse({ ...watched.data, plan: planInput });
    const data = parsed.success ? parsed.data : null;
    const r = data ? recordPlan(data, catalogue, settings) : draftPlan(MountPlanInputSchema.parse(planInput), catalogue, settings);
    return { result: r, complete: parsed.success };
  }, [watched, planInput, settings, catalogue]);
  const geometry = live.result.ok ? live.result.geometry : null;
  const hingeMarks = (watched.data?.attachment?.hinges ?? []).filter(Boolean).map((h) => ({ edge: h.edge, offset: Number(h.offsetMm) || 0, width: Number(h.widthMm) || 0 }));
  const model = geometry ? planDrawing(geometry, hingeMarks) : null;
  const method = watched.data?.attachment?.method ?? "";

  function edgeLength(edge: string) {
    if (!geometry) return 0;
    return edge === "top" || edge === "bottom" ? geometry.sheet.width : geometry.sheet.height;
  }
  function moveHinge(i: number, delta: number) {
    const h = getValues(`data.attachment.hinges.${i}`);
    if (!h) return;
    const max = Math.max(0, edgeLength(h.edge) - Number(h.widthMm || 0));
    setValue(`data.attachment.hinges.${i}.offsetMm`, Math.min(max, Math.max(0, Math.round(Number(h.offsetMm || 0) + delta))), { shouldDirty: true });
  }
  function placeHinges() {
    if (!geometry) return;
    const w = geometry.sheet.width;
    const n = hingesWanted(geometry.sheet, planObjectOf(catalogue).paperWeightGsm).count;
    const width = Math.min(25, Math.round(w / (n * 3)));
    hinges.replace(Array.from({ length: n }, (_, i) => ({ edge: "top" as const, offsetMm: Math.round(((i + 0.5) * w) / n - width / 2), widthMm: width })));
  }

  const submit = form.handleSubmit((values) => server.run(() => onSubmit(values)));

  // A function, not a component: called inline so its fields are never remounted when the form re-renders.
  const boardFields = (role: "window" | "backing" | "top", label: string) => (
    <fieldset className="rounded-card border border-stone-light p-3">
      <legend className="px-1 text-sm font-semibold">{label}</legend>
      <div className="grid grid-cols-2 gap-3 md:grid-cols-3">
        <SelectField label="Grade" wrapClassName="col-span-2 md:col-span-1" error={err(`data.boards.${role}.grade`)} {...register(`data.boards.${role}.grade`)}>
          {(Object.keys(BOARD_GRADE_LABELS) as (keyof typeof BOARD_GRADE_LABELS)[]).map((g) => (
            <option key={g} value={g}>
              {BOARD_GRADE_LABELS[g]}
            </option>
          ))}
        </SelectField>
        <SelectField label="Buffer" error={err(`data.boards.${role}.buffered`)} {...register(`data.boards.${role}.buffered`, bool)}>
          <option value="false">Unbuffered</option>
          <option value="true">Buffered</option>
        </SelectField>
        <SelectField label="Thickness" error={err(`data.boards.${role}.ply`)} {...register(`data.boards.${role}.ply`, { setValueAs: (v) => Number(v) })}>
          {[2, 4, 6, 8].map((p) => (
            <option key={p} value={p}>
              {p}-ply
            </option>
          ))}
        </SelectField>
        <TextField label="Colour" error={err(`data.boards.${role}.colour`)} {...register(`data.boards.${role}.colour`)} />
        <TextField label="Maker" error={err(`data.boards.${role}.maker`)} {...register(`data.boards.${role}.maker`)} />
        <TextField label="Maker's batch" error={err(`data.boards.${role}.batch`)} {...register(`data.boards.${role}.batch`)} />
      </div>
      <label className="mt-2 flex items-center gap-2 text-sm">
        <input type="checkbox" className="h-4 w-4" {...register(`data.boards.${role}.patPassed`)} /> Passed the Photographic Activity Test (ISO 18916)
      </label>
    </fieldset>
  );

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(24rem,30rem)_1fr]">
      <form onSubmit={submit} noValidate className="space-y-4" aria-label="Mounting record">
        <RevisionedFormHead
          error={server.error}
          correcting={mode === "correct"}
          note="The completed record stays as it was; this saves a new revision with your reason, and both stay readable."
          reason={{ error: err("correctionReason"), ...register("correctionReason") }}
        />
        <section className="grid grid-cols-2 gap-3 rounded-card bg-paper-sheet p-4 shadow-card">
          <SelectField label="Reason" disabled={mode === "correct"} error={err("reason")} {...register("reason")}>
            <EnumOptions values={MOUNTING_REASONS} labels={MOUNTING_REASON_LABELS} />
          </SelectField>
          <TextField label="Date mounted" type="date" disabled={mode === "correct"} error={err("mountedOn")} {...register("mountedOn")} />
        </section>

        <section className="space-y-3 rounded-card bg-paper-sheet p-4 shadow-card">
          <h2 className="font-semibold">Boards</h2>
          {boardFields("window", "Window board")}
          {hasTop && boardFields("top", "Top board (double mount)")}
          {boardFields("backing", "Backing board")}
        </section>

        <section className="space-y-3 rounded-card bg-paper-sheet p-4 shadow-card">
          <h2 className="font-semibold">Attachment</h2>
          <div className="grid grid-cols-2 gap-3">
            <SelectField label="Method" error={err("data.attachment.method")} {...register("data.attachment.method")}>
              <EnumOptions values={ATTACHMENT_METHODS} labels={ATTACHMENT_LABELS} />
            </SelectField>
            <SelectField label="Adhesive" error={err("data.attachment.adhesive")} {...register("data.attachment.adhesive", { setValueAs: (v) => (v === "" ? null : v) })}>
              <EnumOptions values={ADHESIVES} labels={ADHESIVE_LABELS} blank="None given" />
            </SelectField>
            <TextField label="Tissue" error={err("data.attachment.tissue")} {...register("data.attachment.tissue")} />
            {measure("data.attachment.tissueWeightGsm", "Tissue weight (g/m²)")}
          </div>
          {HINGED.includes(method) && (
            <div className="space-y-2">
              <div className="flex items-center justify-between">
                <h3 className="text-sm font-semibold">Hinges ({hinges.fields.length})</h3>
                <div className="flex gap-2">
                  <Button variant="quiet" onClick={placeHinges}>
                    Spread along the top
                  </Button>
                  <Button variant="quiet" onClick={() => hinges.append({ edge: "top", offsetMm: 10, widthMm: 25 })}>
                    Add a hinge
                  </Button>
                </div>
              </div>
              {err("data.attachment.hinges") && (
                <p role="alert" className="text-sm text-fail">
                  ▲ {err("data.attachment.hinges")}
                </p>
              )}
              <p className="text-xs text-graphite">Drag a hinge on the drawing, or select it and use the arrow keys. Positions are from the sheet's left (or top) corner, in mm.</p>
              {hinges.fields.map((f, i) => (
                <div key={f.id} className="grid grid-cols-[1fr_6rem_6rem_auto] items-end gap-2">
                  <SelectField label={`Hinge ${i + 1} edge`} {...register(`data.attachment.hinges.${i}.edge`)}>
                    {SIDES.map((s) => (
                      <option key={s} value={s}>
                        {s.charAt(0).toUpperCase() + s.slice(1)}
                      </option>
                    ))}
                  </SelectField>
                  {measure(`data.attachment.hinges.${i}.offsetMm`, "From corner", "num")}
                  {measure(`data.attachment.hinges.${i}.widthMm`, "Width", "num")}
                  <Button variant="quiet" aria-label={`Remove hinge ${i + 1}`} onClick={() => hinges.remove(i)}>
                    Remove
                  </Button>
                </div>
              ))}
            </div>
          )}
        </section>

        <section className="grid grid-cols-2 gap-3 rounded-card bg-paper-sheet p-4 shadow-card">
          <h2 className="col-span-full font-semibold">Glazing, spacer and frame</h2>
          <SelectField label="Glazing" error={err("data.glazing.type")} {...register("data.glazing.type")}>
            <EnumOptions values={GLAZING_TYPES} labels={GLAZING_TYPE_LABELS} />
          </SelectField>
          {measure("data.glazing.thicknessMm", "Glazing thickness (mm)")}
          <TextField label="Spacer" error={err("data.spacer.type")} {...register("data.spacer.type")} />
          {measure("data.spacer.depthMm", "Spacer depth (mm)")}
          <TextField label="Moulding" error={err("data.frame.moulding")} {...register("data.frame.moulding")} />
          <TextField label="Finish" error={err("data.frame.finish")} {...register("data.frame.finish")} />
          {measure("data.frame.faceWidthMm", "Moulding face (mm)")}
          {measure("data.frame.rebateDepthMm", "Rebate depth (mm)")}
          <SelectField label="Backing" error={err("data.backing.type")} {...register("data.backing.type")}>
            <EnumOptions values={BACKING_TYPES} labels={BACKING_TYPE_LABELS} />
          </SelectField>
          <SelectField label="Sealing" error={err("data.sealing.type")} {...register("data.sealing.type")}>
            <EnumOptions values={SEALING_TYPES} labels={SEALING_TYPE_LABELS} />
          </SelectField>
          <TextField label="Hanging hardware" error={err("data.hanging.hardware")} {...register("data.hanging.hardware")} />
          <TextField label="Wire" error={err("data.hanging.wire")} {...register("data.hanging.wire")} />
          <p className="col-span-full text-xs text-graphite">
            Hang from hardware and wall fixings rated well above the framed weight, on two wall points; follow the hardware maker's ratings and local building codes.
          </p>
        </section>

        <section className="space-y-3 rounded-card bg-paper-sheet p-4 shadow-card">
          <TextAreaField
            label="How to undo this mounting"
            rows={4}
            error={err("data.undoNotes")}
            hint="What the next framer must release, and how: e.g. which hinges, the paste used, how to release it."
            {...register("data.undoNotes")}
          />
          <TextAreaField label="Other notes" error={err("data.notes")} {...register("data.notes")} />
        </section>

        <FormActions submitting={formState.isSubmitting} label={mode === "correct" ? "Save the correction" : "Save draft"} onCancel={onCancel} />
      </form>

      <section aria-label="The plan with these materials" className="space-y-4 xl:sticky xl:top-6 xl:self-start">
        {live.result.ok && <LevelBadge level={live.result.plan.level} />}
        <div className="rounded-card bg-paper-sheet p-4 shadow-card">
          {model ? (
            <PlanDrawing model={model} title="The mount drawn to scale with the hinges" onHingeMove={moveHinge} hingeEdges={hingeMarks.map((h) => h.edge)} />
          ) : (
            <Notice tone="warn" title="The plan cannot be drawn">
              Open the planner from the object's page and fix the plan first.
            </Notice>
          )}
        </div>
        {live.result.ok && (
          <div className="rounded-card bg-paper-sheet p-4 text-sm shadow-card">
            <h3 className="mb-2 font-semibold">Conservation checks with these materials</h3>
            {!live.complete && <p className="mb-2 text-xs text-warn">▲ Some entries are missing; the checks below use what is filled in.</p>}
            <ChecksList checks={live.result.plan.checks} />
          </div>
        )}
      </section>
    </div>
  );
}

function stripPlan(d: MountingData | FormData): FormData {
  const { plan: _p, ...rest } = d as MountingData;
  return rest as FormData;
}
