import { View } from "@react-pdf/renderer";
import { Text } from "../../lib/pdf/text.tsx";
import { format, parseISO } from "date-fns";
import { CUSTODY_KIND_LABELS, type CustodyKind } from "../../../shared/schemas/custody.ts";
import { GLAZING_TYPE_LABELS } from "../../../shared/schemas/mountings.ts";
import { HEAVY_PACKAGE_KG } from "../../../shared/domain/mount-plan/constants.ts";
import { DocShell, type DocMeta } from "../../lib/pdf/layout.tsx";
import { GRAPHITE, INK, STONE, s } from "../../lib/pdf/theme.ts";
import type { ReactNode } from "react";
import type { Db } from "../../db/client.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import { RETURN_DUE_KINDS } from "../../../shared/schemas/custody.ts";
import { formatSize } from "../../../shared/domain/units.ts";
import { can } from "../../../shared/permissions.ts";
import { notFound } from "../../lib/errors.ts";
import { assertCan } from "../../middleware/require-permission.ts";
import { findReceipt } from "../custody/custody.repo.ts";
import { findObject } from "../objects/objects.repo.ts";
import { mountingInPlaceOn } from "../mountings/mountings.repo.ts";
import { getSettings } from "../settings/settings.repo.ts";
import { valuationText } from "./record-blocks.tsx";
import { aboutObject, createDocumentsService } from "./documents.service.ts";
import { mountingDetail } from "../mountings/mounting-detail.ts";

// A unitless lineHeight in react-pdf 4 multiplies the font size set on the same style (18 when inherited), so both are given here.
const P = { fontSize: 9, lineHeight: 1.4, marginBottom: 4 } as const;

function Field({ label, children }: { label: string; children: ReactNode }) {
  if (children === null || children === undefined || children === "") return null;
  return (
    <View style={{ flexDirection: "row", borderBottomWidth: 0.5, borderBottomColor: STONE, paddingVertical: 3 }} wrap={false}>
      <Text style={{ width: 130, fontSize: 9, color: GRAPHITE }}>{label}</Text>
      <Text style={{ flex: 1, fontSize: 9, lineHeight: 1.35 }}>{children}</Text>
    </View>
  );
}
import type { ReceiptRow } from "../custody/custody.repo.ts";

export type CustodyDocData = {
  receipt: ReceiptRow;
  object: { objectNumber: string; title: string; maker: string | null; dimensions: string; clientName: string };
  /** From the mounting in place on the day, when there is one. */
  glazing: string | null;
  /** The insured value as it stands, for a loan ("value in transit"); null when not a loan or not to be shown. */
  valueInTransit: string | null;
  glass: boolean;
  weightKg: number | null;
};

const day = (iso: string) => {
  try {
    return format(parseISO(iso), "d MMMM yyyy");
  } catch {
    return iso;
  }
};

/** The handling cautions that apply to this object, placed on the receipt where the hand-over happens (docs/trade.md §12). */
export function handlingCautions(d: Pick<CustodyDocData, "glass" | "weightKg">): { title: string; text: string }[] {
  const out: { title: string; text: string }[] = [];
  if (d.glass)
    out.push({
      title: "Glazed with glass",
      text: "Glass cuts if it breaks. Carry the frame upright with the glass towards you and never stack frames glass to glass. If the glass breaks, lay the frame flat, glass up, and leave it so: do not lift pieces off the work or try to clean it, as the edges can cut both you and the object. Call the framer or a conservator. If loose pieces must be swept up away from the work, wear cut-resistant gloves and eye protection and put them in a sharps container.",
    });
  if (d.weightKg != null && d.weightKg >= HEAVY_PACKAGE_KG)
    out.push({
      title: `Heavy frame (about ${Math.round(d.weightKg)} kg)`,
      text: "Lift and carry it with two people, one at each side, holding the sides of the frame. Never lift it by the top rail, the hanging wire or the hardware.",
    });
  return out;
}

function SignatureLine({ role, name }: { role: string; name: string }) {
  return (
    <View style={{ flex: 1 }} wrap={false}>
      <View style={{ height: 38, borderBottomWidth: 0.75, borderBottomColor: INK }} />
      <Text style={[s.small, { marginTop: 3 }]}>{role}</Text>
      <Text style={{ fontSize: 9, marginTop: 1 }}>{name}</Text>
      <Text style={[s.small, { marginTop: 10 }]}>Date</Text>
      <View style={{ height: 14, borderBottomWidth: 0.5, borderBottomColor: GRAPHITE, width: 120 }} />
    </View>
  );
}

