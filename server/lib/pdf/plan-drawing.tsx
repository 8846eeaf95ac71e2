import { G, Line, Path, Polygon, Rect, Svg, Text as SvgText } from "@react-pdf/renderer";
import type { DrawingModel, Role } from "../../../shared/domain/mount-plan/drawing.ts";

/** PDF styles for the shared drawing model's roles: the same shapes the screen draws (src/components/plan-drawing.tsx). */
const STYLE: Record<Role, { fill?: string; stroke?: string; width?: number; dash?: string; opacity?: number; text?: string; weight?: number }> = {
  backing: { fill: "#e4ddd0", stroke: "#8a877f", width: 0.6 },
  sheet: { fill: "#fffdf8", stroke: "#5c5a56", width: 0.6 },
  image: { fill: "#f3eee4", stroke: "#a9a397", width: 0.4, dash: "3 2" },
  board: { fill: "#f1ece2", stroke: "#1d1c1a", width: 0.8 },
  "top-board": { fill: "#e9e2d4", stroke: "#1d1c1a", width: 0.8 },
  "sheet-hidden": { stroke: "#5c5a56", width: 0.6, dash: "5 3" },
  window: { stroke: "#1d1c1a", width: 1 },
  bevel: { stroke: "#bdb4a3", width: 0.6 },
  "band-pass": { fill: "#2e6a3c", opacity: 0.28 },
  "band-fail": { fill: "#9a2b2b", opacity: 0.4 },
  "band-float": { fill: "#8a877f", opacity: 0.28 },
  "band-label": { text: "#1d1c1a", weight: 600 },
  "border-label": { text: "#5c5a56", weight: 400 },
  "dim-line": { stroke: "#5c5a56", width: 0.6 },
  "dim-label": { text: "#3a3835", weight: 400 },
  hinge: { fill: "#e8d9a8", stroke: "#7f5300", width: 0.6 },
};

/** Draws the plan to scale in the PDF, `width` points wide. Strokes are scaled so they print as hairlines. */
export function PdfPlanDrawing({ model, width }: { model: DrawingModel; width: number }) {
  const [x, y, w, h] = model.viewBox;
  const height = (width * h) / w;
  const k = w / width; // mm per point: strokes are given in points
  const arrow = (x1: number, y1: number, x2: number, y2: number) => {
    const a = Math.atan2(y2 - y1, x2 - x1);
    const l = model.fontSize * 0.5;
    const p = (ang: number) => `${x2 - l * Math.cos(a - ang)},${y2 - l * Math.sin(a - ang)}`;
    return `${x2},${y2} ${p(0.4)} ${p(-0.4)}`;
  };
  return (
    <Svg width={width} height={height} viewBox={`${x} ${y} ${w} ${h}`}>
      {model.shapes.map((sh, i) => {
        const st = STYLE[sh.role];
        const stroke = st.stroke ? { stroke: st.stroke, strokeWidth: (st.width ?? 0.6) * k, ...(st.dash ? { strokeDasharray: st.dash.split(" ").map((d) => String(Number(d) * k)).join(" ") } : {}) } : {};
        if (sh.kind === "rect") return <Rect key={i} x={sh.x} y={sh.y} width={Math.max(0, sh.width)} height={Math.max(0, sh.height)} fill={st.fill ?? "none"} fillOpacity={st.opacity} {...stroke} />;
        if (sh.kind === "path") return <Path key={i} d={sh.d} fill={st.fill ?? "none"} fillRule="evenodd" {...stroke} />;
        if (sh.kind === "line")
          return (
            <G key={i}>
              <Line x1={sh.x1} y1={sh.y1} x2={sh.x2} y2={sh.y2} {...stroke} />
              {sh.arrows ? <Polygon points={arrow(sh.x1, sh.y1, sh.x2, sh.y2)} fill="#5c5a56" /> : null}
              {sh.arrows ? <Polygon points={arrow(sh.x2, sh.y2, sh.x1, sh.y1)} fill="#5c5a56" /> : null}
            </G>
          );
        return (
          <SvgText
            key={i}
            x={sh.x}
            y={sh.y}
            textAnchor={sh.anchor}
            fill={st.text}
            style={{ fontSize: sh.size, fontFamily: "Libre Franklin", fontWeight: st.weight }}
            transform={sh.rotate ? `rotate(${sh.rotate}, ${sh.x}, ${sh.y})` : undefined}
          >
            {sh.text}
          </SvgText>
        );
      })}
    </Svg>
  );
}
