import { type ReactNode, useState } from "react";
import { useForm } from "react-hook-form";
import { lengthInputValue, parseLength } from "@shared/domain/units.ts";
import { zodResolver } from "@hookform/resolvers/zod";
import { StudioSettingsSchema, type StudioSettings, type StudioSettingsRecord } from "@shared/schemas/settings.ts";
import type { z } from "zod";

type SettingsInput = z.input<typeof StudioSettingsSchema>;
type NumberSetting = "minOverlapMm" | "checkIntervalMonths" | "checkIntervalOnLoanMonths" | "rebateClearanceMm";
import { can } from "@shared/permissions.ts";
import { useMe } from "@/features/session/api/session.ts";
import { useRemoveLogo, useSaveSettings, useSettings, useUploadLogo } from "@/features/settings/api/settings.ts";
import { SelectField, TextAreaField, TextField } from "@/components/ui/field.tsx";
import { Button } from "@/components/ui/button.tsx";
import { Segmented } from "@/components/ui/segmented.tsx";
import { ErrorNotice, Notice, SkeletonRows } from "@/components/ui/feedback.tsx";
import { useServerErrors } from "@/lib/form-errors.ts";
import { useSaveTerm, useTerms } from "@/features/condition/api/condition.ts";
import { UsersPanel } from "@/features/settings/components/users-panel.tsx";
import { useClients } from "@/features/clients/api/clients.ts";
import { SettingsSection } from "@/features/settings/components/settings-section.tsx";

/** A save's outcome: "Saved" with what was saved, or why it was not. */
function SaveNotices({ saved, error, children }: { saved: boolean; error: Error | null; children: ReactNode }) {
  return (
    <>
      {saved && (
        <Notice tone="pass" title="Saved">
          {children}
        </Notice>
      )}
      {error && <ErrorNotice title="Not saved" error={error} />}
    </>
  );
}

function SettingsForm({ initial, readOnly }: { initial: StudioSettings; readOnly: boolean }) {
  const save = useSaveSettings();
  const form = useForm<SettingsInput, unknown, StudioSettings>({ resolver: zodResolver(StudioSettingsSchema), defaultValues: initial });
  const e = form.formState.errors;
  const server = useServerErrors(form);
  /** A number setting, read back as a number; `step` where it takes halves (the millimetre ones). */
  const numberField = (name: NumberSetting, label: string, hint?: string, step?: string) => (
    <TextField label={label} type="number" step={step} error={e[name]?.message} hint={hint} {...form.register(name, { valueAsNumber: true })} />
  );
  const submit = form.handleSubmit(async ({ framePresets: _kept, ...values }) => {
    if (await server.run(() => save.mutateAsync(values))) form.reset(values as SettingsInput);
  });
  return (
    <form onSubmit={submit} noValidate className="max-w-3xl space-y-4">
      <SaveNotices saved={save.isSuccess && !form.formState.isDirty} error={save.error}>
        The studio settings are saved.
      </SaveNotices>
      <fieldset disabled={readOnly} className="grid gap-4 rounded-card bg-paper-sheet p-5 shadow-card md:grid-cols-2">
        <h2 className="col-span-full text-base font-semibold">Studio</h2>
        <TextField label="Studio name" error={e.studioName?.message} {...form.register("studioName")} />
        <TextAreaField label="Address" error={e.studioAddress?.message} {...form.register("studioAddress")} />
        <TextField
          label="Telephone and e-mail"
          hint="Printed under the address on every document and back label."
          error={e.studioContact?.message}
          {...form.register("studioContact")}
        />
        <h2 className="col-span-full mt-2 text-base font-semibold">Measures and words</h2>
        <SelectField label="Unit" error={e.unit?.message} {...form.register("unit")}>
          <option value="mm">Millimetres</option>
          <option value="in">Inches with fractions</option>
        </SelectField>
        <SelectField label="Vocabulary" error={e.vocabulary?.message} hint="UK trade: mount, rebate. US trade: mat, rabbet." {...form.register("vocabulary")}>
          <option value="mount">Mount (UK)</option>
          <option value="mat">Mat (US)</option>
        </SelectField>
        <SelectField label="Paper size for documents" error={e.paperSize?.message} {...form.register("paperSize")}>
          <option value="A4">A4 (210 × 297 mm)</option>
          <option value="Letter">US Letter (8 1/2 × 11 in)</option>
        </SelectField>
        <TextField label="Currency" maxLength={3} error={e.currency?.message} hint="ISO 4217 code" {...form.register("currency")} />
        {numberField("minOverlapMm", "Minimum overlap (mm)", "How far the window must cover the sheet on each overlapped side. 5 mm is common practice.", "0.5")}
        {numberField("checkIntervalMonths", "Condition check every (months)", "After the last check, or the mounting when there is none.")}
        {numberField("checkIntervalOnLoanMonths", "…for objects on loan (months)")}
        {numberField("rebateClearanceMm", "Rebate clearance (mm, in total)", "Added to the package size to give the frame rebate; 1–3 mm is usual.", "0.5")}
      </fieldset>
      {!readOnly && (
        <Button type="submit" disabled={form.formState.isSubmitting}>
          Save settings
        </Button>
      )}
    </form>
  );
}

