import { Document, Page, renderToBuffer, StyleSheet, View } from "@react-pdf/renderer";
import { Text } from "../../lib/pdf/text.tsx";
import { and, desc, eq, inArray, type SQL } from "drizzle-orm";
import { format, parseISO } from "date-fns";
import type { Db } from "../../db/client.ts";
import { clients, conditionReports, objects } from "../../db/schema.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import { OBJECT_STATUS_LABELS, OBJECT_TYPE_LABELS, VALUATION_BASIS_LABELS, type ObjectType } from "../../../shared/schemas/objects.ts";
import { ATTACHMENT_METHOD_LABELS, BOARD_GRADE_LABELS, GLAZING_TYPE_LABELS } from "../../../shared/schemas/mountings.ts";
import { packageSize } from "../../../shared/domain/mounting.ts";
import { valuationIsOld, VALUATION_REVIEW_YEARS } from "../../../shared/domain/valuation.ts";
import { objectFilterWhere, type ObjectFilter } from "../objects/objects.repo.ts";
import { findMounting } from "../mountings/mountings.repo.ts";
import { mountingDetail } from "./workshop-sheet.tsx";
import { RATING_LABELS, type Rating } from "../../../shared/schemas/condition.ts";
import { formatSize, type Unit } from "../../../shared/domain/units.ts";
import { formatMoney } from "../../../shared/domain/money.ts";
import { registerFonts } from "../../lib/pdf/fonts.ts";
import { StudioBlock, type DocMeta } from "../../lib/pdf/layout.tsx";
import { pageFooterText } from "../../lib/pdf/host-tree.ts";
import { ACCENT, GRAPHITE, INK, STONE, s } from "../../lib/pdf/theme.ts";
import { getSettings } from "../settings/settings.repo.ts";
import { newVerificationCode } from "./documents.service.ts";

export type ScheduleRow = {
  id: string;
  objectNumber: string;
  title: string;
  maker: string | null;
  /** "Print · etching and aquatint": the object type in words and the medium. */
  kind: string;
  /** The sheet, and the object as it leaves the studio (framed outside, or the mount's outer size). */
  dimensions: string;
  packageSize: string | null;
  status: string;
  location: string | null;
  conditionDate: string | null;
  conditionRating: string | null;
  valueMinor: number | null;
  currency: string | null;
  /** The valuation's basis in words ("Market value"), its date, and whether it is past review (trade reference §15). */
  basis: string | null;
  valuedOn: string | null;
  valuationOld: boolean;
};
export type ScheduleTotal = {
  currency: string;
  minor: number;
  count: number;
  /** The bases this total adds, in words; more than one means the total mixes bases. */
  bases: string[];
  /** The total split by basis ("No recorded basis" for values without one): the parts add up to the total. */
  byBasis: { basis: string; minor: number; count: number }[];
  /** Values in this total with no basis, more than VALUATION_REVIEW_YEARS old, or with no date. */
  noBasis: number;
  old: number;
  undated: number;
};
export type ScheduleData = {
  clientName: string;
  rows: ScheduleRow[];
  totals: ScheduleTotal[];
  unvalued: number;
  producedBy: string;
  filterNote: string | null;
};
/** A chosen set of objects, or the register's filter (the same conditions the register's list reads). */
export type ScheduleFilter = ObjectFilter & { objectIds?: string[] };

const CHUNK = 500;
const NO_BASIS = "No recorded basis";

/** The latest signed condition report per object: date and rating. */
function latestSigned(db: Db, ids: string[]): Map<string, { date: string; rating: string }> {
  const out = new Map<string, { date: string; rating: string }>();
  for (let i = 0; i < ids.length; i += CHUNK) {
    const rows = db
      .select({ objectId: conditionReports.objectId, date: conditionReports.reportDate, rating: conditionReports.rating })
      .from(conditionReports)
      .where(and(eq(conditionReports.status, "signed"), inArray(conditionReports.objectId, ids.slice(i, i + CHUNK))))
      .orderBy(desc(conditionReports.reportDate), desc(conditionReports.signedAt))
      .all();
    for (const r of rows) if (!out.has(r.objectId)) out.set(r.objectId, { date: r.date, rating: r.rating });
  }
  return out;
}

