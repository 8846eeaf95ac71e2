import { useMemo, useState } from "react";
import { useFieldArray, useForm, useWatch, type Path } from "react-hook-form";
import { studioToday } from "@/lib/today.ts";
import {
  CONDITION_CONTEXTS,
  CONDITION_CONTEXT_LABELS,
  ConditionCorrectionSchema,
  ConditionCreateSchema,
  RATINGS,
  RATING_LABELS,
  SEVERITIES,
  SEVERITY_LABELS,
  TWO_PARTY_CONTEXTS,
  ZONES,
  ZONE_LABELS,
  type ConditionCreate,
  type ConditionData,
  type ConditionDataInput,
  type Term,
} from "@shared/schemas/condition.ts";
import type { Photo } from "@shared/schemas/photos.ts";
import { PHOTO_KIND_LABELS } from "@shared/schemas/photos.ts";
import { ratingFloor } from "@shared/domain/condition.ts";
import { SelectField, TextAreaField, TextField } from "@/components/ui/field.tsx";
import { Button, FormActions } from "@/components/ui/button.tsx";
import { errorAt, useServerErrors } from "@/lib/form-errors.ts";
import { RevisionedFormHead } from "@/components/revisioned.tsx";
import { revisionedResolver, type RevisionedFormMode } from "@/lib/revisioned.ts";
import { PhotoMarkers } from "./photo-markers.tsx";
import { EnumOptions, RecordOptions } from "@/components/ui/options.tsx";

export type ReportFormValues = {
  context: string;
  reportDate: string;
  mountingId: string;
  correctionReason: string;
  data: ConditionDataInput & { signatures: { examiner?: { name: string; date: string; role?: string | null }; otherParty?: { name: string; date: string; role?: string | null } } };
};
export type ReportFormMode = RevisionedFormMode;
type Submit = ConditionCreate & { correctionReason: string };

// randomUUID needs a secure context (https or localhost); elsewhere fall back to time and randomness.
const newId = () => (window.isSecureContext ? crypto.randomUUID() : `f-${Date.now()}-${Math.random().toString(36).slice(2)}`);

/** Empty signature blocks are left out; an empty mounting is "none". */
function toBody(v: ReportFormValues) {
  const sig = (x?: { name: string; date: string; role?: string | null }) => (x?.name.trim() ? x : undefined);
  return {
    context: v.context,
    reportDate: v.reportDate,
    mountingId: v.mountingId || null,
    data: { ...v.data, signatures: { examiner: sig(v.data.signatures?.examiner), otherParty: sig(v.data.signatures?.otherParty) } },
  };
}

const resolver = (mode: ReportFormMode) =>
  revisionedResolver<ReportFormValues, typeof ConditionCreateSchema>({ create: ConditionCreateSchema, correction: ConditionCorrectionSchema }, toBody, mode === "correct");

type Props = {
  mode: ReportFormMode;
  objectType: string;
  photos: Photo[];
  terms: Term[];
  mountings: { id: string; label: string }[];
  examinerName: string;
  lightNotes: string;
  /** The latest earlier report, to carry its findings forward (same ids, so the reports compare). */
  previous?: ConditionData | null;
  initial?: { context: string; reportDate: string; mountingId: string | null; data: ConditionData };
  onSubmit: (v: Submit) => Promise<void>;
  onCancel: () => void;
};

