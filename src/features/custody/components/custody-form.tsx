import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { studioToday } from "@/lib/today.ts";
import type { z } from "zod";
import {
  CUSTODY_KINDS,
  CUSTODY_KIND_EFFECT,
  RETURN_DUE_KINDS,
  CUSTODY_KIND_LABELS,
  CustodyCreateSchema,
  type CustodyCreate,
  type CustodyKind,
  type CustodyReceipt,
} from "@shared/schemas/custody.ts";
import type { ObjectStatus } from "@shared/schemas/objects.ts";
import { SelectField, TextAreaField, TextField } from "@/components/ui/field.tsx";
import { EnumOptions } from "@/components/ui/options.tsx";
import { Button, FormActions } from "@/components/ui/button.tsx";
import { Notice } from "@/components/ui/feedback.tsx";
import { useServerErrors } from "@/lib/form-errors.ts";
import { formatDate } from "@/lib/format.ts";
import { useRecordCustody } from "../api/custody.ts";

type Values = z.input<typeof CustodyCreateSchema>;
const FIELDS = ["kind", "date", "fromParty", "toParty", "condition", "signedBy", "location", "returnDue", "notes"] as const satisfies readonly (keyof Values)[];

type Parties = { owner: string; studio: string };

/** Who usually hands over and who receives, for each kind; blank where only the framer knows (the borrower, the conservator). */
function suggestedParties(kind: CustodyKind, p: Parties): { fromParty: string; toParty: string } {
  switch (kind) {
    case "intake":
      return { fromParty: p.owner, toParty: p.studio };
    case "return-to-owner":
      return { fromParty: p.studio, toParty: p.owner };
    case "loan-out":
    case "to-conservator":
      return { fromParty: p.studio, toParty: "" };
    case "loan-return":
    case "from-conservator":
      return { fromParty: "", toParty: p.studio };
  }
}

/** Only the hand-overs that fit where the object is: into the studio when it is elsewhere, out when it is here. */
export function kindsFor(status: ObjectStatus): CustodyKind[] {
  const direction = status === "in-studio" ? "out" : "in";
  return CUSTODY_KINDS.filter((k) => CUSTODY_KIND_EFFECT[k].direction === direction);
}

type Props = {
  objectId: string;
  /** The object's status now: it decides which hand-overs are offered. */
  status: ObjectStatus;
  /** The owner's name, offered as the other party of intakes and returns. */
  ownerName: string;
  /** The studio's name, offered as the studio's side of each hand-over. */
  studioName: string;
};

/**
 * "Record a hand-over": a button that opens the receipt form for one object. The form checks with the
 * shared contract, puts the server's messages beside their fields, and keeps everything typed when saving fails.
 */
export function CustodyForm(props: Props) {
  const [open, setOpen] = useState(false);
  const [saved, setSaved] = useState<CustodyReceipt | null>(null);
  if (!open)
    return (
      <div className="space-y-3">
        {saved && (
          <Notice tone="pass" title="Receipt recorded">
            {CUSTODY_KIND_LABELS[saved.kind]} on {formatDate(saved.date)}: from {saved.fromParty} to {saved.toParty}.
          </Notice>
        )}
        <Button
          variant={saved ? "secondary" : "primary"}
          onClick={() => {
            setSaved(null);
            setOpen(true);
          }}
        >
          {props.status === "in-studio" ? "Record a hand-over out" : "Record a receipt in"}
        </Button>
      </div>
    );
  return (
    <ReceiptForm
      {...props}
      onDone={(r) => {
        setSaved(r);
        setOpen(false);
      }}
      onCancel={() => setOpen(false)}
    />
  );
}