/** The controlled vocabulary of condition findings: the admin adds, renames and retires terms (never deletes them). */
function Vocabulary({ readOnly }: { readOnly: boolean }) {
  const terms = useTerms(!readOnly);
  const save = useSaveTerm();
  const [list, setList] = useState<"paper" | "photograph">("paper");
  const [draft, setDraft] = useState("");
  const [error, setError] = useState<string | null>(null);
  const shown = (terms.data ?? []).filter((t) => t.list === list);
  const add = () => {
    setError(null);
    save.mutate({ list, term: draft.trim(), caution: null, active: true }, { onSuccess: () => setDraft(""), onError: (e) => setError(e.message) });
  };
  return (
    <SettingsSection title="Condition vocabulary">
      <p className="text-sm text-graphite">The words findings are recorded in. Photographs use both lists. A retired term stays on old reports but is no longer offered.</p>
      <Segmented
        kind="tab"
        label="List"
        options={["paper", "photograph"] as const}
        value={list}
        onChange={setList}
        optionLabel={(l) => (l === "paper" ? "Paper" : "Photographs")}
        hover={false}
      />
      <ul className="grid gap-1 sm:grid-cols-2">
        {shown.map((t) => (
          <li key={t.id} className="flex items-center justify-between gap-2 border-b border-stone-light py-1 text-sm">
            <span className={t.active ? "" : "text-graphite line-through"}>
              {t.term}
              {t.caution ? " ▲" : ""}
            </span>
            {!readOnly && (
              <Button
                variant="quiet"
                className="px-2 py-0.5 text-xs"
                onClick={() => save.mutate({ id: t.id, list: t.list, term: t.term, caution: t.caution ?? null, active: !t.active })}
              >
                {t.active ? "Retire" : "Bring back"}
              </Button>
            )}
          </li>
        ))}
      </ul>
      {!readOnly && (
        <div className="flex items-end gap-2">
          <TextField label={`New ${list === "paper" ? "paper" : "photograph"} term`} value={draft} error={error ?? undefined} onChange={(e) => setDraft(e.target.value)} />
          <Button onClick={add} disabled={!draft.trim() || save.isPending}>
            Add
          </Button>
        </div>
      )}
      <p className="text-xs text-graphite">▲ shows a handling caution (mould, insects) on reports with that finding.</p>
    </SettingsSection>
  );
}

function StudioUsers() {
  const clients = useClients();
  return <UsersPanel clients={clients.data ?? []} />;
}

type PresetRow = { label: string; width: string; height: string };

