import type { ReactNode } from "react";
import { Path, Polygon, Svg, View } from "@react-pdf/renderer";
import { Text } from "./text.tsx";
import { RATING_LABELS, type Rating } from "../../../shared/schemas/condition.ts";
import type { Verdict } from "../../../shared/schemas/mount-plan.ts";
import type { ComparisonStatus } from "../../../shared/domain/condition.ts";
import { FAIL, GRAPHITE, INK, PASS, STONE, WARN, s } from "./theme.ts";
import type { Styles } from "@react-pdf/renderer";

/** A react-pdf style object. */
export type Style = Styles[string];

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
      {typeof children === "string" ? (
        <Lines text={children} style={{ flex: 1 }} />
      ) : typeof children === "number" ? (
        <Text style={{ flex: 1 }}>{children}</Text>
      ) : (
        <View style={{ flex: 1 }}>{children}</View>
      )}
    </View>
  );
}

/** Label–value rows with one label width; as with KV, a row without a value is left out. */
export function KVRows({ rows, labelWidth }: { rows: [label: string, value: ReactNode][]; labelWidth?: number }) {
  return (
    <>
      {rows.map(([label, value]) => (
        <KV key={label} label={label} labelWidth={labelWidth}>
          {value}
        </KV>
      ))}
    </>
  );
}

/** A simple table: column widths in points or flex weights. With `empty`, no rows is that sentence instead of an empty table. */
export function Table({ cols, rows, empty }: { cols: { label: string; width?: number; flex?: number; align?: "left" | "right" }[]; rows: ReactNode[][]; empty?: string }) {
  if (empty !== undefined && rows.length === 0) return <Text style={para}>{empty}</Text>;
  const style = (i: number) => {
    const c = cols[i];
    return { ...t.cell, ...(c?.width ? { width: c.width } : { flex: c?.flex ?? 1 }), textAlign: c?.align ?? "left" } as Style;
  };
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

export function Caution({ children }: { children: ReactNode }) {
  return (
    <View style={s.caution} wrap={false}>
      {typeof children === "string" ? <Lines text={children} /> : <Text>{children}</Text>}
    </View>
  );
}