export function CustodyReceiptDocument({ meta, data }: { meta: DocMeta; data: CustodyDocData }) {
  const r = data.receipt;
  const kind = CUSTODY_KIND_LABELS[r.kind as CustodyKind] ?? r.kind;
  const cautions = handlingCautions(data);
  return (
    <DocShell meta={meta}>
      <Text style={s.h1}>Custody receipt: {kind.toLowerCase()}</Text>
      <Text style={P}>
        {r.direction === "in" ? "The object below came into the studio's care" : "The object below left the studio's care"} on {day(r.date)}, as recorded in Reversa.
      </Text>

      <Text style={s.h2}>Object</Text>
      <Field label="Object number">{data.object.objectNumber}</Field>
      <Field label="Title">{data.object.title}</Field>
      <Field label="Maker">{data.object.maker}</Field>
      <Field label="Sheet size">{data.object.dimensions}</Field>
      <Field label="Owner">{data.object.clientName}</Field>
      <Field label="Glazing">{data.glazing}</Field>

      <Text style={s.h2}>Hand-over</Text>
      <Field label="Kind">{kind}</Field>
      <Field label="Date">{day(r.date)}</Field>
      <Field label="From">{r.fromParty}</Field>
      <Field label="To">{r.toParty}</Field>
      <Field label="Location">{r.location}</Field>
      {r.returnDue ? <Field label="Agreed return">{day(r.returnDue)}</Field> : null}
      {data.valueInTransit ? <Field label="Value in transit">{data.valueInTransit}</Field> : null}
      <Field label="Condition on hand-over">{r.condition}</Field>
      <Field label="Signed by">{r.signedBy}</Field>
      <Field label="Notes">{r.notes}</Field>

      <Text style={s.h2}>Handling</Text>
      {cautions.map((c) => (
        <View key={c.title} style={s.caution} wrap={false}>
          <Text style={{ fontWeight: 700, marginBottom: 2 }}>Caution · {c.title}</Text>
          <Text style={{ fontSize: 9, lineHeight: 1.35 }}>{c.text}</Text>
        </View>
      ))}
      <Text style={[P, { color: GRAPHITE }]}>
        Handle the object with clean, dry hands or nitrile gloves, keep it flat or upright as packed, and do not open the frame or the package. The condition above is an
        observation on hand-over, not a treatment: refer any treatment to a qualified conservator.
      </Text>

      <Text style={s.h2}>Signatures</Text>
      <Text style={[s.small, { marginBottom: 4 }]}>Both parties sign to confirm the hand-over and the condition stated above.</Text>
      <View style={{ flexDirection: "row", gap: 36 }} wrap={false}>
        <SignatureLine role="Handed over by" name={r.fromParty} />
        <SignatureLine role="Received by" name={r.toParty} />
      </View>
    </DocShell>
  );
}

export { GLAZING_TYPE_LABELS };

/**
 * Issues the custody receipt of one hand-over. It reads the mount in place on the receipt's day, not
 * today's; a loan shows its value in transit to those who may read valuations. 404 for a receipt the user may not read.
 */
export async function issueCustodyReceipt(db: Db, clock: () => Date, uploadsDir: string | undefined, user: SessionUser, receiptId: string, opts: { inHistory?: boolean } = {}) {
  const receipt = findReceipt(db, receiptId);
  const object = receipt ? findObject(db, receipt.objectId) : null;
  if (!receipt || !object) throw notFound("That receipt");
  assertCan(user, "custody:read", { clientId: object.clientId }, { readAction: "custody:read", what: "That receipt" });
  const m = mountingInPlaceOn(db, object.id, receipt.date);
  const detail = m ? mountingDetail(db, m) : null;
  const g = detail?.result.ok ? detail.result.geometry : null;
  const glazingType = detail?.data.glazing.type ?? null;
  const data = {
    receipt,
    object: {
      objectNumber: object.objectNumber,
      title: object.title,
      maker: object.maker,
      dimensions: formatSize(object.sheetWidthMm, object.sheetHeightMm, getSettings(db).unit),
      clientName: object.clientName,
    },
    glazing: glazingType ? (GLAZING_TYPE_LABELS[glazingType] ?? glazingType) : null,
    glass: g ? g.glazing.material === "glass" : !!glazingType && glazingType.includes("glass"),
    weightKg: g?.package.weightKg ?? null,
    valueInTransit: RETURN_DUE_KINDS.includes(receipt.kind as CustodyKind) && can(user, "valuation:read", { clientId: object.clientId }) ? valuationText(object) : null,
  };
  return createDocumentsService(db, clock, uploadsDir).issue({
    kind: "custody-receipt",
    title: `Custody receipt — ${object.objectNumber}, ${receipt.date}`,
    user,
    ...aboutObject(object),
    inHistory: opts.inHistory,
    render: (meta) => <CustodyReceiptDocument meta={meta} data={data} />,
  });
}
