import fs from "node:fs";
import type { ReactNode } from "react";
import { Image, Path, Polygon, Svg, View } from "@react-pdf/renderer";
import { Text } from "../../lib/pdf/text.tsx";
import type { Styles } from "@react-pdf/renderer";

type Style = Styles[string];
import type { Db } from "../../db/client.ts";
import type { Config } from "../../lib/config.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import { can } from "../../../shared/permissions.ts";
import { CONDITION_CONTEXT_LABELS, RATING_LABELS, SEVERITY_LABELS, ZONE_LABELS, type ConditionData, type ConditionReport, type Finding, type Rating } from "../../../shared/schemas/condition.ts";
import type { ObjectRecord } from "../../../shared/schemas/objects.ts";
import type { Verdict } from "../../../shared/schemas/mount-plan.ts";
import { compareFindings, type ComparisonStatus } from "../../../shared/domain/condition.ts";
import { formatMoney } from "../../../shared/domain/money.ts";
import { formatSize } from "../../../shared/domain/units.ts";
import { VALUATION_BASIS_LABELS } from "../../../shared/schemas/objects.ts";
import { conflict } from "../../lib/errors.ts";
import { createStorage } from "../../lib/storage.ts";
import { DocShell } from "../../lib/pdf/layout.tsx";
import { ACCENT, FAIL, GRAPHITE, INK, PASS, STONE, WARN, s } from "../../lib/pdf/theme.ts";
import { getSettings } from "../settings/settings.repo.ts";
import { createObjectsService } from "../objects/objects.service.ts";
import { createConditionService } from "../condition/condition.service.ts";
import { findPhoto, type PhotoRow } from "../photos/photos.repo.ts";
import { createDocumentsService } from "./documents.service.ts";
import { and, desc, eq, isNotNull, lte } from "drizzle-orm";
import { custodyReceipts } from "../../db/schema.ts";
import { mountingInPlaceOn } from "../mountings/mountings.repo.ts";
import { mountingDetail, summaryOf } from "./workshop-sheet.tsx";

/** The sentence every condition document carries (docs/trade-reference.md §12). */
export const NOT_TREATMENT = "Condition notes are observations, not conservation treatment; refer treatment to a qualified conservator.";

export const COMPARISON_WORDS: Record<ComparisonStatus, string> = {
  new: "New",
  unchanged: "Unchanged",
  worsened: "Worsened",
  improved: "Improved",
  "no-longer-seen": "No longer seen",
};

// ── Pieces shared with the dossier ───────────────────────────────────────────

export const t = {
  table: { borderTopWidth: 0.75, borderTopColor: INK, marginTop: 2 },
  th: { flexDirection: "row" as const, borderBottomWidth: 0.75, borderBottomColor: INK, paddingVertical: 3, color: GRAPHITE, fontSize: 7.5, fontWeight: 600 },
  tr: { flexDirection: "row" as const, borderBottomWidth: 0.5, borderBottomColor: STONE, paddingVertical: 3 },
  cell: { paddingRight: 6 },
};

/**
 * Paragraphs and label–value rows without a lineHeight: with Libre Franklin, react-pdf 4 spaces lines
 * set with one about twice as far apart as asked, while the font's own line spacing reads well.
 */
export const para = { marginBottom: 4 };

/**
 * Text that may hold line breaks, one <Text> a line: react-pdf 4 sets a "\n" inside a text run in its
 * default font (Helvetica, not embedded), so typed notes are split here.
 */
export function Lines({ text, style }: { text: string; style?: Style }) {
  const lines = text.split(/\r?\n/);
  if (lines.length === 1) return <Text style={style}>{text}</Text>;
  return (
    <View style={style}>
      {lines.map((l, i) => (
        <Text key={i}>{l === "" ? " " : l}</Text>
      ))}
    </View>
  );
}

export function KV({ label, children, labelWidth = 130 }: { label: string; children: ReactNode; labelWidth?: number }) {
  if (children === null || children === undefined || children === "" || children === false || children === 0) return null;
  return (
    <View style={{ flexDirection: "row", borderBottomWidth: 0.5, borderBottomColor: STONE, paddingVertical: 2.5 }} wrap={false}>
      <Text style={{ width: labelWidth, color: GRAPHITE, paddingRight: 6 }}>{label}</Text>
      {typeof children === "string" ? <Lines text={children} style={{ flex: 1 }} /> : typeof children === "number" ? <Text style={{ flex: 1 }}>{children}</Text> : <View style={{ flex: 1 }}>{children}</View>}
    </View>
  );
}

