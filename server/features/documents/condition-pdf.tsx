import { View } from "@react-pdf/renderer";
import { Text } from "../../lib/pdf/text.tsx";
import type { Db } from "../../db/client.ts";
import type { Config } from "../../lib/config.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import { can } from "../../../shared/permissions.ts";
import { CONDITION_CONTEXT_LABELS, RATING_LABELS, SEVERITY_LABELS, type ConditionReport } from "../../../shared/schemas/condition.ts";
import { compareFindings } from "../../../shared/domain/condition.ts";
import { formatSize } from "../../../shared/domain/units.ts";
import { conflict } from "../../lib/errors.ts";
import { DocShell } from "../../lib/pdf/layout.tsx";
import { GRAPHITE, INK, s } from "../../lib/pdf/theme.ts";
import { getSettings } from "../settings/settings.repo.ts";
import { createObjectsService } from "../objects/objects.service.ts";
import { createConditionService } from "../condition/condition.service.ts";
import { findPhoto } from "../photos/photos.repo.ts";
import { aboutObject, createDocumentsService } from "./documents.service.ts";
import { and, desc, eq, isNotNull, lte } from "drizzle-orm";
import { custodyReceipts } from "../../db/schema.ts";
import { mountingInPlaceOn } from "../mountings/mountings.repo.ts";
import { summaryOf } from "./workshop-sheet.tsx";
import { mountingDetail } from "../mountings/mounting-detail.ts";
import { Caution, ComparisonTag, KV, RatingTag, Table, para } from "../../lib/pdf/blocks.tsx";
import { FindingsTable, type LoadedPhoto, PhotoGrid, loadPhoto, valuationLine } from "./record-blocks.tsx";

/** The sentence every condition document carries (docs/trade.md §12). */
export const NOT_TREATMENT = "Condition notes are observations, not conservation treatment; refer treatment to a qualified conservator.";

// ── The condition report for an insurer ───────────────────────────────────────

function previousSigned(all: ConditionReport[], r: ConditionReport): ConditionReport | null {
  const key = (x: ConditionReport) => `${x.reportDate}|${x.signedAt ?? ""}`;
  return all.filter((x) => x.id !== r.id && x.status === "signed" && key(x) < key(r)).sort((a, b) => (key(a) < key(b) ? 1 : -1))[0] ?? null;
}

