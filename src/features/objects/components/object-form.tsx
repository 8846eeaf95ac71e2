import { useState } from "react";
import { useForm, type FieldErrors, type Resolver } from "react-hook-form";
import {
  OBJECT_STATUSES,
  OBJECT_STATUS_LABELS,
  OBJECT_TYPES,
  OBJECT_TYPE_LABELS,
  PHOTO_PROCESSES,
  PHOTO_PROCESS_LABELS,
  SENSITIVITIES,
  SENSITIVITY_LABELS,
  VALUATION_BASES,
  VALUATION_BASIS_LABELS,
  ObjectCreateSchema,
  type ObjectCreate,
  type ObjectRecord,
} from "@shared/schemas/objects.ts";
import type { ClientRecord } from "@shared/schemas/clients.ts";
import { lengthInputValue, parseLength, type Unit } from "@shared/domain/units.ts";
import { minorDigits, parseMoney } from "@shared/domain/money.ts";
import { issuesToFields } from "@shared/schemas/errors.ts";
import { SelectField, TextAreaField, TextField } from "@/components/ui/field.tsx";
import { FormActions } from "@/components/ui/button.tsx";
import { CheckboxGroup } from "@/components/ui/checkbox-group.tsx";
import { EnumOptions, RecordOptions, byName } from "@/components/ui/options.tsx";
import { Segmented } from "@/components/ui/segmented.tsx";
import { Notice } from "@/components/ui/feedback.tsx";
import { useServerErrors } from "@/lib/form-errors.ts";

const LENGTHS = ["sheetWidthMm", "sheetHeightMm", "borderLeftMm", "borderTopMm", "borderRightMm", "borderBottomMm"] as const;
type LengthKey = (typeof LENGTHS)[number];

/** What the form holds: lengths and money as typed text; the payload is the shared contract. */
export type ObjectFormValues = Omit<Record<keyof ObjectCreate, string>, "sensitivities"> & { sensitivities: string[] };

export function toFormValues(o: Partial<ObjectRecord> | undefined, unit: Unit, defaults: { currency: string }): ObjectFormValues {
  const text = (v: string | null | undefined) => v ?? "";
  const currency = o?.valuationCurrency ?? defaults.currency;
  const digits = minorDigits(currency);
  return {
    objectNumber: text(o?.objectNumber),
    title: text(o?.title),
    maker: text(o?.maker),
    dateMade: text(o?.dateMade),
    objectType: text(o?.objectType) || "print",
    medium: text(o?.medium),
    support: text(o?.support),
    photoProcess: text(o?.photoProcess),
    edition: text(o?.edition),
    inscriptions: text(o?.inscriptions),
    sheetWidthMm: lengthInputValue(o?.sheetWidthMm, unit),
    sheetHeightMm: lengthInputValue(o?.sheetHeightMm, unit),
    borderLeftMm: lengthInputValue(o?.borderLeftMm, unit),
    borderTopMm: lengthInputValue(o?.borderTopMm, unit),
    borderRightMm: lengthInputValue(o?.borderRightMm, unit),
    borderBottomMm: lengthInputValue(o?.borderBottomMm, unit),
    thicknessNotes: text(o?.thicknessNotes),
    sensitivities: o?.sensitivities ?? [],
    clientId: text(o?.clientId),
    status: text(o?.status) || "in-studio",
    location: text(o?.location),
    valuationMinor: o?.valuationMinor != null ? (o.valuationMinor / 10 ** digits).toFixed(digits) : "",
    valuationCurrency: currency,
    valuationDate: text(o?.valuationDate),
    valuationBasis: text(o?.valuationBasis),
    valuer: text(o?.valuer),
  };
}

const LABELS: Partial<Record<keyof ObjectFormValues, string>> = {
  sheetWidthMm: "Sheet width",
  sheetHeightMm: "Sheet height",
  borderLeftMm: "Left border",
  borderTopMm: "Top border",
  borderRightMm: "Right border",
  borderBottomMm: "Bottom border",
};

