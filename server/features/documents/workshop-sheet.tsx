// biome-ignore lint/style/noRestrictedImports: SVG text inside the drawing, which react-pdf sets with the document font
import { Rect, Svg, Text as SvgText, View } from "@react-pdf/renderer";
import { Text } from "../../lib/pdf/text.tsx";
import { Mark } from "../../lib/pdf/blocks.tsx";
import type { Db } from "../../db/client.ts";
import type { Board } from "../../../shared/schemas/mountings.ts";
import { ADHESIVE_LABELS, ATTACHMENT_METHOD_LABELS, GLAZING_TYPE_LABELS, MOUNTING_STATUS_LABELS } from "../../../shared/schemas/mountings.ts";
import { lengthText } from "../../../shared/domain/mount-plan/index.ts";
import { cuttingList, STANDARD_BOARD_SHEETS } from "../../../shared/domain/mount-plan/index.ts";
import type { CuttingList } from "../../../shared/domain/mount-plan/yield.ts";
import { mountSummary } from "../../../shared/domain/mounting.ts";
import { HEAVY_PACKAGE_KG } from "../../../shared/domain/mount-plan/constants.ts";
import { formatSize, type Unit } from "../../../shared/domain/units.ts";
import { DocShell, type DocMeta } from "../../lib/pdf/layout.tsx";
import { ACCENT, GRAPHITE, INK, STONE, s } from "../../lib/pdf/theme.ts";
import { getSettings } from "../settings/settings.repo.ts";
import type { MountingDetail } from "../mountings/mounting-detail.ts";

export function summaryOf(d: MountingDetail, vocabulary: "mount" | "mat"): string | null {
  return d.result.ok ? mountSummary(d.data, d.result.plan, { window: vocabulary === "mat" ? "opening" : "window" }) : null;
}

const boardLabel = (b: Board) =>
  `${b.grade === "museum" ? "Museum cotton" : b.grade === "conservation" ? "Conservation" : "Other board"} ${b.ply}-ply, ${b.buffered ? "buffered" : "unbuffered"}${b.colour ? `, ${b.colour}` : ""}`;

export type WorkshopItem = { objectNumber: string; title: string; detail: MountingDetail };
export type BoardGroup = { board: string; pieces: { label: string; w: number; h: number }[]; list: CuttingList };
export type WorkshopData = {
  items: WorkshopItem[];
  sheet: (typeof STANDARD_BOARD_SHEETS)[number];
  groups: BoardGroup[];
  unit: Unit;
  glass: boolean;
  heavy: boolean;
};

/** Packs each board kind's outer sizes onto full sheets: boards of different grade, ply or colour never share a sheet. */
export function workshopData(db: Db, items: WorkshopItem[], sheetId: string | undefined): WorkshopData {
  const sheet = STANDARD_BOARD_SHEETS.find((x) => x.id === sheetId) ?? STANDARD_BOARD_SHEETS[0];
  const byBoard = new Map<string, { label: string; w: number; h: number; kerf: number }[]>();
  let glass = false;
  let heavy = false;
  for (const it of items) {
    const r = it.detail.result;
    if (!r.ok) continue;
    const g = r.geometry;
    if (g.glazing.material === "glass") glass = true;
    if ((g.package.weightKg ?? 0) >= HEAVY_PACKAGE_KG) heavy = true;
    const boards: [string, Board | undefined][] = [
      ["window", it.detail.data.boards.window],
      ["backing", it.detail.data.boards.backing],
      ["top", it.detail.data.boards.top],
    ];
    for (const [role, b] of boards) {
      if (!b) continue;
      const key = boardLabel(b);
      const list = byBoard.get(key) ?? [];
      list.push({ label: `${it.objectNumber} ${role}`, w: g.outer.width, h: g.outer.height, kerf: g.yield?.kerf ?? 0 });
      byBoard.set(key, list);
    }
  }
  const groups: BoardGroup[] = [...byBoard.entries()].map(([board, pieces]) => ({
    board,
    pieces,
    list: cuttingList(
      pieces.map((p, i) => ({ id: String(i), label: p.label, width: p.w, height: p.h, quantity: 1 })),
      { width: sheet.width, height: sheet.height },
      Math.max(0, ...pieces.map((p) => p.kerf)),
    ),
  }));
  return { items, sheet, groups, unit: getSettings(db).unit, glass, heavy };
}