/** Sums per currency in integer minor units (exact), sorted by currency code, with the bases and ages each sum adds. */
export function totalsOf(rows: Pick<ScheduleRow, "valueMinor" | "currency" | "basis" | "valuedOn" | "valuationOld">[]): { totals: ScheduleTotal[]; unvalued: number } {
  const by = new Map<string, ScheduleTotal>();
  let unvalued = 0;
  for (const r of rows) {
    if (r.valueMinor == null || !r.currency) {
      unvalued++;
      continue;
    }
    const t = by.get(r.currency) ?? { currency: r.currency, minor: 0, count: 0, bases: [], byBasis: [], noBasis: 0, old: 0, undated: 0 };
    t.minor += r.valueMinor;
    t.count++;
    const label = r.basis ?? NO_BASIS;
    const part = t.byBasis.find((b) => b.basis === label) ?? t.byBasis[t.byBasis.push({ basis: label, minor: 0, count: 0 }) - 1];
    part.minor += r.valueMinor;
    part.count++;
    if (!r.basis) t.noBasis++;
    else if (!t.bases.includes(r.basis)) t.bases.push(r.basis);
    if (!r.valuedOn) t.undated++;
    else if (r.valuationOld) t.old++;
    by.set(r.currency, t);
  }
  for (const t of by.values()) {
    t.bases.sort();
    t.byBasis.sort((a, b) => (a.basis === NO_BASIS ? 1 : b.basis === NO_BASIS ? -1 : a.basis.localeCompare(b.basis)));
  }
  for (const t of by.values()) if (!Number.isSafeInteger(t.minor)) throw new RangeError(`The ${t.currency} total is too large to add up exactly.`);
  return { totals: [...by.values()].sort((a, b) => a.currency.localeCompare(b.currency)), unvalued };
}

/** "Print · Etching": the type in words and the medium, the medium left out when it only repeats the type. */
function kindOf(objectType: string, medium: string | null): string {
  const type = OBJECT_TYPE_LABELS[objectType as ObjectType] ?? objectType;
  return medium && medium.trim().toLowerCase() !== type.toLowerCase() ? `${type} · ${medium}` : type;
}

/** The object as it leaves the studio, from its current mounting, in the studio's unit; null when it has none. */
function packageLine(db: Db, mountingId: string | null, unit: Unit): string | null {
  const m = mountingId ? findMounting(db, mountingId) : null;
  const d = m && m.status === "completed" ? mountingDetail(db, m) : null;
  const p = d ? packageSize(d.data, d.result) : null;
  if (!p) return null;
  const size = formatSize(p.widthMm, p.heightMm, unit);
  return p.kind === "framed" ? `Framed ${size}` : p.kind === "framed-no-face-width" ? `Framed; mount ${size}` : `Mount ${size}`;
}