/** Reads the typed text into the shared contract, then validates it with the shared schema. */
function objectResolver(unit: () => Unit): Resolver<ObjectFormValues, unknown, ObjectCreate> {
  return async (values) => {
    const fieldErrors: Record<string, string> = {};
    const payload: Record<string, unknown> = { ...values };
    for (const key of LENGTHS) {
      const raw = values[key].trim();
      if (raw === "") {
        payload[key] = key.startsWith("sheet") ? undefined : null;
        continue;
      }
      const r = parseLength(raw, unit());
      if (r.ok) payload[key] = r.mm;
      else fieldErrors[key] = `${LABELS[key]}: ${r.message}`;
    }
    for (const key of ["photoProcess", "valuationBasis", "valuationDate"] as const) if (values[key] === "") payload[key] = null;
    if (values.valuationMinor.trim() === "") payload.valuationMinor = null;
    else {
      const minor = parseMoney(values.valuationMinor, values.valuationCurrency || "GBP");
      if (minor === null) fieldErrors.valuationMinor = "Write the insured value as an amount, e.g. 4200 or 4,200.00.";
      else payload.valuationMinor = minor;
    }
    const parsed = ObjectCreateSchema.safeParse(payload);
    const all = { ...(parsed.success ? {} : issuesToFields(parsed.error.issues)), ...fieldErrors };
    if (Object.keys(all).length === 0 && parsed.success) return { values: parsed.data, errors: {} };
    const errors: FieldErrors<ObjectFormValues> = {};
    for (const [k, message] of Object.entries(all)) {
      const [field = k] = k.split(".");
      (errors as Record<string, { type: string; message: string }>)[field] = { type: "validate", message };
    }
    return { values: {}, errors };
  };
}

type Props = {
  initial?: ObjectRecord;
  defaultValues: ObjectFormValues;
  studioUnit: Unit;
  clients: ClientRecord[];
  canEditOwner: boolean;
  showValuation: boolean;
  /** Once recorded, an object's whereabouts change through custody receipts, so they stay in its history. */
  statusLocked?: boolean;
  submitLabel: string;
  onSubmit: (values: ObjectCreate) => Promise<unknown>;
  onCancel: () => void;
};

