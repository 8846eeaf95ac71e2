import fs from "node:fs";
import { Image, View } from "@react-pdf/renderer";
import { Text } from "../../lib/pdf/text.tsx";
import type { Config } from "../../lib/config.ts";
import { SEVERITY_LABELS, ZONE_LABELS, type ConditionData, type ConditionReport, type Finding } from "../../../shared/schemas/condition.ts";
import { BOARD_GRADE_LABELS, type Board } from "../../../shared/schemas/mountings.ts";
import type { ObjectRecord } from "../../../shared/schemas/objects.ts";
import { formatMoney } from "../../../shared/domain/money.ts";
import { VALUATION_BASIS_LABELS } from "../../../shared/schemas/objects.ts";
import { createStorage } from "../../lib/storage.ts";
import { ACCENT, STONE, s } from "../../lib/pdf/theme.ts";
import type { PhotoRow } from "../photos/photos.repo.ts";
import { Table } from "../../lib/pdf/blocks.tsx";

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
        <View
          key={m.n}
          style={{
            position: "absolute",
            left: m.x * w - d / 2,
            top: m.y * h - d / 2,
            width: d,
            height: d,
            borderRadius: d / 2,
            backgroundColor: ACCENT,
            borderWidth: 1.2,
            borderColor: "#ffffff",
            justifyContent: "center",
            alignItems: "center",
          }}
        >
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
  return (
    <Table
      empty="No findings were recorded."
      cols={[
        { label: "No.", width: 24 },
        { label: "Finding", flex: 1.2 },
        { label: "Where", flex: 1.2 },
        { label: "Extent", flex: 1 },
        { label: "Severity", width: 60 },
        { label: "Notes", flex: 2 },
      ]}
      rows={data.findings.map((f, i) => [
        String(i + 1),
        f.term + (f.resolved ? " (resolved)" : ""),
        whereWords(f, photoNumber),
        f.extent ?? "",
        SEVERITY_LABELS[f.severity],
        f.notes ?? "",
      ])}
    />
  );
}

/** The photos of a report with their markers, two to a row. */
export function PhotoGrid({ photos, data, columnWidth }: { photos: LoadedPhoto[]; data: ConditionData; columnWidth: number }) {
  return (
    <View style={{ flexDirection: "row", flexWrap: "wrap", justifyContent: "space-between" }}>
      {photos.map((p, i) => {
        const markers = data.findings.flatMap((f, fi) =>
          f.location.kind === "marker" && f.location.photoId === p.row.id ? [{ n: fi + 1, x: f.location.x, y: f.location.y }] : [],
        );
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

/** The report's recommendations with their labels, the referral to a conservator last, leaving out the empty ones. */
export function recommendationRows(d: ConditionReport["current"]["data"]): [string, string][] {
  const r = d.recommendations;
  const rows: [string, string | null][] = [
    ["Display", r.display],
    ["Handling", r.handling],
    ["Environment", r.environment],
    ["Light", d.lightNotes],
    ["Referral to a conservator", r.referral],
  ];
  return rows.filter((x): x is [string, string] => !!x[1]);
}

/** A board as one line: grade, thickness, buffering, colour, maker, batch and the PAT result. */
export const boardLine = (b: Board) =>
  [BOARD_GRADE_LABELS[b.grade], `${b.ply}-ply`, b.buffered ? "buffered" : "unbuffered", b.colour, b.maker, b.batch && `batch ${b.batch}`, b.patPassed ? "PAT passed" : null]
    .filter(Boolean)
    .join(" · ");