/** Loads the rows of a schedule: a client's objects (the register's filter, or chosen ones), or, with clientId null, the given objects. */
export function loadSchedule(db: Db, clientId: string | null, filter: ScheduleFilter, producedBy: string, on: Date = new Date()): ScheduleData | null {
  const unit: Unit = getSettings(db).unit;
  const where: SQL[] = objectFilterWhere(filter, clientId);
  const cols = {
    id: objects.id,
    objectNumber: objects.objectNumber,
    title: objects.title,
    maker: objects.maker,
    objectType: objects.objectType,
    medium: objects.medium,
    mountingId: objects.currentMountingId,
    w: objects.sheetWidthMm,
    h: objects.sheetHeightMm,
    status: objects.status,
    location: objects.location,
    valueMinor: objects.valuationMinor,
    currency: objects.valuationCurrency,
    valuedOn: objects.valuationDate,
    basis: objects.valuationBasis,
    clientName: clients.name,
  };
  const base = () => db.select(cols).from(objects).innerJoin(clients, eq(clients.id, objects.clientId));
  let raw: ReturnType<ReturnType<typeof base>["all"]>;
  if (filter.objectIds) {
    const wanted = [...new Set(filter.objectIds)];
    raw = [];
    for (let i = 0; i < wanted.length; i += CHUNK) raw.push(...base().where(and(...where, inArray(objects.id, wanted.slice(i, i + CHUNK)))).all());
    // One id that is not this client's (or does not exist) answers as not found, like any other record.
    if (raw.length !== wanted.length) return null;
  } else {
    raw = base().where(and(...where)).all();
  }
  raw.sort((a, b) => (a.objectNumber < b.objectNumber ? -1 : a.objectNumber > b.objectNumber ? 1 : 0));
  const cond = latestSigned(db, raw.map((r) => r.id));
  const rows: ScheduleRow[] = raw.map((r) => {
    const c = cond.get(r.id);
    return {
      id: r.id,
      objectNumber: r.objectNumber,
      title: r.title,
      maker: r.maker,
      kind: kindOf(r.objectType, r.medium),
      dimensions: formatSize(r.w, r.h, unit),
      packageSize: packageLine(db, r.mountingId, unit),
      status: OBJECT_STATUS_LABELS[r.status as keyof typeof OBJECT_STATUS_LABELS] ?? r.status,
      location: r.location,
      conditionDate: c?.date ?? null,
      conditionRating: c ? (RATING_LABELS[c.rating as Rating] ?? c.rating) : null,
      valueMinor: r.valueMinor,
      currency: r.currency,
      basis: r.basis ? (VALUATION_BASIS_LABELS[r.basis as keyof typeof VALUATION_BASIS_LABELS] ?? r.basis) : null,
      valuedOn: r.valuedOn,
      valuationOld: !!r.valuedOn && valuationIsOld(r.valuedOn, on),
    };
  });
  const clientName = clientId
    ? (raw[0]?.clientName ?? db.select({ name: clients.name }).from(clients).where(eq(clients.id, clientId)).get()?.name ?? "")
    : [...new Set(raw.map((r) => r.clientName))].join(", ");
  const parts: string[] = [];
  if (filter.objectIds) parts.push(`${rows.length} selected object${rows.length === 1 ? "" : "s"}`);
  if (filter.status) parts.push(`status: ${(OBJECT_STATUS_LABELS[filter.status] ?? filter.status).toLowerCase()}`);
  if (filter.objectType) parts.push(`object type: ${(OBJECT_TYPE_LABELS[filter.objectType] ?? filter.objectType).toLowerCase()}`);
  if (filter.method) parts.push(`held by: ${(ATTACHMENT_METHOD_LABELS[filter.method] ?? filter.method).toLowerCase()}`);
  if (filter.boardGrade) parts.push(`board: ${(BOARD_GRADE_LABELS[filter.boardGrade] ?? filter.boardGrade).toLowerCase()}`);
  if (filter.glazing) parts.push(`glazing: ${(GLAZING_TYPE_LABELS[filter.glazing] ?? filter.glazing).toLowerCase()}`);
  if (filter.checkDueBy) parts.push(`check due by ${day(filter.checkDueBy)}`);
  if (filter.q) parts.push(`matching “${filter.q}”`);
  return { clientName, rows, ...totalsOf(rows), producedBy, filterNote: parts.length ? parts.join(" · ") : null };
}