/** The studio's own frame sizes, typed in the studio's unit and kept in mm. */
function FramePresets({ settings, readOnly }: { settings: StudioSettingsRecord; readOnly: boolean }) {
  const save = useSaveSettings();
  const u = settings.unit;
  const [rows, setRows] = useState<PresetRow[]>(
    settings.framePresets.map((p) => ({ label: p.label, width: lengthInputValue(p.widthMm, u), height: lengthInputValue(p.heightMm, u) })),
  );
  const [errors, setErrors] = useState<Record<string, string>>({});
  const set = (i: number, k: keyof PresetRow, v: string) => setRows((r) => r.map((row, j) => (j === i ? { ...row, [k]: v } : row)));
  function submit() {
    const errs: Record<string, string> = {};
    const presets = rows.map((r, i) => {
      const w = parseLength(r.width, u);
      const h = parseLength(r.height, u);
      if (!r.label.trim()) errs[`${i}.label`] = "Name the size.";
      if (!w.ok || w.mm <= 0) errs[`${i}.width`] = w.ok ? "Width must be greater than 0." : w.message;
      if (!h.ok || h.mm <= 0) errs[`${i}.height`] = h.ok ? "Height must be greater than 0." : h.message;
      return { label: r.label.trim(), widthMm: w.ok ? w.mm : 0, heightMm: h.ok ? h.mm : 0 };
    });
    setErrors(errs);
    if (Object.keys(errs).length === 0) save.mutate({ ...settings, framePresets: presets });
  }
  return (
    <SettingsSection title="The studio's frame sizes">
      <p className="text-sm text-graphite">Ready-made sizes the studio stocks; the planner offers them beside the standard ones. Sizes in {u === "in" ? "inches" : "mm"}.</p>
      <SaveNotices saved={save.isSuccess} error={save.error}>
        The frame sizes are saved.
      </SaveNotices>
      {rows.length === 0 && <p className="text-sm text-graphite">No sizes yet.</p>}
      {rows.map((r, i) => (
        // biome-ignore lint/suspicious/noArrayIndexKey: the inputs are controlled and errors are addressed by row number, so position is the row's identity
        <div key={i} className="grid grid-cols-[1fr_7rem_7rem_auto] items-end gap-2">
          <TextField label="Name" disabled={readOnly} value={r.label} error={errors[`${i}.label`]} onChange={(e) => set(i, "label", e.target.value)} />
          <TextField label={`Width (${u})`} disabled={readOnly} className="num" value={r.width} error={errors[`${i}.width`]} onChange={(e) => set(i, "width", e.target.value)} />
          <TextField
            label={`Height (${u})`}
            disabled={readOnly}
            className="num"
            value={r.height}
            error={errors[`${i}.height`]}
            onChange={(e) => set(i, "height", e.target.value)}
          />
          {!readOnly && (
            <Button variant="quiet" onClick={() => setRows((x) => x.filter((_, j) => j !== i))} aria-label={`Remove ${r.label || "this size"}`}>
              Remove
            </Button>
          )}
        </div>
      ))}
      {!readOnly && (
        <div className="flex gap-2">
          <Button variant="secondary" onClick={() => setRows((x) => [...x, { label: "", width: "", height: "" }])}>
            Add a size
          </Button>
          <Button onClick={submit} disabled={save.isPending}>
            Save sizes
          </Button>
        </div>
      )}
    </SettingsSection>
  );
}

/** The studio's logo, drawn left of the studio's name in the header of every document. Admin only. */
function Logo({ hasLogo, version }: { hasLogo: boolean; version: number }) {
  const upload = useUploadLogo();
  const remove = useRemoveLogo();
  const [input, setInput] = useState(0);
  const error = upload.error?.message ?? remove.error?.message ?? null;
  const busy = upload.isPending || remove.isPending;
  return (
    <SettingsSection title="Logo on documents">
      <p className="text-sm text-graphite">
        Shown beside the studio's name at the top of every document. A PNG or JPEG of at most 2 MB and 4000 × 4000 pixels; it is stored as a PNG 600 pixels wide at most.
      </p>
      {hasLogo ? (
        <img
          src={`/api/settings/logo?v=${version}`}
          alt="The studio's current logo"
          className="h-12 w-auto max-w-xs rounded border border-stone-light bg-white object-contain p-1"
        />
      ) : (
        <p className="text-sm text-graphite">No logo yet: documents show the studio's name only.</p>
      )}
      {error && (
        <Notice tone="fail" title="Logo not changed">
          {error}
        </Notice>
      )}
      <div className="flex flex-wrap items-end gap-3">
        <label className="grid gap-1 text-sm">
          <span className="font-medium">{hasLogo ? "Replace the logo (PNG or JPEG)" : "Upload a logo (PNG or JPEG)"}</span>
          <input
            key={input}
            type="file"
            accept="image/png,image/jpeg"
            disabled={busy}
            onChange={(e) => {
              const file = e.target.files?.[0];
              remove.reset();
              if (file) upload.mutate(file, { onSettled: () => setInput((n) => n + 1) });
            }}
          />
        </label>
        {hasLogo && (
          <Button
            variant="quiet"
            disabled={busy}
            onClick={() => {
              upload.reset();
              remove.mutate();
            }}
          >
            Remove
          </Button>
        )}
      </div>
      {upload.isPending && (
        <p className="text-sm text-graphite" role="status">
          Uploading the logo…
        </p>
      )}
    </SettingsSection>
  );
}

export function Component() {
  const { data: user } = useMe();
  const settings = useSettings();
  if (settings.isPending) return <SkeletonRows />;
  if (settings.isError) return <ErrorNotice error={settings.error} />;
  const readOnly = !can(user, "settings:update");
  return (
    <div className="space-y-5">
      <header>
        <h1 className="text-2xl font-bold tracking-tight">Studio</h1>
        <p className="text-sm text-graphite">{readOnly ? "Only the studio admin can change these settings." : "Settings used on every screen and document."}</p>
      </header>
      <SettingsForm initial={settings.data} readOnly={readOnly} />
      <FramePresets settings={settings.data} readOnly={readOnly} />
      {!readOnly && <Logo hasLogo={settings.data.hasLogo} version={settings.dataUpdatedAt} />}
      <Vocabulary readOnly={!can(user, "terms:manage")} />
      {can(user, "user:manage") && <StudioUsers />}
    </div>
  );
}
