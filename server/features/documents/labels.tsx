import { Document, Image, Link, Page, View } from "@react-pdf/renderer";
import { Text } from "../../lib/pdf/text.tsx";
import { format, parseISO } from "date-fns";
import QRCode from "qrcode";
import type { Style } from "@react-pdf/types";
import type { DocMeta } from "../../lib/pdf/layout.tsx";
import { ACCENT, GRAPHITE, INK, STONE, WARN } from "../../lib/pdf/theme.ts";

const PT_PER_MM = 72 / 25.4;
/** A back label is 100 × 70 mm, alone or on a sheet (1 in = 25.4 mm = 72 pt). */
export const BACK_LABEL_MM: [number, number] = [100, 70];
export const BACK_LABEL_SIZE: [number, number] = [BACK_LABEL_MM[0] * PT_PER_MM, BACK_LABEL_MM[1] * PT_PER_MM];
export const REVERSIBLE_LINE = "Reversible mount — do not use pressure-sensitive tape";
/** The blank border a QR code needs around it to be read, in modules (ISO/IEC 18004 asks for four). */
export const QR_QUIET_MODULES = 4;
/** The least blank margin a sheet leaves at the paper's edge, where most printers cannot print (about 5 mm). */
const SHEET_MIN_MARGIN = 14;
const TITLE_MAX = 90;
/** Cut lines: light enough not to distract on the label, dark enough to cut along. */
const CUT_LINE = "#a39c90";

/** A dashed hairline along the cells' edges: `Left` runs down the page at x = at, `Top` across it at y = at, from `from` for `length`. */
function cutLine(side: "Left" | "Top", at: number, from: number, length: number): Style {
  return side === "Left"
    ? { position: "absolute", left: at - 0.2, top: from, width: 0, height: length, borderLeftWidth: 0.5, borderLeftColor: CUT_LINE, borderStyle: "dashed" }
    : { position: "absolute", top: at - 0.2, left: from, height: 0, width: length, borderTopWidth: 0.5, borderTopColor: CUT_LINE, borderStyle: "dashed" };
}

export type LabelData = {
  objectId: string;
  objectNumber: string;
  title: string;
  mountedOn: string | null;
  /** The current mount in one line; null when the object has no completed mounting. */
  summary: string | null;
  url: string;
  qr: string;
};
/** Where a label sends people: the public address, and the page that checks a label's code there. */
export type LabelAddress = { publicUrl: string };

/** The object's record, opened after sign-in. */
export function objectUrl(publicUrl: string, objectId: string): string {
  return `${publicUrl.replace(/\/+$/, "")}/objects/${encodeURIComponent(objectId)}`;
}

/** The page where anyone holding the label can check its code. */
export function verifyUrl(publicUrl: string, code: string): string {
  return `${publicUrl.replace(/\/+$/, "")}/verify/${encodeURIComponent(code)}`;
}

/** The QR code as a PNG data URL, with its four-module quiet zone drawn in. */
export async function qrFor(url: string): Promise<string> {
  return QRCode.toDataURL(url, { errorCorrectionLevel: "M", margin: QR_QUIET_MODULES, width: 480, color: { dark: "#1d1c1aff", light: "#ffffffff" } });
}

/** A title cut at the last whole word that fits in `max` characters, with an ellipsis; whole when it fits. */
export function shortenAtWord(title: string, max = TITLE_MAX): string {
  const t = title.trim().replace(/\s+/g, " ");
  if (t.length <= max) return t;
  const cut = t.slice(0, max);
  const space = cut.lastIndexOf(" ");
  // One very long word: cut inside it rather than print nothing.
  const head = space >= max / 2 ? cut.slice(0, space) : cut.slice(0, max - 1);
  return `${head.replace(/[\s,;:.–—-]+$/, "")}…`;
}

const day = (iso: string) => {
  const d = parseISO(iso);
  return Number.isNaN(d.getTime()) ? iso : format(d, "d MMM yyyy");
};