const t = StyleSheet.create({
  head: { flexDirection: "row", borderBottomWidth: 0.75, borderBottomColor: INK, paddingBottom: 3, marginTop: 8, backgroundColor: "#fbf8f2" },
  th: { fontSize: 7, fontWeight: 600, color: GRAPHITE, textTransform: "uppercase", letterSpacing: 0.3 },
  row: { flexDirection: "row", borderBottomWidth: 0.4, borderBottomColor: STONE, paddingVertical: 4 },
  zebra: { backgroundColor: "#f6f1e7" },
  td: { fontSize: 8 },
  sub: { fontSize: 7, color: GRAPHITE, marginTop: 1 },
  flag: { fontSize: 7, color: ACCENT, fontWeight: 600, marginTop: 1 },
  num: { fontSize: 8, textAlign: "right" },
  cNo: { width: 60, paddingRight: 6 },
  cTitle: { flex: 1, paddingRight: 6 },
  cDim: { width: 96, paddingRight: 6 },
  cLoc: { width: 78, paddingRight: 6 },
  cCond: { width: 62, paddingRight: 6 },
  cVal: { width: 82, textAlign: "right" },
  totals: { marginTop: 10, alignSelf: "flex-end", width: 300 },
  totalRow: { flexDirection: "row", justifyContent: "space-between", paddingTop: 3, paddingBottom: 1 },
  totalBlock: { borderBottomWidth: 0.4, borderBottomColor: STONE, paddingBottom: 3 },
  totalStrong: { fontSize: 9, fontWeight: 700, textAlign: "right" },
});
const day = (iso: string) => {
  const d = parseISO(iso);
  return Number.isNaN(d.getTime()) ? iso : format(d, "d MMM yyyy");
};
const tabular = { fontFeatureSettings: ["tnum" as const] };
const OLD = `Over ${VALUATION_REVIEW_YEARS} years old`;

function HeaderRow() {
  return (
    <View style={t.head} fixed>
      <Text style={[t.th, t.cNo]}>Object number</Text>
      <Text style={[t.th, t.cTitle]}>Title · maker · type</Text>
      <Text style={[t.th, t.cDim]}>Sheet · framed size</Text>
      <Text style={[t.th, t.cLoc]}>Status · location</Text>
      <Text style={[t.th, t.cCond]}>Last condition</Text>
      <Text style={[t.th, t.cVal]}>Insured value</Text>
    </View>
  );
}

/** Lines of text at about `perLine` characters a line (never fewer than one). */
const lines = (text: string | null, perLine: number) => (text ? Math.max(1, Math.ceil(text.length / perLine)) : 0);

/** A row's height in points, estimated from its text, to fill each page without overflowing it. */
function rowHeight(r: ScheduleRow): number {
  const title = lines(r.title, 34) + lines(r.maker, 38) + lines(r.kind, 38);
  const dim = lines(r.dimensions, 22) + lines(r.packageSize, 24);
  const loc = lines(r.status, 18) + lines(r.location, 20);
  const cond = r.conditionRating ? 2 : 1;
  const val = 1 + (r.valueMinor != null ? 1 + (r.basis ? 1 : 0) + (r.valuationOld ? 1 : 0) : 0);
  return 9.5 + Math.max(title, dim, loc, cond, val) * 10.2;
}

/**
 * The rows cut into pages ahead of layout. react-pdf re-lays out everything left on each page break,
 * which grows with the square of the rows (1,000 rows in one wrapping page took 14 s); cut into
 * pages of their own it stays linear. A page that still overflows (an unusually long title) wraps on
 * its own, with the header repeated, so nothing is ever lost.
 */
function paginate(rows: ScheduleRow[], pageHeight: number): ScheduleRow[][] {
  const body = pageHeight - 86 - 54 - 24; // page padding (theme) and the table's header row
  const pages: ScheduleRow[][] = [[]];
  let left = body - 52; // the title and the intro line on the first page
  for (const r of rows) {
    const h = rowHeight(r);
    if (h > left && pages[pages.length - 1].length > 0) {
      pages.push([]);
      left = body;
    }
    pages[pages.length - 1].push(r);
    left -= h;
  }
  return pages;
}