export function ReportForm({ mode, objectType, photos, terms, mountings, examinerName, lightNotes, previous, initial, onSubmit, onCancel }: Props) {
  const today = studioToday();
  const defaults: ReportFormValues = {
    context: initial?.context ?? "periodic-check",
    reportDate: initial?.reportDate ?? today,
    mountingId: initial?.mountingId ?? "",
    correctionReason: "",
    data: initial
      ? { ...initial.data, signatures: initial.data.signatures ?? {} }
      : {
          overallRating: "good",
          summary: "",
          findings: [],
          recommendations: { display: "", handling: "", environment: "", referral: "" },
          lightNotes,
          photoIds: [],
          signatures: { examiner: { name: examinerName, date: today } },
        },
  };
  const form = useForm<ReportFormValues, unknown, Submit>({ defaultValues: defaults, resolver: resolver(mode) });
  const { register, control, setValue, getValues, formState } = form;
  const server = useServerErrors(form);
  const findings = useFieldArray({ control, name: "data.findings", keyName: "_key" });
  const v = useWatch({ control }) as ReportFormValues;
  const [selected, setSelected] = useState<string | null>(null);
  const reportPhotos = photos.filter((p) => (v.data.photoIds ?? []).includes(p.id));
  const [shownPhoto, setShownPhoto] = useState<string | null>(null);
  const photo = reportPhotos.find((p) => p.id === shownPhoto) ?? reportPhotos[0];
  const err = (p: string) => errorAt(formState.errors, p);
  const list = terms.filter((t) => t.active && (t.list === "paper" || objectType === "photograph"));
  const floor = ratingFloor((v.data.findings ?? []).filter(Boolean) as { severity: (typeof SEVERITIES)[number] }[]);
  const twoParty = (TWO_PARTY_CONTEXTS as readonly string[]).includes(v.context);

  const markers = useMemo(
    () =>
      (v.data.findings ?? [])
        .map((f, i) => ({ f, n: i + 1 }))
        .filter(({ f }) => f?.location?.kind === "marker" && photo && f.location.photoId === photo.id)
        .map(({ f, n }) => ({ id: f!.id, n, x: (f!.location as { x: number }).x, y: (f!.location as { y: number }).y, tone: f!.severity ?? "slight" })),
    [v.data.findings, photo],
  );

  function addFinding(location: ConditionData["findings"][number]["location"]) {
    const id = newId();
    findings.append({ id, term: list[0]?.term ?? "", location, extent: "", severity: "slight", resolved: false, notes: "" });
    setSelected(id);
  }
  const indexOf = (id: string) => (getValues("data.findings") ?? []).findIndex((f) => f.id === id);

  const submit = form.handleSubmit((values) => server.run(() => onSubmit(values)));

  return (
    <form onSubmit={submit} noValidate className="grid gap-6 xl:grid-cols-[minmax(26rem,34rem)_1fr]" aria-label="Condition report">
      <div className="space-y-4">
        <RevisionedFormHead
          error={server.error}
          correcting={mode === "correct"}
          note="The signed report stays as it was; this saves a new revision with your reason."
          reason={{ error: err("correctionReason"), ...register("correctionReason") }}
        />
        <section className="grid grid-cols-2 gap-3 rounded-card bg-paper-sheet p-4 shadow-card">
          <SelectField label="Context" disabled={mode === "correct"} error={err("context")} {...register("context")}>
            <EnumOptions values={CONDITION_CONTEXTS} labels={CONDITION_CONTEXT_LABELS} />
          </SelectField>
          <TextField label="Date examined" type="date" disabled={mode === "correct"} error={err("reportDate")} {...register("reportDate")} />
          <SelectField label="Mounting record" wrapClassName="col-span-2" disabled={mode === "correct"} error={err("mountingId")} {...register("mountingId")}>
            <option value="">None</option>
            <RecordOptions items={mountings} text={(m) => m.label} />
          </SelectField>
        </section>

        <section className="space-y-3 rounded-card bg-paper-sheet p-4 shadow-card">
          <div className="flex items-center justify-between gap-2">
            <h2 className="font-semibold">Findings ({findings.fields.length})</h2>
            <div className="flex gap-2">
              {previous && previous.findings.length > 0 && findings.fields.length === 0 && (
                <Button
                  variant="quiet"
                  onClick={() =>
                    findings.replace(
                      previous.findings.map((f) => ({
                        ...f,
                        location:
                          f.location.kind === "marker" && !(v.data.photoIds ?? []).includes(f.location.photoId) ? { kind: "zone" as const, zone: "centre" as const } : f.location,
                      })),
                    )
                  }
                >
                  Carry over the last report's {previous.findings.length}
                </Button>
              )}
              <Button variant="quiet" onClick={() => addFinding({ kind: "zone", zone: "centre" })}>
                Add a finding
              </Button>
            </div>
          </div>
          {findings.fields.length === 0 && <p className="text-sm text-graphite">No findings yet. Add one, or click on a photo to pin one there.</p>}
          {findings.fields.map((f, i) => {
            const loc = v.data.findings?.[i]?.location;
            const isSel = selected === f.id;
            return (
              // biome-ignore lint/a11y/noNoninteractiveElementInteractions: focus moving into a finding's fields selects its marker on the photo; the fields themselves are the interaction
              <fieldset key={f._key} className={`rounded-card border p-3 ${isSel ? "border-accent" : "border-stone-light"}`} onFocus={() => setSelected(f.id)}>
                <legend className="px-1 text-sm font-semibold">Finding {i + 1}</legend>
                <div className="grid grid-cols-2 gap-3">
                  <SelectField label="Term" error={err(`data.findings.${i}.term`)} {...register(`data.findings.${i}.term`)}>
                    {list.map((t) => (
                      <option key={t.id} value={t.term}>
                        {t.term}
                        {t.list === "photograph" ? " (photograph)" : ""}
                      </option>
                    ))}
                  </SelectField>
                  <SelectField label="Severity" error={err(`data.findings.${i}.severity`)} {...register(`data.findings.${i}.severity`)}>
                    <EnumOptions values={SEVERITIES} labels={SEVERITY_LABELS} />
                  </SelectField>
                  {loc?.kind === "marker" ? (
                    <div className="col-span-2 flex items-center justify-between text-sm">
                      <span>
                        Pinned on {PHOTO_KIND_LABELS[photos.find((p) => p.id === loc.photoId)?.kind ?? "detail"].toLowerCase()} photo, marker {i + 1}
                      </span>
                      <Button variant="quiet" onClick={() => setValue(`data.findings.${i}.location`, { kind: "zone", zone: "centre" })}>
                        Use a zone instead
                      </Button>
                    </div>
                  ) : (
                    <SelectField label="Where" error={err(`data.findings.${i}.location.zone`)} {...register(`data.findings.${i}.location.zone` as Path<ReportFormValues>)}>
                      <EnumOptions values={ZONES} labels={ZONE_LABELS} />
                    </SelectField>
                  )}
                  <TextField label="Extent" error={err(`data.findings.${i}.extent`)} hint="e.g. 12 mm, three spots" {...register(`data.findings.${i}.extent`)} />
                  <TextAreaField label="Notes" rows={2} wrapClassName="col-span-2" error={err(`data.findings.${i}.notes`)} {...register(`data.findings.${i}.notes`)} />
                  <label className="flex items-center gap-2 text-sm">
                    <input type="checkbox" className="h-4 w-4" {...register(`data.findings.${i}.resolved`)} /> Resolved
                  </label>
                  <div className="text-right">
                    <Button variant="quiet" onClick={() => findings.remove(i)}>
                      Remove
                    </Button>
                  </div>
                </div>
              </fieldset>
            );
          })}
        </section>

        <section className="grid gap-3 rounded-card bg-paper-sheet p-4 shadow-card">
          <SelectField
            label="Overall rating"
            error={err("data.overallRating")}
            hint={floor !== "good" ? `The findings allow ${RATING_LABELS[floor].toLowerCase()} at best.` : "The overall rating can't be better than the worst finding."}
            {...register("data.overallRating")}
          >
            {RATINGS.map((r) => (
              <option key={r} value={r} disabled={RATINGS.indexOf(r) < RATINGS.indexOf(floor)}>
                {RATING_LABELS[r]}
              </option>
            ))}
          </SelectField>
          <TextAreaField label="Summary" rows={3} error={err("data.summary")} {...register("data.summary")} />
          <h3 className="text-sm font-semibold">Recommendations</h3>
          <TextAreaField label="Display" rows={2} error={err("data.recommendations.display")} {...register("data.recommendations.display")} />
          <TextAreaField label="Handling" rows={2} error={err("data.recommendations.handling")} {...register("data.recommendations.handling")} />
          <TextAreaField label="Environment" rows={2} error={err("data.recommendations.environment")} {...register("data.recommendations.environment")} />
          <TextAreaField
            label="Referral to a conservator"
            rows={2}
            error={err("data.recommendations.referral")}
            hint="Findings are observations, not treatment: refer treatment to a qualified conservator."
            {...register("data.recommendations.referral")}
          />
          <TextAreaField label="Light and display" rows={4} error={err("data.lightNotes")} {...register("data.lightNotes")} />
        </section>

        <section className="grid grid-cols-2 gap-3 rounded-card bg-paper-sheet p-4 shadow-card">
          <h2 className="col-span-2 font-semibold">Signatures</h2>
          <TextField label="Examiner" error={err("data.signatures.examiner.name")} {...register("data.signatures.examiner.name")} />
          <TextField label="Date signed" type="date" error={err("data.signatures.examiner.date")} {...register("data.signatures.examiner.date")} />
          {twoParty && (
            <>
              <TextField
                label="Other party (borrower or lender)"
                error={err("data.signatures.otherParty.name") ?? err("data.signatures.otherParty")}
                {...register("data.signatures.otherParty.name")}
              />
              <TextField label="Date signed" type="date" error={err("data.signatures.otherParty.date")} {...register("data.signatures.otherParty.date")} />
              <TextField label="Their role" wrapClassName="col-span-2" {...register("data.signatures.otherParty.role")} />
            </>
          )}
          <p className="col-span-2 text-xs text-graphite">Signing locks the report; corrections are saved as new revisions.</p>
        </section>

        <FormActions submitting={formState.isSubmitting} label={mode === "correct" ? "Save the correction" : "Save draft"} onCancel={onCancel} />
      </div>

      <section aria-label="Photos of this report" className="space-y-3 xl:sticky xl:top-6 xl:self-start">
        <div className="rounded-card bg-paper-sheet p-4 shadow-card">
          <h2 className="mb-2 font-semibold">Photos in this report</h2>
          {photos.length === 0 ? (
            <p className="text-sm text-graphite">No photos of this object yet: add them in the object's Photos section, then pin findings on them here.</p>
          ) : (
            <div className="flex flex-wrap gap-2">
              {photos.map((p) => {
                const on = (v.data.photoIds ?? []).includes(p.id);
                return (
                  <label key={p.id} className={`flex w-28 cursor-pointer flex-col gap-1 rounded-card border p-1 text-xs ${on ? "border-accent" : "border-stone"}`}>
                    <img src={p.urls.thumb} alt={p.caption ?? PHOTO_KIND_LABELS[p.kind]} className="h-20 w-full rounded object-cover" />
                    <span className="flex items-center gap-1">
                      <input type="checkbox" value={p.id} {...register("data.photoIds")} onClick={() => setShownPhoto(p.id)} />
                      {PHOTO_KIND_LABELS[p.kind]}
                    </span>
                  </label>
                );
              })}
            </div>
          )}
        </div>
        {photo && (
          <div className="space-y-2 rounded-card bg-paper-sheet p-4 shadow-card">
            <p className="text-sm text-graphite">Click on the photo to pin a new finding; drag a marker to move it; select a marker to edit its finding.</p>
            <PhotoMarkers
              src={photo.urls.web}
              alt={photo.caption ?? PHOTO_KIND_LABELS[photo.kind]}
              markers={markers}
              editable
              selectedId={selected}
              onAdd={(x, y) => addFinding({ kind: "marker", photoId: photo.id, x, y })}
              onMove={(id, x, y) => {
                const i = indexOf(id);
                if (i >= 0) setValue(`data.findings.${i}.location`, { kind: "marker", photoId: photo.id, x, y }, { shouldDirty: true });
              }}
              onSelect={(id) => {
                setSelected(id);
                const i = indexOf(id);
                if (i >= 0) form.setFocus(`data.findings.${i}.term`);
              }}
            />
            {reportPhotos.length > 1 && (
              <div className="flex flex-wrap gap-1">
                {reportPhotos.map((p) => (
                  <Button key={p.id} variant={p.id === photo.id ? "primary" : "secondary"} className="px-2 py-1 text-xs" onClick={() => setShownPhoto(p.id)}>
                    {PHOTO_KIND_LABELS[p.kind]}
                  </Button>
                ))}
              </div>
            )}
          </div>
        )}
      </section>
    </form>
  );
}
