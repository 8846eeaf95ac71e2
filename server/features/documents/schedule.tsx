import { format } from "date-fns";
import { Document, Page, renderToBuffer, StyleSheet, View } from "@react-pdf/renderer";
import { Text } from "../../lib/pdf/text.tsx";
import type { Db } from "../../db/client.ts";
import type { SessionUser } from "../../../shared/schemas/auth.ts";
import { VALUATION_REVIEW_YEARS } from "../../../shared/domain/valuation.ts";
import { formatMoney } from "../../../shared/domain/money.ts";
import { registerFonts } from "../../lib/pdf/fonts.ts";
import { StudioBlock, type DocMeta } from "../../lib/pdf/layout.tsx";
import { pageFooterText } from "../../lib/pdf/host-tree.ts";
import { ACCENT, GRAPHITE, INK, STONE, s } from "../../lib/pdf/theme.ts";
import { getSettings } from "../settings/settings.repo.ts";
import { newVerificationCode } from "./verification-code.ts";
import { day, type ScheduleData, type ScheduleRow, type ScheduleTotal, loadSchedule } from "./schedule-data.ts";

export const t = StyleSheet.create({
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
  let page: ScheduleRow[] = [];
  const pages: ScheduleRow[][] = [page];
  let left = body - 52; // the title and the intro line on the first page
  for (const r of rows) {
    const h = rowHeight(r);
    if (h > left && page.length > 0) {
      page = [];
      pages.push(page);
      left = body;
    }
    page.push(r);
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
                {x.bases.length === 1 && !x.noBasis ? ` · ${(x.bases[0] ?? "").toLowerCase()}` : ""}
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
        Values are as recorded in Reversa on the date above, in each valuation's own currency, with the basis and date each was given; currencies are never converted or added
        together. Values more than {VALUATION_REVIEW_YEARS} years old are marked. Sizes are width × height: the sheet, then the frame's outside where a frame is recorded, or the
        mount's outer size. Condition dates are those of the latest signed condition report. This schedule is confidential to the owner and the studio.
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