function Value({ r }: { r: ScheduleRow }) {
  if (r.valueMinor == null || !r.currency) return <Text style={[t.num, t.cVal]}>Not valued</Text>;
  return (
    <View style={t.cVal}>
      <Text style={[t.num, tabular]}>{formatMoney(r.valueMinor, r.currency)}</Text>
      {r.basis ? <Text style={[t.sub, { textAlign: "right" }]}>{r.basis}</Text> : null}
      <Text style={[t.sub, tabular, { textAlign: "right" }]}>{r.valuedOn ? `Valued ${day(r.valuedOn)}` : "No valuation date"}</Text>
      {r.valuationOld ? <Text style={[t.flag, { textAlign: "right" }]}>{OLD}</Text> : null}
    </View>
  );
}

function Row({ r, i }: { r: ScheduleRow; i: number }) {
  return (
    <View style={i % 2 === 1 ? [t.row, t.zebra] : t.row} wrap={false}>
      <Text style={[t.td, t.cNo, { fontWeight: 600, color: ACCENT }]}>{r.objectNumber}</Text>
      <View style={t.cTitle}>
        <Text style={t.td}>{r.title}</Text>
        {r.maker ? <Text style={t.sub}>{r.maker}</Text> : null}
        {r.kind ? <Text style={t.sub}>{r.kind}</Text> : null}
      </View>
      <View style={t.cDim}>
        <Text style={[t.td, tabular]}>{r.dimensions}</Text>
        <Text style={[t.sub, tabular]}>{r.packageSize ?? "Not mounted"}</Text>
      </View>
      <View style={t.cLoc}>
        <Text style={t.td}>{r.status}</Text>
        {r.location ? <Text style={t.sub}>{r.location}</Text> : null}
      </View>
      <View style={t.cCond}>
        <Text style={[t.td, tabular]}>{r.conditionDate ? day(r.conditionDate) : "No signed report"}</Text>
        {r.conditionRating ? <Text style={t.sub}>{r.conditionRating}</Text> : null}
      </View>
      <Value r={r} />
    </View>
  );
}

/** The header band and footer of DocShell (server/lib/pdf/layout.tsx), on each of the schedule's own pages. */
function Chrome({ meta }: { meta: DocMeta }) {
  return (
    <>
      <View style={s.header} fixed>
        <StudioBlock meta={meta} />
        <View>
          <Text style={s.kind}>{meta.kindLabel}</Text>
          <Text style={[s.small, { textAlign: "right" }]}>Verification code {meta.code}</Text>
        </View>
      </View>
      <Text style={[s.footer, { left: 40 }]} fixed>
        Issued {format(meta.issuedAt, "d MMM yyyy, HH:mm")} · verify the code {meta.code} in Reversa (/verify)
      </Text>
      <Text style={[s.footer, { left: 360, textAlign: "right", borderTopWidth: 0 }]} fixed render={pageFooterText} />
    </>
  );
}

export function ScheduleDocument({ meta, data }: { meta: DocMeta; data: ScheduleData }) {
  const letter = meta.paperSize === "Letter";
  const pages = paginate(data.rows, letter ? 792 : 841.89);
  let n = 0;
  return (
    <Document title={meta.title} author={meta.studioName} creator="Reversa" producer="Reversa">
      {pages.map((rows, pi) => (
        <Page key={pi} size={letter ? "LETTER" : "A4"} style={s.page} wrap>
          <Chrome meta={meta} />
          {pi === 0 ? (
            <>
              <Text style={s.h1}>Schedule of values</Text>
              <Text style={{ fontSize: 9, lineHeight: 1.4, marginBottom: 4 }}>
                {data.clientName} · {data.rows.length} object{data.rows.length === 1 ? "" : "s"}
                {data.filterNote ? ` (${data.filterNote})` : ""} · produced {format(meta.issuedAt, "d MMMM yyyy")} by {data.producedBy}
              </Text>
            </>
          ) : null}
          <HeaderRow />
          {rows.map((r) => (
            <Row key={r.id} r={r} i={n++} />
          ))}
          {pi === pages.length - 1 ? <Totals data={data} /> : null}
        </Page>
      ))}
    </Document>
  );
}