/** A simple table: column widths in points or flex weights. */
export function Table({ cols, rows }: { cols: { label: string; width?: number; flex?: number; align?: "left" | "right" }[]; rows: ReactNode[][] }) {
  const style = (i: number) => ({ ...t.cell, ...(cols[i].width ? { width: cols[i].width } : { flex: cols[i].flex ?? 1 }), textAlign: cols[i].align ?? "left" }) as Style;
  return (
    <>
      {/* A table never starts in the last lines of a page: its header and first rows go over together. */}
      <View minPresenceAhead={48} />
      <View style={t.table}>
      <View style={t.th} fixed wrap={false}>
        {cols.map((c, i) => (
          <Text key={i} style={style(i)}>
            {c.label}
          </Text>
        ))}
      </View>
      {rows.map((r, ri) => (
        <View key={ri} style={t.tr} wrap={false}>
          {r.map((cell, ci) =>
            typeof cell === "string" ? (
              <Lines key={ci} text={cell} style={style(ci)} />
            ) : typeof cell === "number" || cell === null || cell === undefined ? (
              <Text key={ci} style={style(ci)}>
                {cell === null || cell === undefined ? " " : String(cell)}
              </Text>
            ) : (
              <View key={ci} style={style(ci)}>
                {cell}
              </View>
            ),
          )}
        </View>
      ))}
      </View>
    </>
  );
}

const TONE: Record<Verdict, string> = { pass: PASS, warn: WARN, fail: FAIL };
export const VERDICT_WORDS: Record<Verdict, string> = { pass: "Pass", warn: "Caution", fail: "Fail" };

/** The verdict's mark (✓ ▲ ✕) drawn as a shape: the font has no such glyphs. */
export function Mark({ verdict, size = 8 }: { verdict: Verdict; size?: number }) {
  const c = TONE[verdict];
  return (
    <Svg width={size} height={size} viewBox="0 0 10 10">
      {verdict === "pass" ? <Path d="M1.5 5.5 L4 8 L8.5 2" stroke={c} strokeWidth={1.6} fill="none" /> : null}
      {verdict === "warn" ? <Polygon points="5,1 9.5,9 0.5,9" fill={c} /> : null}
      {verdict === "fail" ? <Path d="M2 2 L8 8 M8 2 L2 8" stroke={c} strokeWidth={1.6} fill="none" /> : null}
    </Svg>
  );
}

/** A verdict as a word and a mark, in its tone. */
export function VerdictTag({ verdict }: { verdict: Verdict }) {
  return (
    <View style={{ flexDirection: "row", alignItems: "center" }}>
      <Mark verdict={verdict} />
      <Text style={{ marginLeft: 3, color: TONE[verdict], fontWeight: 600 }}>{VERDICT_WORDS[verdict]}</Text>
    </View>
  );
}

const COMPARISON_VERDICT: Partial<Record<ComparisonStatus, Verdict>> = { worsened: "fail", new: "warn", improved: "pass" };
/** A comparison status in words, with a mark where it is a change for the worse or the better. */
export function ComparisonTag({ status }: { status: ComparisonStatus }) {
  const v = COMPARISON_VERDICT[status];
  return (
    <View style={{ flexDirection: "row", alignItems: "center" }}>
      {v ? <Mark verdict={v} /> : null}
      <Text style={{ marginLeft: v ? 3 : 0, color: v ? TONE[v] : INK, fontWeight: v ? 600 : 400 }}>{COMPARISON_WORDS[status]}</Text>
    </View>
  );
}

const RATING_VERDICT: Record<Rating, Verdict> = { good: "pass", fair: "warn", poor: "fail", unstable: "fail" };
export function RatingTag({ rating }: { rating: Rating }) {
  const v = RATING_VERDICT[rating];
  return (
    <View style={{ flexDirection: "row", alignItems: "center" }}>
      <Mark verdict={v} />
      <Text style={{ marginLeft: 3, color: TONE[v], fontWeight: 600 }}>{RATING_LABELS[rating]}</Text>
    </View>
  );
}

