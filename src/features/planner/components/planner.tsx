import { useMemo, useRef, useState, type ReactNode } from "react";
import { useForm, useWatch, type Path, type UseFormRegister } from "react-hook-form";
import { computePlan, planDrawing, FRAME_PRESETS, SHEET_PRESETS, STANDARD_BOARD_SHEETS } from "@shared/domain/mount-plan/index.ts";
import type { PlanResult } from "@shared/domain/mount-plan/compute.ts";
import { MountPlanInputSchema, ATTACHMENT_METHODS, ADHESIVES, SIDES, type MountPlanInput, type SideName } from "@shared/schemas/mount-plan.ts";
import { OBJECT_TYPES, OBJECT_TYPE_LABELS, PHOTO_PROCESSES, PHOTO_PROCESS_LABELS, SENSITIVITIES, SENSITIVITY_LABELS } from "@shared/schemas/objects.ts";
import { issuesToFields } from "@shared/schemas/errors.ts";
import { formatLength, lengthInputValue, type Unit } from "@shared/domain/units.ts";
import { SelectField, TextField } from "@/components/ui/field.tsx";
import { Button } from "@/components/ui/button.tsx";
import { Notice } from "@/components/ui/feedback.tsx";
import { convertLength, defaultValues, fieldForPath, LENGTH_FIELDS, ROUND_UP_FIELDS, toInput, type PlannerValues } from "../lib/planner-values.ts";
import { PlanDrawing } from "@/components/plan-drawing.tsx";
import { ADHESIVE_LABELS, ATTACHMENT_METHOD_LABELS } from "@shared/schemas/mountings.ts";
import { ChecksList, FindingsList, LevelBadge } from "@/components/checks-list.tsx";
import { useServerErrors } from "@/lib/form-errors.ts";

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

const SIDE_LABEL: Record<SideName, string> = { left: "Left", top: "Top", right: "Right", bottom: "Bottom" };
function compute(values: PlannerValues, s: PlannerSettings): { input: MountPlanInput; result: PlanResult } {
  const input = toInput(values);
  const parsed = MountPlanInputSchema.safeParse(input);
  if (!parsed.success) return { input, result: { ok: false, fields: issuesToFields(parsed.error.issues) } };
  return { input, result: computePlan(parsed.data, { minOverlapMm: s.minOverlapMm, rebateClearanceMm: s.rebateClearanceMm }) };
}