export function ObjectForm({ defaultValues, studioUnit, clients, canEditOwner, showValuation, statusLocked = false, submitLabel, onSubmit, onCancel }: Props) {
  const [unit, setUnit] = useState<Unit>(studioUnit);
  const form = useForm<ObjectFormValues, unknown, ObjectCreate>({ defaultValues, resolver: objectResolver(() => unit), mode: "onTouched" });
  // Field messages from the server go beside their fields; everything typed stays in the form.
  const server = useServerErrors(form, { accept: (k) => k in defaultValues, focus: true });
  const serverError = server.error;
  const { register, formState, getValues, setValue, watch } = form;
  const e = formState.errors;
  const isPhoto = watch("objectType") === "photograph";

  function switchUnit(next: Unit) {
    if (next === unit) return;
    for (const key of LENGTHS) {
      const raw = getValues(key).trim();
      const r = raw ? parseLength(raw, unit) : null;
      if (r?.ok) setValue(key as LengthKey, lengthInputValue(r.mm, next));
    }
    setUnit(next);
  }

  const submit = form.handleSubmit((values) => server.run(() => onSubmit(values)));

  const lengthHint = unit === "in" ? "Inches: 7 5/8, 7-5/8 or 7.625" : "Millimetres";

  return (
    <form onSubmit={submit} noValidate className="space-y-6">
      {serverError && (
        <Notice tone="fail" title={serverError.status === 409 ? "Not saved: conflict" : "Not saved"}>
          {serverError.message}
        </Notice>
      )}

      <fieldset className="grid gap-4 rounded-card bg-paper-sheet p-5 shadow-card md:grid-cols-2">
        <legend className="sr-only">Identification</legend>
        <h2 className="col-span-full text-base font-semibold">Identification</h2>
        <TextField label="Object number" className="num" error={e.objectNumber?.message} hint="Unique in the studio, e.g. 2026-0042" {...register("objectNumber")} />
        <TextField label="Title" error={e.title?.message} {...register("title")} />
        <TextField label="Maker" error={e.maker?.message} {...register("maker")} />
        <TextField label="Date made" error={e.dateMade?.message} hint="As written, e.g. c. 1890 or 1962" {...register("dateMade")} />
        <SelectField label="Object type" error={e.objectType?.message} {...register("objectType")}>
          <EnumOptions values={OBJECT_TYPES} labels={OBJECT_TYPE_LABELS} />
        </SelectField>
        <SelectField
          label="Photographic process"
          disabled={!isPhoto}
          error={e.photoProcess?.message}
          hint={isPhoto ? undefined : "For photographs only"}
          {...register("photoProcess")}
        >
          <EnumOptions values={PHOTO_PROCESSES} labels={PHOTO_PROCESS_LABELS} blank="—" />
        </SelectField>
        <TextField label="Medium and technique" error={e.medium?.message} {...register("medium")} />
        <TextField label="Support" error={e.support?.message} hint="Paper type, weight if known" {...register("support")} />
        <TextField label="Edition" error={e.edition?.message} {...register("edition")} />
        <TextAreaField label="Inscriptions" error={e.inscriptions?.message} hint="What is written, and where on the object" {...register("inscriptions")} />
      </fieldset>

      <fieldset className="rounded-card bg-paper-sheet p-5 shadow-card">
        <legend className="sr-only">Measurements</legend>
        <div className="mb-4 flex flex-wrap items-center justify-between gap-3">
          <h2 className="text-base font-semibold">Measurements</h2>
          <Segmented label="Unit for this form" options={["mm", "in"] as const} value={unit} onChange={switchUnit} optionLabel={(u) => (u === "mm" ? "mm" : "inches")} />
        </div>
        <div className="grid gap-4 md:grid-cols-2">
          <TextField label={`Sheet width (${unit})`} inputMode="decimal" className="num" error={e.sheetWidthMm?.message} hint={lengthHint} {...register("sheetWidthMm")} />
          <TextField label={`Sheet height (${unit})`} inputMode="decimal" className="num" error={e.sheetHeightMm?.message} hint={lengthHint} {...register("sheetHeightMm")} />
        </div>
        <p className="mt-5 text-sm font-medium text-ink-soft">Image area: the border of the sheet around the image on each side (leave empty when the image runs to the edge)</p>
        <div className="mt-2 grid grid-cols-2 gap-4 md:grid-cols-4">
          <TextField label={`Left (${unit})`} inputMode="decimal" className="num" error={e.borderLeftMm?.message} {...register("borderLeftMm")} />
          <TextField label={`Top (${unit})`} inputMode="decimal" className="num" error={e.borderTopMm?.message} {...register("borderTopMm")} />
          <TextField label={`Right (${unit})`} inputMode="decimal" className="num" error={e.borderRightMm?.message} {...register("borderRightMm")} />
          <TextField label={`Bottom (${unit})`} inputMode="decimal" className="num" error={e.borderBottomMm?.message} {...register("borderBottomMm")} />
        </div>
        <TextAreaField label="Thickness and flatness" wrapClassName="mt-4" error={e.thicknessNotes?.message} {...register("thicknessNotes")} />
        <CheckboxGroup legend="Sensitivities" className="mt-4" values={SENSITIVITIES} labels={SENSITIVITY_LABELS} field={register("sensitivities")} />
      </fieldset>

      <fieldset className="grid gap-4 rounded-card bg-paper-sheet p-5 shadow-card md:grid-cols-3">
        <legend className="sr-only">Owner and whereabouts</legend>
        <h2 className="col-span-full text-base font-semibold">Owner and whereabouts</h2>
        <SelectField label="Owner" disabled={!canEditOwner} error={e.clientId?.message} {...register("clientId")}>
          <option value="">Choose the owner…</option>
          <RecordOptions items={clients} text={byName} />
        </SelectField>
        <SelectField
          label="Status"
          disabled={statusLocked}
          hint={statusLocked ? "Changes with each custody receipt (the object's Custody section)." : undefined}
          error={e.status?.message}
          {...register("status")}
        >
          <EnumOptions values={OBJECT_STATUSES} labels={OBJECT_STATUS_LABELS} />
        </SelectField>
        <TextField label="Current location" error={e.location?.message} {...register("location")} />
      </fieldset>

      {showValuation && (
        <fieldset className="grid gap-4 rounded-card bg-paper-sheet p-5 shadow-card md:grid-cols-3">
          <legend className="sr-only">Valuation</legend>
          <div className="col-span-full">
            <h2 className="text-base font-semibold">Valuation</h2>
            <p className="text-xs text-graphite">Confidential: seen only by the studio and the owner.</p>
          </div>
          <TextField label="Insured value" inputMode="decimal" className="num" error={e.valuationMinor?.message} {...register("valuationMinor")} />
          <TextField label="Currency" maxLength={3} className="uppercase" error={e.valuationCurrency?.message} hint="ISO 4217, e.g. GBP" {...register("valuationCurrency")} />
          <TextField label="Valuation date" type="date" error={e.valuationDate?.message} {...register("valuationDate")} />
          <SelectField label="Basis" error={e.valuationBasis?.message} {...register("valuationBasis")}>
            <EnumOptions values={VALUATION_BASES} labels={VALUATION_BASIS_LABELS} blank="—" />
          </SelectField>
          <TextField label="Valuer" wrapClassName="md:col-span-2" error={e.valuer?.message} {...register("valuer")} />
        </fieldset>
      )}

      <FormActions submitting={formState.isSubmitting} label={submitLabel} onCancel={onCancel} />
    </form>
  );
}