export type LoadedPhoto = { row: PhotoRow; data: Buffer; format: "jpg" | "png" };

/** Reads a photo's web version from the uploads folder; a missing or unreadable file leaves the photo out. */
export function loadPhoto(config: Pick<Config, "uploadsDir">, row: PhotoRow): LoadedPhoto | null {
  const ext = row.webKey.split(".").pop()?.toLowerCase();
  const format = ext === "png" ? "png" : ext === "jpg" || ext === "jpeg" ? "jpg" : null;
  if (!format) return null;
  try {
    return { row, data: fs.readFileSync(createStorage(config.uploadsDir).path(row.webKey)), format };
  } catch {
    return null;
  }
}

/** A photo with the numbered markers of the findings placed on it. */
export function MarkedPhoto({ photo, markers, width, maxHeight }: { photo: LoadedPhoto; markers: { n: number; x: number; y: number }[]; width: number; maxHeight?: number }) {
  let w = width;
  let h = (width * photo.row.height) / photo.row.width;
  if (maxHeight && h > maxHeight) {
    w = (w * maxHeight) / h;
    h = maxHeight;
  }
  const d = 14;
  return (
    <View style={{ position: "relative", width: w, height: h, borderWidth: 0.5, borderColor: STONE }}>
      <Image src={{ data: photo.data, format: photo.format }} style={{ width: w, height: h }} />
      {markers.map((m) => (
        <View key={m.n} style={{ position: "absolute", left: m.x * w - d / 2, top: m.y * h - d / 2, width: d, height: d, borderRadius: d / 2, backgroundColor: ACCENT, borderWidth: 1.2, borderColor: "#ffffff", justifyContent: "center", alignItems: "center" }}>
          <Text style={{ color: "#ffffff", fontSize: 7, fontWeight: 700, textAlign: "center" }}>{String(m.n)}</Text>
        </View>
      ))}
    </View>
  );
}

export function whereWords(f: Finding, photoNumber: (photoId: string) => number | null): string {
  if (f.location.kind === "zone") return ZONE_LABELS[f.location.zone];
  const n = photoNumber(f.location.photoId);
  return n ? `Marked on photo ${n}` : "Marked on a photo";
}

/** Findings numbered 1…n in the report's order, the numbers used by the markers. */
export function FindingsTable({ data, photoNumber }: { data: ConditionData; photoNumber: (photoId: string) => number | null }) {
  if (data.findings.length === 0) return <Text style={para}>No findings were recorded.</Text>;
  return (
    <Table
      cols={[{ label: "No.", width: 24 }, { label: "Finding", flex: 1.2 }, { label: "Where", flex: 1.2 }, { label: "Extent", flex: 1 }, { label: "Severity", width: 60 }, { label: "Notes", flex: 2 }]}
      rows={data.findings.map((f, i) => [String(i + 1), f.term + (f.resolved ? " (resolved)" : ""), whereWords(f, photoNumber), f.extent ?? "", SEVERITY_LABELS[f.severity], f.notes ?? ""])}
    />
  );
}

/** The photos of a report with their markers, two to a row. */
export function PhotoGrid({ photos, data, columnWidth }: { photos: LoadedPhoto[]; data: ConditionData; columnWidth: number }) {
  return (
    <View style={{ flexDirection: "row", flexWrap: "wrap", justifyContent: "space-between" }}>
      {photos.map((p, i) => {
        const markers = data.findings.flatMap((f, fi) => (f.location.kind === "marker" && f.location.photoId === p.row.id ? [{ n: fi + 1, x: f.location.x, y: f.location.y }] : []));
        return (
          <View key={p.row.id} style={{ width: columnWidth, marginBottom: 10 }} wrap={false}>
            <MarkedPhoto photo={p} markers={markers} width={columnWidth} maxHeight={260} />
            <Text style={[s.small, { marginTop: 3 }]}>
              Photo {i + 1}
              {p.row.caption ? ` · ${p.row.caption}` : ""}
              {p.row.takenAt ? ` · taken ${p.row.takenAt.slice(0, 10)}` : ""}
              {markers.length ? ` · markers ${markers.map((m) => m.n).join(", ")}` : ""}
            </Text>
          </View>
        );
      })}
    </View>
  );
}

