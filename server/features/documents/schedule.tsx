import { Document, Page, renderToBuffer, StyleSheet, View } from "@react-pdf/renderer";
import { Text } from "../../lib/pdf/text.tsx";
import { and, desc, eq, inArray, type SQL } from "drizzle-orm";
import { format, parseISO } from "date-fns";
import type { Db } from "../../db/client.ts";
import { clients, conditionReports, objects } from "../../db/schema.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import { OBJECT_STATUS_LABELS } from "../../../shared/schemas/objects.ts";
import { RATING_LABELS, type Rating } from "../../../shared/schemas/condition.ts";
import { formatSize, type Unit } from "../../../shared/domain/units.ts";
import { formatMoney } from "../../../shared/domain/money.ts";
import { registerFonts } from "../../lib/pdf/fonts.ts";
import { StudioBlock, type DocMeta } from "../../lib/pdf/layout.tsx";
import { ACCENT, GRAPHITE, INK, STONE, s } from "../../lib/pdf/theme.ts";
import { getSettings } from "../settings/settings.repo.ts";
import { newVerificationCode } from "./documents.service.ts";

export type ScheduleRow = {
  id: string;
  objectNumber: string;
  title: string;
  maker: string | null;
  dimensions: string;
  status: string;
  location: string | null;
  conditionDate: string | null;
  conditionRating: string | null;
  valueMinor: number | null;
  currency: string | null;
};
export type ScheduleTotal = { currency: string; minor: number; count: number };
export type ScheduleData = {
  clientName: string;
  rows: ScheduleRow[];
  totals: ScheduleTotal[];
  unvalued: number;
  producedBy: string;
  filterNote: string | null;
};
export type ScheduleFilter = { objectIds?: string[]; status?: string; objectType?: string };

const CHUNK = 500;

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

/** Sums per currency in integer minor units (exact), in order of first appearance by object number. */
export function totalsOf(rows: Pick<ScheduleRow, "valueMinor" | "currency">[]): { totals: ScheduleTotal[]; unvalued: number } {
  const by = new Map<string, ScheduleTotal>();
  let unvalued = 0;
  for (const r of rows) {
    if (r.valueMinor == null || !r.currency) {
      unvalued++;
      continue;
    }
    const t = by.get(r.currency) ?? { currency: r.currency, minor: 0, count: 0 };
    t.minor += r.valueMinor;
    t.count++;
    by.set(r.currency, t);
  }
  for (const t of by.values()) if (!Number.isSafeInteger(t.minor)) throw new RangeError(`The ${t.currency} total is too large to add up exactly.`);
  return { totals: [...by.values()].sort((a, b) => a.currency.localeCompare(b.currency)), unvalued };
}

/** Loads the rows of a schedule: a client's objects (optionally a filtered set), or, with clientId null, the given objects. */
export function loadSchedule(db: Db, clientId: string | null, filter: ScheduleFilter, producedBy: string): ScheduleData | null {
  const unit: Unit = getSettings(db).unit;
  const where: SQL[] = [];
  if (clientId) where.push(eq(objects.clientId, clientId));
  if (filter.status) where.push(eq(objects.status, filter.status));
  if (filter.objectType) where.push(eq(objects.objectType, filter.objectType));
  const cols = {
    id: objects.id,
    objectNumber: objects.objectNumber,
    title: objects.title,
    maker: objects.maker,
    w: objects.sheetWidthMm,
    h: objects.sheetHeightMm,
    status: objects.status,
    location: objects.location,
    valueMinor: objects.valuationMinor,
    currency: objects.valuationCurrency,
    clientName: clients.name,
  };
  const base = () => db.select(cols).from(objects).innerJoin(clients, eq(clients.id, objects.clientId));
  let raw: { id: string; objectNumber: string; title: string; maker: string | null; w: number; h: number; status: string; location: string | null; valueMinor: number | null; currency: string | null; clientName: string }[];
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
      dimensions: formatSize(r.w, r.h, unit),
      status: OBJECT_STATUS_LABELS[r.status as keyof typeof OBJECT_STATUS_LABELS] ?? r.status,
      location: r.location,
      conditionDate: c?.date ?? null,
      conditionRating: c ? (RATING_LABELS[c.rating as Rating] ?? c.rating) : null,
      valueMinor: r.valueMinor,
      currency: r.currency,
    };
  });
  const clientName = clientId
    ? (raw[0]?.clientName ?? db.select({ name: clients.name }).from(clients).where(eq(clients.id, clientId)).get()?.name ?? "")
    : [...new Set(raw.map((r) => r.clientName))].join(", ");
  const parts: string[] = [];
  if (filter.objectIds) parts.push(`${rows.length} selected object${rows.length === 1 ? "" : "s"}`);
  if (filter.status) parts.push(`status: ${OBJECT_STATUS_LABELS[filter.status as keyof typeof OBJECT_STATUS_LABELS] ?? filter.status}`);
  if (filter.objectType) parts.push(`object type: ${filter.objectType}`);
  return { clientName, rows, ...totalsOf(rows), producedBy, filterNote: parts.length ? parts.join(" · ") : null };
}