function ReceiptForm({ objectId, status, ownerName, studioName, onDone, onCancel }: Props & { onDone: (r: CustodyReceipt) => void; onCancel: () => void }) {
  const record = useRecordCustody(objectId);
  const kinds = kindsFor(status);
  const parties: Parties = { owner: ownerName, studio: studioName };
  // Each status offers at least one hand-over; "intake" only stands in for the type.
  const first = kinds[0] ?? "intake";
  const form = useForm<Values, unknown, CustodyCreate>({
    resolver: zodResolver(CustodyCreateSchema),
    mode: "onTouched",
    defaultValues: {
      kind: first,
      date: studioToday(),
      ...suggestedParties(first, parties),
      condition: "",
      signedBy: "",
      location: "",
      returnDue: "",
      notes: "",
    },
  });
  // The server's field messages go beside their fields; the values stay as typed.
  const server = useServerErrors(form, { accept: (k) => (FIELDS as readonly string[]).includes(k), focus: true });
  const serverError = server.error;
  const { register, formState, setValue, getFieldState, watch } = form;
  const e = formState.errors;
  const kind = watch("kind") as CustodyKind;
  const inward = CUSTODY_KIND_EFFECT[kind]?.direction === "in";

  const kindField = register("kind", {
    onChange: (ev: { target: { value: string } }) => {
      // Offer the usual parties for the new kind, but never over what the framer has typed.
      const next = suggestedParties(ev.target.value as CustodyKind, parties);
      for (const f of ["fromParty", "toParty"] as const) if (!getFieldState(f).isDirty) setValue(f, next[f]);
      // A return date belongs to a loan or a stay with a conservator: it goes with the field.
      if (!RETURN_DUE_KINDS.includes(ev.target.value as CustodyKind)) setValue("returnDue", "");
    },
  });

  const submit = form.handleSubmit(async (values) => {
    const receipt = await server.run(() => record.mutateAsync(values));
    if (receipt) onDone(receipt);
  });

  return (
    <form onSubmit={submit} noValidate aria-label="Custody receipt" className="space-y-4">
      <Notice tone="warn" title="Handling at the hand-over">
        Heavy frames take two people: carry them upright, one hand under the bottom rail, and never lift a frame by its top rail. Wear gloves for glazed frames and loose glass:
        glass cuts. Look the object over together with the person handing it over before either of you signs.
      </Notice>
      {serverError && (
        <Notice tone="fail" title={serverError.status === 409 ? "Not recorded: the object is not where this receipt says" : "Not recorded"}>
          {serverError.message}
        </Notice>
      )}
      <div className="grid gap-4 md:grid-cols-2">
        <SelectField label="Hand-over" error={e.kind?.message} {...kindField}>
          <EnumOptions values={kinds} labels={CUSTODY_KIND_LABELS} />
        </SelectField>
        <TextField label="Date" type="date" className="num" error={e.date?.message} hint="The day the object changed hands" {...register("date")} />
        <TextField label="From" autoComplete="off" error={e.fromParty?.message} hint="Who handed the object over" {...register("fromParty")} />
        <TextField label="To" autoComplete="off" error={e.toParty?.message} hint="Who received it" {...register("toParty")} />
        <TextField
          label={inward ? "Condition on arrival" : "Condition on departure"}
          wrapClassName="md:col-span-2"
          autoComplete="off"
          error={e.condition?.message}
          hint="One line, as both of you agree it, e.g. “Stable; light foxing in the lower margin; glazing intact.”"
          {...register("condition")}
        />
        <TextField label="Signed by" autoComplete="off" error={e.signedBy?.message} hint="The name of the person who signed the receipt" {...register("signedBy")} />
        <TextField
          label="Location afterwards"
          autoComplete="off"
          error={e.location?.message}
          hint={inward ? "Where it is kept in the studio, e.g. Plan chest B, drawer 2" : "Where it goes, e.g. the owner's home or the venue"}
          {...register("location")}
        />
        {RETURN_DUE_KINDS.includes(kind) ? (
          <TextField
            label="Agreed return date"
            type="date"
            className="num"
            error={e.returnDue?.message}
            hint="The day it is agreed to come back (optional); printed on the receipt"
            {...register("returnDue")}
          />
        ) : null}
        <TextAreaField label="Notes" wrapClassName="md:col-span-2" error={e.notes?.message} hint="Packing, transport, anything agreed at the hand-over" {...register("notes")} />
      </div>
      <FormActions className="flex flex-wrap gap-3" submitting={formState.isSubmitting} label="Record the receipt" busyLabel="Recording…" onCancel={onCancel} />
    </form>
  );
}