const cell = { fontSize: 8 } as const;
const tab = { fontFeatureSettings: ["tnum" as const] };

function Pair({ label, value }: { label: string; value: string | null | undefined }) {
  if (!value) return null;
  return (
    <View style={{ flexDirection: "row", paddingVertical: 1.5 }}>
      <Text style={[cell, { width: 70, color: GRAPHITE }]}>{label}</Text>
      <Text style={[cell, tab, { flex: 1 }]}>{value}</Text>
    </View>
  );
}

function MountingBlock({ it, unit }: { it: WorkshopItem; unit: Unit }) {
  const { data, result, row } = it.detail;
  const d = result.ok ? result.plan.display : null;
  // Lengths outside the plan's figures (hinges, thicknesses) in the same unit, on the same grid.
  const len = (mm: number) => lengthText(mm, unit);
  const boards = (["window", "backing", "top"] as const)
    .map((role) => (data.boards[role] ? `${role}: ${boardLabel(data.boards[role]!)}${data.boards[role]!.batch ? ` · batch ${data.boards[role]!.batch}` : ""}` : null))
    .filter(Boolean)
    .join("\n");
  const a = data.attachment;
  const attachment = [ATTACHMENT_METHOD_LABELS[a.method], a.tissue, a.adhesive ? ADHESIVE_LABELS[a.adhesive] : null].filter(Boolean).join(" · ");
  const hinges = a.hinges.map((h, i) => `${i + 1}. ${h.edge}, ${len(h.offsetMm)} from the corner, ${len(h.widthMm)} wide`).join("\n");
  const spacer = result.ok && result.geometry.spacerDepth > 0 ? len(result.geometry.spacerDepth) : null;
  const glazing = `${GLAZING_TYPE_LABELS[data.glazing.type]}${data.glazing.type !== "none" && d ? `, cut ${d.glazing}` : ""}${data.glazing.thicknessMm ? `, ${len(data.glazing.thicknessMm)} thick` : ""}`;
  return (
    <View style={{ borderBottomWidth: 0.5, borderBottomColor: STONE, paddingVertical: 6 }} wrap={false}>
      <View style={{ flexDirection: "row", justifyContent: "space-between", gap: 10, marginBottom: 3 }}>
        <Text style={{ fontSize: 10, fontWeight: 700, color: ACCENT, flex: 1 }}>
          {it.objectNumber} <Text style={{ color: INK, fontWeight: 400 }}>· {it.title}</Text>
        </Text>
        <Text style={[s.small, { width: 150, textAlign: "right" }]}>
          Revision {row.currentRevision} · {MOUNTING_STATUS_LABELS[row.status as keyof typeof MOUNTING_STATUS_LABELS] ?? row.status} · {row.framerName}
        </Text>
      </View>
      {d ? (
        <View style={{ flexDirection: "row", gap: 14 }}>
          <View style={{ flex: 1 }}>
            <Pair label="Sheet" value={d.sheet} />
            <Pair label="Window" value={d.aperture} />
            <Pair label="Outer" value={d.outer} />
            <Pair label="Borders" value={`left ${d["borders.left"]} · top ${d["borders.top"]} · right ${d["borders.right"]} · bottom ${d["borders.bottom"]}`} />
            <Pair label="Overlap" value={`left ${d["overlap.left"]} · top ${d["overlap.top"]} · right ${d["overlap.right"]} · bottom ${d["overlap.bottom"]}`} />
            <Pair label="Rebate" value={d.rebate} />
            <Pair label="Glazing" value={glazing} />
            {spacer ? <Pair label="Spacer" value={`${spacer} deep`} /> : null}
          </View>
          <View style={{ flex: 1 }}>
            <Pair label="Attachment" value={attachment} />
            {hinges ? <Pair label="Hinges" value={hinges} /> : null}
            <Pair label="Boards" value={boards} />
            {data.undoNotes ? <Pair label="To undo" value={data.undoNotes} /> : null}
          </View>
        </View>
      ) : (
        <Text style={[cell, { color: "#9a2b2b" }]}>
          The plan of this record cannot be computed: {Object.values((result as { fields: Record<string, string> }).fields).join(" ")}
        </Text>
      )}
      {result.ok && result.plan.level === "fail" ? (
        <View style={{ flexDirection: "row", marginTop: 2 }}>
          <Mark verdict="fail" />
          <Text style={[cell, { color: "#9a2b2b", marginLeft: 3, flex: 1 }]}>
            Fails a conservation check:{" "}
            {result.plan.checks
              .filter((c) => c.verdict === "fail")
              .map((c) => c.reason)
              .join(" ")}
          </Text>
        </View>
      ) : null}
    </View>
  );
}