const t = StyleSheet.create({
  head: { flexDirection: "row", borderBottomWidth: 0.75, borderBottomColor: INK, paddingBottom: 3, marginTop: 8, backgroundColor: "#fbf8f2" },
  th: { fontSize: 7, fontWeight: 600, color: GRAPHITE, textTransform: "uppercase", letterSpacing: 0.3 },
  row: { flexDirection: "row", borderBottomWidth: 0.4, borderBottomColor: STONE, paddingVertical: 4 },
  zebra: { backgroundColor: "#f6f1e7" },
  td: { fontSize: 8 },
  sub: { fontSize: 7, color: GRAPHITE, marginTop: 1 },
  num: { fontSize: 8, textAlign: "right" },
  cNo: { width: 68, paddingRight: 6 },
  cTitle: { flex: 1, paddingRight: 6 },
  cDim: { width: 86, paddingRight: 6 },
  cLoc: { width: 88, paddingRight: 6 },
  cCond: { width: 66, paddingRight: 6 },
  cVal: { width: 78, textAlign: "right" },
  totals: { marginTop: 10, alignSelf: "flex-end", width: 250 },
  totalRow: { flexDirection: "row", justifyContent: "space-between", paddingVertical: 3, borderBottomWidth: 0.4, borderBottomColor: STONE },
  totalStrong: { fontSize: 9, fontWeight: 700, textAlign: "right" },
});
const day = (iso: string) => {
  const d = parseISO(iso);
  return Number.isNaN(d.getTime()) ? iso : format(d, "d MMM yyyy");
};
const tabular = { fontFeatureSettings: ["tnum" as const] };

function HeaderRow() {
  return (
    <View style={t.head} fixed>
      <Text style={[t.th, t.cNo]}>Object number</Text>
      <Text style={[t.th, t.cTitle]}>Title · maker</Text>
      <Text style={[t.th, t.cDim]}>Dimensions</Text>
      <Text style={[t.th, t.cLoc]}>Status · location</Text>
      <Text style={[t.th, t.cCond]}>Last condition</Text>
      <Text style={[t.th, t.cVal]}>Insured value</Text>
    </View>
  );
}

/** A row's height in points, estimated from its text, to fill each page without overflowing it. */
function rowHeight(r: ScheduleRow): number {
  const titleLines = Math.max(1, Math.ceil((r.title.length * 4.1) / 150)) + (r.maker ? 1 : 0);
  const locLines = Math.max(1, Math.ceil(r.status.length * 4.1 / 88)) + (r.location ? Math.ceil((r.location.length * 3.6) / 88) : 0);
  const condLines = r.conditionRating ? 2 : 1;
  return 9.5 + Math.max(titleLines, locLines, condLines) * 10.2;
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

function Row({ r, i }: { r: ScheduleRow; i: number }) {
  return (
    <View style={i % 2 === 1 ? [t.row, t.zebra] : t.row} wrap={false}>
      <Text style={[t.td, t.cNo, { fontWeight: 600, color: ACCENT }]}>{r.objectNumber}</Text>
      <View style={t.cTitle}>
        <Text style={t.td}>{r.title}</Text>
        {r.maker ? <Text style={t.sub}>{r.maker}</Text> : null}
      </View>
      <Text style={[t.td, t.cDim, tabular]}>{r.dimensions}</Text>
      <View style={t.cLoc}>
        <Text style={t.td}>{r.status}</Text>
        {r.location ? <Text style={t.sub}>{r.location}</Text> : null}
      </View>
      <View style={t.cCond}>
        <Text style={[t.td, tabular]}>{r.conditionDate ? day(r.conditionDate) : "No signed report"}</Text>
        {r.conditionRating ? <Text style={t.sub}>{r.conditionRating}</Text> : null}
      </View>
      <Text style={[t.num, t.cVal, tabular]}>{r.valueMinor != null && r.currency ? formatMoney(r.valueMinor, r.currency) : "Not valued"}</Text>
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
      <Text style={[s.footer, { left: 360, textAlign: "right", borderTopWidth: 0 }]} fixed render={({ pageNumber, totalPages }) => `Page ${pageNumber} of ${totalPages} · Produced by Reversa`} />
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

function Totals({ data }: { data: ScheduleData }) {
  return (
    <>
      <View style={t.totals} wrap={false}>
        <Text style={[s.h2, { marginTop: 4 }]}>Totals per currency</Text>
        {data.totals.map((x) => (
          <View key={x.currency} style={t.totalRow}>
            <Text style={t.td}>
              {x.currency} · {x.count} object{x.count === 1 ? "" : "s"}
            </Text>
            <Text style={[t.totalStrong, tabular]}>Total {formatMoney(x.minor, x.currency)}</Text>
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
        Values are as recorded in Reversa on the date above, in each valuation's own currency; currencies are never converted or added together. Condition dates are those of the latest signed condition report. This schedule is confidential to the owner and the studio.
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