/** What a total adds that an insurer must know: mixed bases, values past review, values without a date or basis. */
export function totalCaveats(x: ScheduleTotal): string[] {
  const out: string[] = [];
  const of = (n: number) => (n === x.count ? (n === 1 ? "The value" : `All ${n} values`) : `${n} of the ${x.count} values`);
  if (x.bases.length > 1) out.push(`Mixes bases: ${x.bases.map((b) => b.toLowerCase()).join(", ")}. Values on different bases are not the same measure.`);
  if (x.noBasis) out.push(`${of(x.noBasis)} ${x.noBasis === 1 ? "has" : "have"} no recorded basis.`);
  if (x.old) out.push(`${of(x.old)} ${x.old === 1 ? "is" : "are"} more than ${VALUATION_REVIEW_YEARS} years old: ask for a revaluation.`);
  if (x.undated) out.push(`${of(x.undated)} ${x.undated === 1 ? "has" : "have"} no valuation date.`);
  return out;
}

function Totals({ data }: { data: ScheduleData }) {
  return (
    <>
      <View style={t.totals} wrap={false}>
        <Text style={[s.h2, { marginTop: 4 }]}>Totals per currency</Text>
        {data.totals.map((x) => (
          <View key={x.currency} style={t.totalBlock}>
            <View style={t.totalRow}>
              <Text style={t.td}>
                {x.currency} · {x.count} object{x.count === 1 ? "" : "s"}
                {x.bases.length === 1 && !x.noBasis ? ` · ${x.bases[0].toLowerCase()}` : ""}
              </Text>
              <Text style={[t.totalStrong, tabular]}>Total {formatMoney(x.minor, x.currency)}</Text>
            </View>
            {x.byBasis.length > 1
              ? x.byBasis.map((b) => (
                  <View key={b.basis} style={[t.totalRow, { paddingTop: 1 }]}>
                    <Text style={t.sub}>
                      {b.basis} · {b.count} object{b.count === 1 ? "" : "s"}
                    </Text>
                    <Text style={[t.sub, tabular]}>{formatMoney(b.minor, x.currency)}</Text>
                  </View>
                ))
              : null}
            {totalCaveats(x).map((c) => (
              <Text key={c} style={t.flag}>
                {c}
              </Text>
            ))}
          </View>
        ))}
        {data.totals.length === 0 ? <Text style={t.td}>No object in this schedule has a valuation.</Text> : null}
        {data.unvalued ? (
          <Text style={[t.sub, { marginTop: 3 }]}>
            {data.unvalued} object{data.unvalued === 1 ? " has" : "s have"} no valuation and {data.unvalued === 1 ? "is" : "are"} not counted in the totals.
          </Text>
        ) : null}
      </View>
      <Text style={[s.small, { marginTop: 14, fontSize: 7.5, lineHeight: 1.4 }]} wrap={false}>
        Values are as recorded in Reversa on the date above, in each valuation's own currency, with the basis and date each was given; currencies are never converted or added together. Values more than {VALUATION_REVIEW_YEARS} years old are marked. Sizes are width × height: the sheet, then the frame's outside where a frame is recorded, or the mount's outer size. Condition dates are those of the latest signed condition report. This schedule is confidential to the owner and the studio.
      </Text>
    </>
  );
}

/** For scripts/bench.ts: renders the schedule of the given objects (no record is written) and returns the PDF. */
export async function renderScheduleForBench(db: Db, user: SessionUser, objectIds: string[]): Promise<Buffer> {
  const data = loadSchedule(db, null, { objectIds }, user.name);
  if (!data) throw new Error("Some of those objects were not found.");
  const settings = getSettings(db);
  const meta: DocMeta = {
    studioName: settings.studioName,
    studioAddress: settings.studioAddress,
    studioContact: settings.studioContact,
    kindLabel: "Schedule of values",
    objectNumber: null,
    code: newVerificationCode(),
    issuedAt: new Date(),
    paperSize: settings.paperSize,
    title: "Schedule of values",
  };
  registerFonts();
  return Buffer.from(await renderToBuffer(<ScheduleDocument meta={meta} data={data} />));
}