/** A board sheet to scale with its pieces, each numbered as in the list beside it. */
function SheetDiagram({ sheet, placements }: { sheet: { width: number; height: number }; placements: { pieceId: string; x: number; y: number; width: number; height: number }[] }) {
  const W = 150;
  const H = (W * sheet.height) / sheet.width;
  const k = sheet.width / W;
  return (
    <Svg width={W} height={H} viewBox={`${-k} ${-k} ${sheet.width + 2 * k} ${sheet.height + 2 * k}`}>
      <Rect x={0} y={0} width={sheet.width} height={sheet.height} fill="#e6dfd1" stroke={GRAPHITE} strokeWidth={0.8 * k} />
      {placements.map((p, i) => (
        <Rect key={i} x={p.x} y={p.y} width={p.width} height={p.height} fill="#fffdf8" stroke={INK} strokeWidth={0.7 * k} />
      ))}
      {placements.map((p, i) => {
        // The number is as large as the piece allows, from 5 to 9 pt.
        const size = Math.max(5, Math.min(9, Math.min(p.width, p.height) / k / 2.2)) * k;
        return (
          <SvgText
            key={`n${i}`}
            x={p.x + p.width / 2}
            y={p.y + p.height / 2 + size * 0.35}
            textAnchor="middle"
            fill={INK}
            style={{ fontSize: size, fontFamily: "Libre Franklin", fontWeight: 700 }}
          >
            {String(i + 1)}
          </SvgText>
        );
      })}
    </Svg>
  );
}

/** Room for a board's heading line and one sheet drawn 150 pt wide (a tall sheet is about 190 pt high). */
const FIRST_SHEET_PT = 230;