export async function issueConditionReport(db: Db, config: Pick<Config, "uploadsDir">, clock: () => Date, user: SessionUser, reportId: string, opts: { inHistory?: boolean } = {}) {
  const conditions = createConditionService(db, clock);
  // get() answers 404 for reports the user may not see (collectors: drafts) and for other clients' reports.
  const report = conditions.get(user, reportId);
  if (report.status !== "signed") throw conflict("Sign the report before issuing it as a document: a draft can still change.");
  const object = createObjectsService(db).get(user, report.objectId);
  const showValue = can(user, "valuation:read", { clientId: object.clientId });
  const settings = getSettings(db);
  const data = report.current.data;
  const photos = data.photoIds
    .map((id) => findPhoto(db, id))
    .filter((p): p is NonNullable<typeof p> => !!p && p.objectId === object.id)
    .slice(0, 8)
    .map((p) => loadPhoto(config, p))
    .filter((p): p is LoadedPhoto => !!p);
  const photoNumber = (id: string) => {
    const i = photos.findIndex((p) => p.row.id === id);
    return i < 0 ? null : i + 1;
  };
  const prev = previousSigned(conditions.listForObject(user, object.id), report);
  const compared = prev ? compareFindings(prev.current.data, data) : null;
  const value = showValue ? valuationLine(object) : null;
  const sig = data.signatures;
  // The object as it was on the day of examination: the mount in place then, and where the custody record put it.
  const inPlace = mountingInPlaceOn(db, object.id, report.reportDate);
  const inPlaceDetail = inPlace ? mountingDetail(db, inPlace) : null;
  const framed = inPlace
    ? `In its ${settings.vocabulary === "mat" ? "mat" : "mount"}${inPlaceDetail && inPlaceDetail.data.glazing.type !== "none" ? " and glazed frame" : ""}: ${(inPlaceDetail && summaryOf(inPlaceDetail, settings.vocabulary)) ?? "see the mounting record"} (mounted ${inPlace.mountedOn})`
    : "Unframed: no mounting recorded in place on that day";
  const custodyThen = db
    .select({ location: custodyReceipts.location, date: custodyReceipts.date })
    .from(custodyReceipts)
    .where(and(eq(custodyReceipts.objectId, object.id), lte(custodyReceipts.date, report.reportDate), isNotNull(custodyReceipts.location)))
    .orderBy(desc(custodyReceipts.date), desc(custodyReceipts.createdAt))
    .get();
  const locationThen = custodyThen?.location
    ? `${custodyThen.location} (custody record of ${custodyThen.date})`
    : object.location
      ? `${object.location} (as recorded now; no custody record gives the place on that day)`
      : null;

  return createDocumentsService(db, clock, config.uploadsDir).issue({
    kind: "condition-report",
    title: `Condition report ${object.objectNumber}, ${report.reportDate}`,
    user,
    inHistory: opts.inHistory,
    ...aboutObject(object),
    render: (meta) => (
      <DocShell meta={meta}>
        <Text style={s.h1}>{object.title}</Text>
        <Text style={[s.small, { marginBottom: 8 }]}>
          {[object.objectNumber, object.maker, object.dateMade, formatSize(object.sheetWidthMm, object.sheetHeightMm, settings.unit, { denominator: 16 })]
            .filter(Boolean)
            .join(" · ")}
        </Text>

        <Text style={s.h2}>Report</Text>
        <KV label="Object number">{object.objectNumber}</KV>
        <KV label="Owner">{object.clientName}</KV>
        <KV label="Context">{CONDITION_CONTEXT_LABELS[report.context]}</KV>
        <KV label="Date of examination">{report.reportDate}</KV>
        <KV label="Examiner">{report.examinerName}</KV>
        <KV label="Overall rating">
          <RatingTag rating={report.rating} />
        </KV>
        <KV label="Medium">{object.medium}</KV>
        <KV label="Support">{object.support}</KV>
        <KV label="Framed or unframed">{framed}</KV>
        <KV label="Location at examination">{locationThen}</KV>
        {value ? <KV label="Insured value">{value}</KV> : null}
        <KV label="Summary">{data.summary}</KV>

        {report.cautions.length > 0 ? (
          <>
            <Text style={s.h2}>Handling cautions</Text>
            {report.cautions.map((c, i) => (
              <Caution key={i}>{c}</Caution>
            ))}
          </>
        ) : null}

        <Text style={s.h2}>Findings</Text>
        <FindingsTable data={data} photoNumber={photoNumber} />

        {photos.length > 0 ? (
          <>
            <Text style={s.h2}>Photographs, with the findings' markers</Text>
            <PhotoGrid photos={photos} data={data} columnWidth={250} />
          </>
        ) : null}

        <Text style={s.h2}>Compared with the previous report</Text>
        {compared && prev ? (
          <>
            <Text style={para}>
              Previous signed report: {prev.reportDate}, {CONDITION_CONTEXT_LABELS[prev.context].toLowerCase()}, examined by {prev.examinerName}; rated{" "}
              {RATING_LABELS[prev.rating].toLowerCase()}, now {RATING_LABELS[report.rating].toLowerCase()}.
            </Text>
            <Table
              empty="Neither report records a finding."
              cols={[
                { label: "Finding", flex: 1.3 },
                { label: "Status", width: 80 },
                { label: "Before", flex: 1 },
                { label: "Now", flex: 1 },
              ]}
              rows={compared.map((c) => [
                (c.after ?? c.before)!.term,
                <ComparisonTag key="status" status={c.status} />,
                c.before ? `${SEVERITY_LABELS[c.before.severity]}${c.before.extent ? `, ${c.before.extent}` : ""}` : "—",
                c.after ? `${SEVERITY_LABELS[c.after.severity]}${c.after.extent ? `, ${c.after.extent}` : ""}${c.after.resolved ? ", resolved" : ""}` : "—",
              ])}
            />
          </>
        ) : (
          <Text style={para}>This is the first signed condition report of this object in Reversa.</Text>
        )}

        {data.recommendations.display || data.recommendations.handling || data.recommendations.environment || data.recommendations.referral || data.lightNotes ? (
          <>
            <Text style={s.h2}>Recommendations</Text>
            <KV label="Display">{data.recommendations.display}</KV>
            <KV label="Handling">{data.recommendations.handling}</KV>
            <KV label="Environment">{data.recommendations.environment}</KV>
            <KV label="Light">{data.lightNotes}</KV>
            <KV label="Referral">{data.recommendations.referral}</KV>
          </>
        ) : null}

        {/* The signatures keep their heading and the closing note with them: one block that never splits. */}
        <View wrap={false}>
          <Text style={s.h2}>Signatures</Text>
          <View style={{ flexDirection: "row", gap: 16 }}>
            {[{ label: "Examiner", v: sig.examiner }, ...(sig.otherParty ? [{ label: "Other party", v: sig.otherParty }] : [])].map((x) => (
              <View key={x.label} style={{ flex: 1, borderTopWidth: 0.75, borderTopColor: INK, paddingTop: 4, marginTop: 14 }}>
                <Text style={s.small}>{x.label}</Text>
                <Text style={{ fontWeight: 600 }}>{x.v?.name ?? "—"}</Text>
                <Text style={s.small}>{[x.v?.role, x.v?.date && `signed ${x.v.date}`].filter(Boolean).join(" · ")}</Text>
              </View>
            ))}
          </View>

          <Text style={[para, { marginTop: 14, color: GRAPHITE }]}>{NOT_TREATMENT}</Text>
        </View>
      </DocShell>
    ),
  });
}
