import { Document, Image, Link, Page, View } from "@react-pdf/renderer";
import { Text } from "../../lib/pdf/text.tsx";
import { format, parseISO } from "date-fns";
import QRCode from "qrcode";
import type { DocMeta } from "../../lib/pdf/layout.tsx";
import { ACCENT, GRAPHITE, INK, STONE, WARN } from "../../lib/pdf/theme.ts";

/** 100 × 70 mm in points (1 in = 25.4 mm = 72 pt). */
export const BACK_LABEL_SIZE: [number, number] = [(100 / 25.4) * 72, (70 / 25.4) * 72];
export const REVERSIBLE_LINE = "Reversible mount — do not use pressure-sensitive tape";

export type LabelData = {
  objectId: string;
  objectNumber: string;
  title: string;
  mountedOn: string | null;
  summary: string | null;
  url: string;
  qr: string;
};

/** The object's record, opened after sign-in. */
export function objectUrl(publicUrl: string, objectId: string): string {
  return `${publicUrl.replace(/\/+$/, "")}/objects/${encodeURIComponent(objectId)}`;
}

export async function qrFor(url: string): Promise<string> {
  return QRCode.toDataURL(url, { errorCorrectionLevel: "M", margin: 1, width: 300, color: { dark: "#1d1c1aff", light: "#ffffffff" } });
}

const day = (iso: string) => {
  try {
    return format(parseISO(iso), "d MMM yyyy");
  } catch {
    return iso;
  }
};

/** One label's face, `w` × `h` points; used alone and on the sheet. */
function LabelFace({ meta, l, w, h }: { meta: DocMeta; l: LabelData; w: number; h: number }) {
  const pad = 12;
  const qr = Math.min(78, h - 2 * pad - 40);
  return (
    <View style={{ width: w, height: h, padding: pad, flexDirection: "column", justifyContent: "space-between", backgroundColor: "#ffffff" }}>
      <View style={{ flexDirection: "row", justifyContent: "space-between", borderBottomWidth: 0.75, borderBottomColor: ACCENT, paddingBottom: 3 }}>
        <Text style={{ fontSize: 7.5, fontWeight: 700, maxWidth: w - 2 * pad - 70 }}>{meta.studioName}</Text>
        <Text style={{ fontSize: 6, color: GRAPHITE }}>Code {meta.code}</Text>
      </View>
      <View style={{ flexDirection: "row", flexGrow: 1, marginTop: 5 }}>
        <View style={{ flex: 1, paddingRight: 8 }}>
          <Text style={{ fontSize: 13, fontWeight: 700, color: INK, fontFeatureSettings: ["tnum" as const] }}>{l.objectNumber}</Text>
          <Text style={{ fontSize: 7, color: INK, marginTop: 1 }}>{l.title.length > 70 ? `${l.title.slice(0, 68)}…` : l.title}</Text>
          <Text style={{ fontSize: 6.5, color: GRAPHITE, marginTop: 4 }}>{l.mountedOn ? `Mounted ${day(l.mountedOn)}` : "No completed mounting on record"}</Text>
          {l.summary ? <Text style={{ fontSize: 6.5, color: INK, marginTop: 2, lineHeight: 1.3 }}>{l.summary}</Text> : null}
        </View>
        <Link src={l.url} style={{ width: qr, alignItems: "center" }}>
          <Image src={l.qr} style={{ width: qr, height: qr }} />
        </Link>
      </View>
      <View>
        <Text style={{ fontSize: 7, fontWeight: 700, color: WARN, borderTopWidth: 0.5, borderTopColor: STONE, paddingTop: 3 }}>{REVERSIBLE_LINE}</Text>
        <Text style={{ fontSize: 5.5, color: GRAPHITE, marginTop: 1.5 }}>
          {l.url} · opens the record after sign-in · Produced by Reversa
        </Text>
      </View>
    </View>
  );
}

export function BackLabelDocument({ meta, label }: { meta: DocMeta; label: LabelData }) {
  const [w, h] = BACK_LABEL_SIZE;
  return (
    <Document title={meta.title} author={meta.studioName} creator="Reversa" producer="Reversa">
      <Page size={BACK_LABEL_SIZE} style={{ fontFamily: "Libre Franklin", color: INK }}>
        <LabelFace meta={meta} l={label} w={w} h={h} />
      </Page>
    </Document>
  );
}

/** A sheet of up to 8 labels per page in a 2 × 4 grid, on the studio's paper size; cut along the hairlines. */
export function LabelSheetDocument({ meta, labels }: { meta: DocMeta; labels: LabelData[] }) {
  const [pw, ph] = meta.paperSize === "Letter" ? [612, 792] : [595.28, 841.89];
  const mx = 14;
  const top = 26;
  const bottom = 14;
  const w = (pw - 2 * mx) / 2;
  const h = (ph - top - bottom) / 4;
  const pages: LabelData[][] = [];
  for (let i = 0; i < labels.length; i += 8) pages.push(labels.slice(i, i + 8));
  return (
    <Document title={meta.title} author={meta.studioName} creator="Reversa" producer="Reversa">
      {pages.map((p, pi) => (
        <Page key={pi} size={meta.paperSize === "Letter" ? "LETTER" : "A4"} style={{ fontFamily: "Libre Franklin", color: INK, paddingTop: top, paddingHorizontal: mx, paddingBottom: bottom }}>
          <Text style={{ position: "absolute", top: 10, left: mx, right: mx, fontSize: 6.5, color: GRAPHITE }}>
            {meta.studioName} · Sheet of back labels · verification code {meta.code} · page {pi + 1} of {pages.length} · issued {format(meta.issuedAt, "d MMM yyyy")} · Produced by Reversa
          </Text>
          <View style={{ flexDirection: "row", flexWrap: "wrap" }}>
            {p.map((l) => (
              <View key={l.objectId} style={{ width: w, height: h, borderWidth: 0.4, borderColor: STONE, borderStyle: "dashed" }}>
                <LabelFace meta={meta} l={l} w={w - 0.8} h={h - 0.8} />
              </View>
            ))}
          </View>
        </Page>
      ))}
    </Document>
  );
}