function Group({ title, children, open = true }: { title: string; children: ReactNode; open?: boolean }) {
  return (
    <details open={open} className="group rounded-card bg-paper-sheet shadow-card">
      <summary className="cursor-pointer select-none list-none px-4 py-3 font-semibold marker:hidden">
        <span aria-hidden="true" className="mr-2 inline-block text-graphite transition group-open:rotate-90">›</span>
        {title}
      </summary>
      <div className="space-y-3 border-t border-stone-light px-4 py-4">{children}</div>
    </details>
  );
}

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
  const model = useMemo(() => (result.ok ? planDrawing(result.geometry) : null), [result, unit]);

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

  function applyPreset(which: "sheet" | "fit" | "board", id: string) {
    const studio = settings.framePresets.map((p, i) => ({ id: `studio-${i}`, label: p.label, width: p.widthMm, height: p.heightMm }));
    const list = which === "board" ? STANDARD_BOARD_SHEETS : which === "sheet" ? SHEET_PRESETS : [...studio, ...FRAME_PRESETS];
    const p = list.find((x) => x.id === id);
    if (!p) return;
    const put = (field: string, mm: number) => {
      const text = lengthInputValue(mm, getValues("unit"));
      canonical.current[field] = { text, mm };
      setValue(field as Path<PlannerValues>, text as never);
    };
    if (which === "sheet") (put("sheetW", p.width), put("sheetH", p.height));
    if (which === "fit") (put("fit.width", p.width), put("fit.height", p.height), setValue("bordersMode", "fit"));
    if (which === "board") (put("board.width", p.width), put("board.height", p.height));
  }

  const L = (name: string, label: string, hint?: string) => (
    <TextField label={label} inputMode="decimal" className="num" autoComplete="off" error={errors[name]} hint={hint} {...register(name as Path<PlannerValues>)} />
  );
  const u = unit === "in" ? "in" : "mm";
  const plan = result.ok ? result.plan : null;

  async function save() {
    if (!onSave) return;
    setSaving(true);
    await server.run(() => onSave(input));
    setSaving(false);
  }

  return (
    <div className="grid gap-6 xl:grid-cols-[minmax(22rem,26rem)_1fr]">
      <form className="space-y-4 print:hidden" onSubmit={(e) => e.preventDefault()} aria-label={`${settings.words.Mount} plan`}>
        {context}
        <div className="flex items-center justify-between gap-3">
          <div role="radiogroup" aria-label="Unit" className="inline-flex rounded-card border border-stone text-sm">
            {(["mm", "in"] as const).map((x) => (
              <button key={x} type="button" role="radio" aria-checked={unit === x} onClick={() => switchUnit(x)} className={`px-3 py-1.5 ${unit === x ? "bg-accent text-paper-sheet" : "text-ink-soft hover:bg-paper-deep"}`}>
                {x === "mm" ? "mm" : "inches"}
              </button>
            ))}
          </div>
          <p className="text-xs text-graphite">{unit === "in" ? "Type 7 5/8, 7-5/8 or 7.625" : "Millimetres"}</p>
        </div>

        <Group title="Sheet">
          <SelectField label="Preset" value="" onChange={(e) => applyPreset("sheet", e.target.value)}>
            <option value="">Choose a standard size…</option>
            {SHEET_PRESETS.map((p) => <option key={p.id} value={p.id}>{p.label}</option>)}
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
              {SIDES.map((s) => <div key={s}>{L(`ib.${s}`, `${SIDE_LABEL[s]}`)}</div>)}
            </div>
          )}
        </Group>

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
            (values.windowMode === "all" ? (["all"] as const) : SIDES).map((s) => <SideEditor key={s} name={s} label={s === "all" ? "Every side" : SIDE_LABEL[s]} mode={values[s].mode} register={register} L={L} u={u} />)
          )}
          {L("minOverlap", `Minimum overlap (${u})`, `Leave empty for the studio minimum (${formatLength(settings.minOverlapMm, unit, { rounding: "up", denominator: 32 })}); a side below it fails the check.`)}
        </Group>

        <Group title="Borders">
          <SelectField label="Borders" {...register("bordersMode")}>
            <option value="all">The same all round</option>
            <option value="tsb">Top, sides and bottom</option>
            <option value="sides">Each side</option>
            <option value="fit">Fit to an outer size (a ready-made frame)</option>
          </SelectField>
          {values.bordersMode === "all" && L("b.all", `Border (${u})`)}
          {values.bordersMode === "tsb" && <div className="grid grid-cols-3 gap-2">{L("b.top", "Top")}{L("b.side", "Sides")}{L("b.bottom", "Bottom")}</div>}
          {values.bordersMode === "sides" && <div className="grid grid-cols-4 gap-2">{SIDES.map((s) => <div key={s}>{L(`b.${s}`, SIDE_LABEL[s])}</div>)}</div>}
          {values.bordersMode === "fit" && (
            <>
              <SelectField label="Frame size" value="" onChange={(e) => applyPreset("fit", e.target.value)}>
                <option value="">Choose a standard size…</option>
                {settings.framePresets.length > 0 && (
                  <optgroup label="The studio's sizes">
                    {settings.framePresets.map((p, i) => <option key={i} value={`studio-${i}`}>{p.label}</option>)}
                  </optgroup>
                )}
                {[...new Set(FRAME_PRESETS.map((p) => p.group))].map((g) => (
                  <optgroup key={g} label={g}>
                    {FRAME_PRESETS.filter((p) => p.group === g).map((p) => <option key={p.id} value={p.id}>{p.label}</option>)}
                  </optgroup>
                ))}
              </SelectField>
              <div className="grid grid-cols-2 gap-3">{L("fit.width", `Outer width (${u})`)}{L("fit.height", `Outer height (${u})`)}</div>
            </>
          )}
          <SelectField label="Bottom weighting" {...register("weightMode")}>
            <option value="none">None</option>
            <option value="amount">Add an amount to the bottom</option>
            <option value="percent">Bottom larger by a percentage</option>
          </SelectField>
          {values.weightMode === "amount" && L("weight", `Extra at the bottom (${u})`, "Often 10–20 mm.")}
          {values.weightMode === "percent" && <TextField label="Bottom larger by (%)" inputMode="decimal" error={errors.bottomWeightPercent} hint="Often 10–15 %." {...register("weightPct")} />}
          {L("minBorder", `Warn below a border of (${u})`)}
          <label className="flex items-center gap-2 text-sm"><input type="checkbox" className="h-4 w-4" {...register("double")} /> Double {settings.words.mount} (a top board with a reveal)</label>
          {values.double && L("doubleReveal", `Reveal of the inner board (${u})`, "Commonly 3–6 mm a side.")}
        </Group>

        <Group title={`Glazing and frame`} open={false}>
          <div className="grid grid-cols-2 gap-3">
            <SelectField label="Glazing" {...register("glazing.material")}>
              <option value="">Not chosen</option>
              <option value="glass">Glass</option>
              <option value="acrylic">Acrylic</option>
            </SelectField>
            {L("glazing.thickness", `Thickness (${u})`)}
          </div>
          <label className="flex items-center gap-2 text-sm"><input type="checkbox" className="h-4 w-4" {...register("glazing.uv")} /> UV-filtering</label>
          <div className="grid grid-cols-2 gap-3">
            {L("spacer", `Spacer depth (${u})`)}
            {L("frame.rebateDepth", `${settings.words.Rebate} depth (${u})`)}
            {L("frame.lip", `${settings.words.Rebate} lip (${u})`, "Default 6 mm")}
            {L("frame.faceWidth", `Moulding face (${u})`, "Default 20 mm")}
          </div>
          <TextField label="Waste allowance (%)" inputMode="decimal" hint="Default 10 %" {...register("frame.waste")} />
        </Group>

        <Group title="Board sheet and yield" open={false}>
          <SelectField label="Full sheet" {...register("board.preset", { onChange: (e) => applyPreset("board", e.target.value) })}>
            <option value="">Not needed</option>
            {STANDARD_BOARD_SHEETS.map((b) => <option key={b.id} value={b.id}>{b.label}</option>)}
            <option value="custom">Other size</option>
          </SelectField>
          {values.board.preset && <div className="grid grid-cols-3 gap-2">{L("board.width", `Width (${u})`)}{L("board.height", `Height (${u})`)}{L("board.kerf", `Kerf (${u})`)}</div>}
        </Group>

        <Group title="Object and materials (for the checks)" open={false}>
          <div className="grid grid-cols-2 gap-3">
            <SelectField label="Object type" {...register("object.objectType")}>
              <option value="">Not given</option>
              {OBJECT_TYPES.map((t) => <option key={t} value={t}>{OBJECT_TYPE_LABELS[t]}</option>)}
            </SelectField>
            <SelectField label="Photographic process" disabled={values.object.objectType !== "photograph"} {...register("object.photoProcess")}>
              <option value="">—</option>
              {PHOTO_PROCESSES.map((p) => <option key={p} value={p}>{PHOTO_PROCESS_LABELS[p]}</option>)}
            </SelectField>
          </div>
          <fieldset>
            <legend className="mb-1 text-sm font-medium text-ink-soft">Sensitivities</legend>
            <div className="flex flex-wrap gap-3">
              {SENSITIVITIES.map((s) => <label key={s} className="inline-flex items-center gap-1.5 text-sm"><input type="checkbox" value={s} className="h-4 w-4" {...register("object.sensitivities")} />{SENSITIVITY_LABELS[s]}</label>)}
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
              {ATTACHMENT_METHODS.map((m) => <option key={m} value={m}>{ATTACHMENT_METHOD_LABELS[m]}</option>)}
            </SelectField>
            <SelectField label="Adhesive" {...register("materials.adhesive")}>
              <option value="">Not chosen</option>
              {ADHESIVES.map((a) => <option key={a} value={a}>{ADHESIVE_LABELS[a]}</option>)}
            </SelectField>
            <TextField label="Number of hinges" inputMode="numeric" {...register("materials.hingeCount")} />
          </div>
        </Group>
      </form>

      <section aria-label="Result" className="space-y-4 xl:sticky xl:top-6 xl:self-start print:space-y-2 print:text-[11px]">
        {!plan ? (
          <Notice tone="warn" title="Not computed yet">
            <ul className="list-disc pl-5">
              {Object.values(errors).slice(0, 5).map((m) => <li key={m}>{m}</li>)}
            </ul>
          </Notice>
        ) : (
          <>
            <div className="flex flex-wrap items-center justify-between gap-3">
              <LevelBadge level={plan.level} />
              <div className="flex gap-2 print:hidden">
                {onSave && <Button onClick={save} disabled={saving}>{saving ? "Saving…" : "Save draft"}</Button>}
                <Button variant="secondary" onClick={() => window.print()}>Print</Button>
              </div>
            </div>
            {server.error && <Notice tone="fail" title="Not saved">{server.error.message}</Notice>}
            {saveState}
            <div className="rounded-card bg-paper-sheet p-4 shadow-card print:p-0 print:shadow-none">
              {model && <PlanDrawing model={model} title={`${settings.words.Mount} drawn to scale: window ${plan.display.aperture}, outer ${plan.display.outer}`} />}
            </div>
            <div className="grid gap-4 md:grid-cols-2">
              <dl className="rounded-card bg-paper-sheet p-4 text-sm shadow-card print:p-2 print:text-[11px] print:shadow-none" data-testid="plan-numbers">
                {([
                  ["Window (aperture)", plan.display.aperture],
                  ...SIDES.map((s) => [
                    `${SIDE_LABEL[s]} ${plan.overlap[s] < 0 ? "reveal" : "overlap"}`,
                    plan.overlap[s] < 0 ? plan.display[`overlap.${s}`].replace("−", "") : plan.display[`overlap.${s}`],
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
                ] as [string, string][]).map(([k, v]) => (
                  <div key={k} className="flex justify-between gap-3 border-b border-stone-light py-1.5 last:border-0 print:py-0.5">
                    <dt className="text-graphite">{k}</dt>
                    <dd className="text-right font-medium num" data-testid={`num-${k}`}>{v}</dd>
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
    </div>
  );
}

function SideEditor({ name, label, mode, register, L, u }: { name: "all" | SideName; label: string; mode: string; register: UseFormRegister<PlannerValues>; L: (n: string, l: string, h?: string) => ReactNode; u: string }) {
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