export function WorkshopSheetDocument({ meta, data }: { meta: DocMeta; data: WorkshopData }) {
  // The board sheet in the studio's unit, like every other length on the sheet.
  const sheetSize = formatSize(data.sheet.width, data.sheet.height, data.unit, { denominator: 64 });
  const sheetCount = data.groups.reduce((n, g) => n + g.list.sheetCount, 0);
  return (
    <DocShell meta={meta}>
      <Text style={s.h1}>Workshop sheet</Text>
      <Text style={{ fontSize: 9, lineHeight: 1.4, marginBottom: 4 }}>
        {data.items.length} mounting{data.items.length === 1 ? "" : "s"} · cutting list on {sheetSize} sheets · {sheetCount} full sheet{sheetCount === 1 ? "" : "s"} in all
      </Text>

      <View style={s.caution} wrap={false}>
        <Text style={{ fontWeight: 700, marginBottom: 2 }}>Caution · blades{data.glass ? " and glass" : ""} cut</Text>
        <Text style={{ fontSize: 9, lineHeight: 1.35 }}>
          Wear cut-resistant gloves and eye protection when cutting board{data.glass ? " and glass" : ""}. Change mount-cutter blades with the blade guard on, and put used blades
          {data.glass ? " and glass offcuts" : ""} in a sharps container, never in the general bin.
          {data.heavy ? " A frame here is heavy: lift it with two people and never by the top rail." : ""}
        </Text>
      </View>

      <Text style={s.h2}>Mountings</Text>
      {data.items.map((it) => (
        <MountingBlock key={it.detail.row.id} it={it} unit={data.unit} />
      ))}

      {/* No forced page break: the list follows on where there is room instead of leaving half a page empty
          behind the last mounting, and the heading moves on unless a board's first sheet fits under it. */}
      <Text style={s.h2} minPresenceAhead={FIRST_SHEET_PT}>
        Cutting list
      </Text>
      {data.groups.length === 0 ? <Text style={{ fontSize: 9, lineHeight: 1.4, marginBottom: 4 }}>No board to cut: none of these plans could be computed.</Text> : null}
      {data.groups.map((g) => {
        const [first, ...rest] = g.list.sheets;
        const sheetRow = (sh: (typeof g.list.sheets)[number]) => (
          <View key={sh.index} style={{ flexDirection: "row", gap: 12, paddingVertical: 4, borderBottomWidth: 0.4, borderBottomColor: STONE }} wrap={false}>
            <SheetDiagram sheet={data.sheet} placements={sh.placements} />
            <View style={{ flex: 1 }}>
              <View style={{ flexDirection: "row", marginBottom: 2 }}>
                <Text style={[cell, { fontWeight: 600, flex: 1 }]}>
                  Sheet {sh.index + 1} · {sheetSize}
                </Text>
                <Text style={[cell, tab, { width: 90, textAlign: "right" }]}>{(sh.utilisation * 100).toFixed(1)} % used</Text>
              </View>
              {sh.placements.map((p, i) => {
                const piece = g.pieces[Number(p.pieceId)];
                return (
                  <View key={i} style={{ flexDirection: "row", paddingVertical: 1 }}>
                    <Text style={[cell, tab, { width: 16, fontWeight: 700 }]}>{i + 1}</Text>
                    <Text style={[cell, { flex: 1 }]}>{piece?.label ?? p.pieceId}</Text>
                    <Text style={[cell, tab, { width: 110, textAlign: "right" }]}>{formatSize(p.width, p.height, data.unit, { denominator: 64 })}</Text>
                    <Text style={[cell, tab, { width: 60, textAlign: "right", color: GRAPHITE }]}>{p.rotated ? "turned" : ""}</Text>
                  </View>
                );
              })}
            </View>
          </View>
        );
        return (
          <View key={g.board} style={{ marginBottom: 8 }}>
            {/* The board's heading line never ends a page: it stays with the board's first sheet. */}
            <View wrap={false}>
              <View style={{ flexDirection: "row", justifyContent: "space-between", borderBottomWidth: 0.75, borderBottomColor: INK, paddingBottom: 2, marginBottom: 3 }}>
                <Text style={{ fontSize: 9, fontWeight: 700 }}>{g.board}</Text>
                <Text style={[cell, tab]}>
                  {g.list.sheetCount} sheet{g.list.sheetCount === 1 ? "" : "s"} · shaded: offcut · utilisation {(g.list.utilisation * 100).toFixed(1)} %
                </Text>
              </View>
              {first ? sheetRow(first) : null}
            </View>
            {rest.map(sheetRow)}
            {g.list.unplaced.map((u) => (
              <Text key={u.id} style={[cell, { color: "#9a2b2b" }]}>
                {g.pieces[Number(u.id)]?.label}: {u.reason}
              </Text>
            ))}
          </View>
        );
      })}
    </DocShell>
  );
}