/** One label's face, exactly BACK_LABEL_SIZE; used alone and on the sheet. */
function LabelFace({ meta, l, address: to }: { meta: DocMeta; l: LabelData; address: LabelAddress }) {
  const [w, h] = BACK_LABEL_SIZE;
  const pad = 11;
  // The code takes what the label can spare beside the text: about 36 mm square, quiet zone included.
  const qr = Math.min(104, h - 2 * pad - 62);
  const address = meta.studioAddress?.replace(/\s*\n\s*/g, ", ");
  return (
    <View style={{ width: w, height: h, padding: pad, flexDirection: "column", backgroundColor: "#ffffff" }}>
      <View style={{ flexDirection: "row", justifyContent: "space-between", borderBottomWidth: 0.75, borderBottomColor: ACCENT, paddingBottom: 3 }}>
        <View style={{ maxWidth: w - 2 * pad - 74 }}>
          <Text style={{ fontSize: 7.5, fontWeight: 700 }}>{meta.studioName}</Text>
          {address ? <Text style={{ fontSize: 5.5, color: GRAPHITE, marginTop: 1 }}>{address}</Text> : null}
          {meta.studioContact ? <Text style={{ fontSize: 5.5, color: GRAPHITE, marginTop: 0.5 }}>{meta.studioContact}</Text> : null}
        </View>
        <Text style={{ fontSize: 6, color: GRAPHITE }}>Code {meta.code}</Text>
      </View>
      <View style={{ flexDirection: "row", flexGrow: 1, marginTop: 4, alignItems: "flex-start" }}>
        <View style={{ flex: 1, paddingRight: 6 }}>
          <Text style={{ fontSize: 13, fontWeight: 700, color: INK, fontFeatureSettings: ["tnum" as const] }}>{l.objectNumber}</Text>
          <Text style={{ fontSize: 7, color: INK, marginTop: 1, lineHeight: 1.25 }}>{shortenAtWord(l.title)}</Text>
          <Text style={{ fontSize: 6.5, color: GRAPHITE, marginTop: 4 }}>{l.mountedOn ? `Mounted ${day(l.mountedOn)}` : "No completed mounting on record"}</Text>
          {l.summary ? <Text style={{ fontSize: 6.5, color: INK, marginTop: 2, lineHeight: 1.3 }}>{l.summary}</Text> : null}
        </View>
        <Link src={l.url} style={{ width: qr, height: qr }}>
          <Image src={l.qr} style={{ width: qr, height: qr }} />
        </Link>
      </View>
      <View style={{ borderTopWidth: 0.5, borderTopColor: STONE, paddingTop: 3 }}>
        {l.summary ? <Text style={{ fontSize: 7, fontWeight: 700, color: WARN }}>{REVERSIBLE_LINE}</Text> : null}
        <Text style={{ fontSize: 5.5, color: GRAPHITE, marginTop: 1.5 }}>Record (after sign-in): {l.url}</Text>
        <Text style={{ fontSize: 5.5, color: GRAPHITE, marginTop: 1 }}>Check this label: {verifyUrl(to.publicUrl, meta.code)} · Produced by Reversa</Text>
      </View>
    </View>
  );
}

export function BackLabelDocument({ meta, label, address }: { meta: DocMeta; label: LabelData; address: LabelAddress }) {
  return (
    <Document title={meta.title} author={meta.studioName} creator="Reversa" producer="Reversa">
      <Page size={BACK_LABEL_SIZE} style={{ fontFamily: "Libre Franklin", color: INK }}>
        <LabelFace meta={meta} l={label} address={address} />
      </Page>
    </Document>
  );
}

/** How labels sit on a sheet of paper: whole labels only, centred, at least SHEET_MIN_MARGIN from each edge. */
export function sheetGrid(paperSize: "A4" | "Letter") {
  const [pw, ph] = paperSize === "Letter" ? [612, 792] : [595.28, 841.89];
  const [w, h] = BACK_LABEL_SIZE;
  const cols = Math.floor((pw - 2 * SHEET_MIN_MARGIN) / w);
  const rows = Math.floor((ph - 2 * SHEET_MIN_MARGIN - 12) / h);
  return { pw, ph, w, h, cols, rows, perPage: cols * rows, left: (pw - cols * w) / 2, top: (ph - rows * h) / 2 };
}

/** A sheet of labels, each cell exactly the label's 100 × 70 mm, on the studio's paper: 8 to an A4 page, 6 to a Letter page; cut along the hairlines. */
export function LabelSheetDocument({ meta, labels, address }: { meta: DocMeta; labels: LabelData[]; address: LabelAddress }) {
  const g = sheetGrid(meta.paperSize);
  const pages: LabelData[][] = [];
  for (let i = 0; i < labels.length; i += g.perPage) pages.push(labels.slice(i, i + g.perPage));
  return (
    <Document title={meta.title} author={meta.studioName} creator="Reversa" producer="Reversa">
      {pages.map((p, pi) => (
        <Page key={pi} size={meta.paperSize === "Letter" ? "LETTER" : "A4"} style={{ fontFamily: "Libre Franklin", color: INK }}>
          <Text style={{ position: "absolute", top: Math.max(14, g.top - 10), left: g.left, right: g.left, fontSize: 6.5, color: GRAPHITE }}>
            {meta.studioName} · Sheet of back labels, each 100 × 70 mm · verification code {meta.code} · page {pi + 1} of {pages.length} · issued{" "}
            {format(meta.issuedAt, "d MMM yyyy")} · Produced by Reversa
          </Text>
          {p.map((l, i) => (
            <View key={l.objectId} style={{ position: "absolute", left: g.left + (i % g.cols) * g.w, top: g.top + Math.floor(i / g.cols) * g.h, width: g.w, height: g.h }}>
              <LabelFace meta={meta} l={l} address={address} />
            </View>
          ))}
          {/* Cut lines on the cells' edges, drawn over the labels so every label keeps its full size. */}
          {Array.from({ length: g.cols + 1 }, (_, c) => (
            <View key={`c${c}`} style={cutLine("Left", g.left + c * g.w, g.top, g.rows * g.h)} />
          ))}
          {Array.from({ length: g.rows + 1 }, (_, r) => (
            <View key={`r${r}`} style={cutLine("Top", g.top + r * g.h, g.left, g.cols * g.w)} />
          ))}
        </Page>
      ))}
    </Document>
  );
}
