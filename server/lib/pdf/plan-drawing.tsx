// biome-ignore lint/style/noRestrictedImports: SVG text inside the drawing, which react-pdf sets with the document font
import { G, Line, Path, Polygon, Rect, Svg, Text as SvgText } from "@react-pdf/renderer";
import type { DrawingModel } from "../../../shared/domain/mount-plan/drawing.ts";
import { ARROW_FILL, arrowHeadPoints, drawnRect, LINE, PRINT_LINE_SCALE, PRINT_STYLE, scaledDash, textRotation } from "../../../shared/drawing/plan-style.ts";

/**
 * Draws the plan to scale in the PDF, `width` points wide, in the same style as the screen
 * (shared/drawing/plan-style.ts, as printed). Strokes are scaled so they print as hairlines.
 */
export function PdfPlanDrawing({ model, width }: { model: DrawingModel; width: number }) {
  const [x, y, w, h] = model.viewBox;
  const height = (width * h) / w;
  const k = w / width; // mm per point: strokes are given in points
  return (
    <Svg width={width} height={height} viewBox={`${x} ${y} ${w} ${h}`}>
      {model.shapes.map((sh, i) => {
        const st = PRINT_STYLE[sh.role];
        const stroke = st.stroke
          ? { stroke: st.stroke, strokeWidth: (st.width ?? LINE.fine * PRINT_LINE_SCALE) * k, ...(st.dash ? { strokeDasharray: scaledDash(st.dash, k) } : {}) }
          : {};
        if (sh.kind === "rect") return <Rect key={i} {...drawnRect(sh)} fill={st.fill ?? "none"} fillOpacity={st.opacity} {...stroke} />;
        if (sh.kind === "path") return <Path key={i} d={sh.d} fill={st.fill ?? "none"} fillRule="evenodd" {...stroke} />;
        if (sh.kind === "line")
          return (
            <G key={i}>
              <Line x1={sh.x1} y1={sh.y1} x2={sh.x2} y2={sh.y2} {...stroke} />
              {sh.arrows ? <Polygon points={arrowHeadPoints(sh.x1, sh.y1, sh.x2, sh.y2, model.fontSize)} fill={ARROW_FILL} /> : null}
              {sh.arrows ? <Polygon points={arrowHeadPoints(sh.x2, sh.y2, sh.x1, sh.y1, model.fontSize)} fill={ARROW_FILL} /> : null}
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
            transform={textRotation(sh, ", ")}
          >
            {sh.text}
          </SvgText>
        );
      })}
    </Svg>
  );
}