export function valuationLine(o: ObjectRecord): string | null {
  return o.valuationVisible ? valuationText(o) : null;
}

/** A recorded valuation in words: amount, basis, date and valuer; null when none is recorded. The caller decides who may see it. */
export function valuationText(o: Pick<ObjectRecord, "valuationMinor" | "valuationCurrency" | "valuationDate" | "valuer"> & { valuationBasis: string | null }): string | null {
  if (o.valuationMinor === null || !o.valuationCurrency) return null;
  const basis = o.valuationBasis ? ` (${((VALUATION_BASIS_LABELS as Record<string, string>)[o.valuationBasis] ?? o.valuationBasis).toLowerCase()})` : "";
  return `${formatMoney(o.valuationMinor, o.valuationCurrency)}${basis}${o.valuationDate ? `, valued ${o.valuationDate}` : ""}${o.valuer ? ` by ${o.valuer}` : ""}`;
}

export function Caution({ children }: { children: ReactNode }) {
  return (
    <View style={s.caution} wrap={false}>
      {typeof children === "string" ? <Lines text={children} /> : <Text>{children}</Text>}
    </View>
  );
}

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
  const locationThen = custodyThen?.location ? `${custodyThen.location} (custody record of ${custodyThen.date})` : object.location ? `${object.location} (as recorded now; no custody record gives the place on that day)` : null;

  return createDocumentsService(db, clock, config.uploadsDir).issue({
    kind: "condition-report",
    title: `Condition report ${object.objectNumber}, ${report.reportDate}`,
    user,
    inHistory: opts.inHistory,
    objectId: object.id,
    objectNumber: object.objectNumber,
    clientId: object.clientId,
    render: (meta) => (
      <DocShell meta={meta}>
        <Text style={s.h1}>{object.title}</Text>
        <Text style={[s.small, { marginBottom: 8 }]}>
          {[object.objectNumber, object.maker, object.dateMade, formatSize(object.sheetWidthMm, object.sheetHeightMm, settings.unit, { denominator: 16 })].filter(Boolean).join(" · ")}
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
              Previous signed report: {prev.reportDate}, {CONDITION_CONTEXT_LABELS[prev.context].toLowerCase()}, examined by {prev.examinerName}; rated {RATING_LABELS[prev.rating].toLowerCase()}, now {RATING_LABELS[report.rating].toLowerCase()}.
            </Text>
            {compared.length === 0 ? (
              <Text style={para}>Neither report records a finding.</Text>
            ) : (
              <Table
                cols={[{ label: "Finding", flex: 1.3 }, { label: "Status", width: 80 }, { label: "Before", flex: 1 }, { label: "Now", flex: 1 }]}
                rows={compared.map((c) => [
                  (c.after ?? c.before)!.term,
                  <ComparisonTag status={c.status} />,
                  c.before ? `${SEVERITY_LABELS[c.before.severity]}${c.before.extent ? `, ${c.before.extent}` : ""}` : "—",
                  c.after ? `${SEVERITY_LABELS[c.after.severity]}${c.after.extent ? `, ${c.after.extent}` : ""}${c.after.resolved ? ", resolved" : ""}` : "—",
                ])}
              />
            )}
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
          {[
            { label: "Examiner", v: sig.examiner },
            ...(sig.otherParty ? [{ label: "Other party", v: sig.otherParty }] : []),
          ].map((x) => (
            <View key={x.label} style={{ flex: 1, borderTopWidth: 0.75, borderTopColor: INK, paddingTop: 4, marginTop: 14 }}>
              <Text style={s.small}>{x.label}</Text>
              <Text style={{ fontWeight: 600 }}>{x.v?.name ?? "—"}</Text>
              <Text style={s.small}>
                {[x.v?.role, x.v?.date && `signed ${x.v.date}`].filter(Boolean).join(" · ")}
              </Text>
            </View>
          ))}
        </View>

        <Text style={[para, { marginTop: 14, color: GRAPHITE }]}>{NOT_TREATMENT}</Text>
        </View>
      </DocShell>
    ),
  });
}
