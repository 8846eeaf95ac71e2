import type { DrawingModel, Role } from "@shared/domain/mount-plan/drawing.ts";

/** Screen styles for the shared drawing model's roles (the PDF renderer maps the same roles). */
const STYLE: Record<Role, { fill?: string; stroke?: string; width?: number; dash?: string; opacity?: number; text?: string; weight?: number }> = {
  backing: { fill: "#e4ddd0", stroke: "#8a877f", width: 0.75 },
  sheet: { fill: "#fffdf8", stroke: "#5c5a56", width: 0.75 },
  image: { fill: "url(#rv-hatch)", stroke: "#a9a397", width: 0.5, dash: "3 2" },
  board: { fill: "#f1ece2", stroke: "#1d1c1a", width: 1 },
  "top-board": { fill: "#e9e2d4", stroke: "#1d1c1a", width: 1 },
  "sheet-hidden": { fill: "none", stroke: "#5c5a56", width: 0.75, dash: "5 3" },
  window: { fill: "none", stroke: "#1d1c1a", width: 1.25 },
  bevel: { fill: "none", stroke: "#bdb4a3", width: 0.75 },
  "band-pass": { fill: "#2e6a3c", opacity: 0.28 },
  "band-fail": { fill: "#9a2b2b", opacity: 0.4 },
  "band-float": { fill: "#8a877f", opacity: 0.28 },
  "band-label": { text: "#1d1c1a", weight: 600 },
  "border-label": { text: "#5c5a56", weight: 500 },
  "dim-line": { stroke: "#5c5a56", width: 0.75 },
  "dim-label": { text: "#3a3835", weight: 500 },
  hinge: { fill: "#e8d9a8", stroke: "#7f5300", width: 0.75, opacity: 0.95 },
};

export function PlanDrawing({ model, title }: { model: DrawingModel; title: string }) {
  const [x, y, w, h] = model.viewBox;
  return (
    <svg viewBox={`${x} ${y} ${w} ${h}`} role="img" aria-label={title} className="h-auto max-h-[70vh] w-full print:max-h-[76mm]" data-testid="plan-drawing">
      <title>{title}</title>
      <defs>
        <pattern id="rv-hatch" width={model.fontSize * 0.6} height={model.fontSize * 0.6} patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <rect width="100%" height="100%" fill="#fbf8f2" />
          <line x1="0" y1="0" x2="0" y2={model.fontSize * 0.6} stroke="#d8d0c1" strokeWidth={model.fontSize * 0.08} />
        </pattern>
        <marker id="rv-arrow" viewBox="0 0 10 10" refX="9" refY="5" markerWidth="7" markerHeight="7" orient="auto-start-reverse" markerUnits="userSpaceOnUse">
          <path d="M0 1 L10 5 L0 9 z" fill="#5c5a56" transform={`scale(${model.fontSize / 12})`} />
        </marker>
      </defs>
      {model.shapes.map((s, i) => {
        const st = STYLE[s.role];
        const common = {
          fill: st.fill ?? "none",
          stroke: st.stroke,
          strokeWidth: st.width,
          strokeDasharray: st.dash,
          fillOpacity: st.opacity,
          vectorEffect: "non-scaling-stroke" as const,
        };
        if (s.kind === "rect") return <rect key={i} x={s.x} y={s.y} width={Math.max(0, s.width)} height={Math.max(0, s.height)} {...common} data-role={s.role} data-side={s.side} />;
        if (s.kind === "path") return <path key={i} d={s.d} fillRule="evenodd" {...common} />;
        if (s.kind === "line")
          return <line key={i} x1={s.x1} y1={s.y1} x2={s.x2} y2={s.y2} {...common} markerStart={s.arrows ? "url(#rv-arrow)" : undefined} markerEnd={s.arrows ? "url(#rv-arrow)" : undefined} />;
        return (
          <text
            key={i}
            x={s.x}
            y={s.y}
            fontSize={s.size}
            textAnchor={s.anchor}
            fill={st.text}
            fontWeight={st.weight}
            dominantBaseline={s.rotate ? "middle" : undefined}
            transform={s.rotate ? `rotate(${s.rotate} ${s.x} ${s.y})` : undefined}
            style={{ fontVariantNumeric: "tabular-nums" }}
          >
            {s.text}
          </text>
        );
      })}
    </svg>
  );
}
