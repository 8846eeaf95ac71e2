import { Fragment, useRef, type KeyboardEvent, type PointerEvent } from "react";
import type { DrawingModel } from "@shared/domain/mount-plan/drawing.ts";
import { ARROW_FILL, arrowMarkerScale, drawnRect, hatchSize, PLAN_STYLE, textRotation } from "@shared/drawing/plan-style.ts";

/** The image's hatch, from its style: the one role drawn with a pattern on screen. */
const HATCH = PLAN_STYLE.image.hatch!;

type Props = {
  model: DrawingModel;
  title: string;
  /** When given, hinges can be dragged (and moved with the arrow keys) along their edge; `delta` is in mm. */
  onHingeMove?: (index: number, deltaMm: number) => void;
  /** Edge of each hinge, so a drag moves it along its edge. */
  hingeEdges?: ("top" | "bottom" | "left" | "right")[];
};

export function PlanDrawing({ model, title, onHingeMove, hingeEdges = [] }: Props) {
  const [x, y, w, h] = model.viewBox;
  const hatch = hatchSize(model.fontSize);
  const svgRef = useRef<SVGSVGElement>(null);
  const drag = useRef<{ index: number; last: number } | null>(null);

  const pointInSvg = (e: PointerEvent) => {
    const svg = svgRef.current!;
    const m = svg.getScreenCTM();
    if (!m) return { x: 0, y: 0 };
    const p = new DOMPoint(e.clientX, e.clientY).matrixTransform(m.inverse());
    return { x: p.x, y: p.y };
  };
  const along = (index: number, p: { x: number; y: number }) => (hingeEdges[index] === "left" || hingeEdges[index] === "right" ? p.y : p.x);
  const onDown = (index: number) => (e: PointerEvent<SVGRectElement>) => {
    if (!onHingeMove) return;
    (e.target as Element).setPointerCapture(e.pointerId);
    drag.current = { index, last: along(index, pointInSvg(e)) };
  };
  const onMove = (e: PointerEvent<SVGRectElement>) => {
    const d = drag.current;
    if (!d || !onHingeMove) return;
    const pos = along(d.index, pointInSvg(e));
    const delta = Math.round(pos - d.last);
    if (delta !== 0) {
      onHingeMove(d.index, delta);
      d.last += delta;
    }
  };
  const onUp = () => {
    drag.current = null;
  };
  const onKey = (index: number) => (e: KeyboardEvent<SVGRectElement>) => {
    if (!onHingeMove) return;
    const step = e.shiftKey ? 10 : 1;
    const vertical = hingeEdges[index] === "left" || hingeEdges[index] === "right";
    const back = vertical ? "ArrowUp" : "ArrowLeft";
    const fwd = vertical ? "ArrowDown" : "ArrowRight";
    if (e.key === back || e.key === fwd) {
      e.preventDefault();
      onHingeMove(index, e.key === fwd ? step : -step);
    }
  };

  const drawShape = (s: DrawingModel["shapes"][number]) => {
    const st = PLAN_STYLE[s.role];
    const common = {
      fill: st.hatch ? "url(#rv-hatch)" : (st.fill ?? "none"),
      stroke: st.stroke,
      strokeWidth: st.width,
      strokeDasharray: st.dash,
      fillOpacity: st.opacity,
      vectorEffect: "non-scaling-stroke" as const,
    };
    if (s.kind === "rect" && s.role === "hinge" && s.hinge !== undefined && onHingeMove) {
      const n = s.hinge;
      return (
        <rect
          {...drawnRect(s)}
          {...common}
          data-role="hinge"
          data-hinge={n}
          tabIndex={0}
          role="slider"
          aria-label={`Hinge ${n + 1}: drag along the edge, or use the arrow keys (Shift for 10 mm)`}
          aria-valuenow={Math.round(hingeEdges[n] === "left" || hingeEdges[n] === "right" ? s.y : s.x)}
          className="cursor-grab focus:outline-none focus-visible:stroke-accent"
          style={{ touchAction: "none" }}
          onPointerDown={onDown(n)}
          onPointerMove={onMove}
          onPointerUp={onUp}
          onPointerCancel={onUp}
          onKeyDown={onKey(n)}
        />
      );
    }
    if (s.kind === "rect") return <rect {...drawnRect(s)} {...common} data-role={s.role} data-side={s.side} data-hinge={s.hinge} />;
    if (s.kind === "path") return <path d={s.d} fillRule="evenodd" {...common} />;
    if (s.kind === "line")
      return <line x1={s.x1} y1={s.y1} x2={s.x2} y2={s.y2} {...common} markerStart={s.arrows ? "url(#rv-arrow)" : undefined} markerEnd={s.arrows ? "url(#rv-arrow)" : undefined} />;
    return (
      <text
        x={s.x}
        y={s.y}
        fontSize={s.size}
        textAnchor={s.anchor}
        fill={st.text}
        fontWeight={st.weight}
        dominantBaseline={s.rotate ? "middle" : undefined}
        transform={textRotation(s, " ")}
        style={{ fontVariantNumeric: "tabular-nums" }}
      >
        {s.text}
      </text>
    );
  };

  return (
    <svg ref={svgRef} viewBox={`${x} ${y} ${w} ${h}`} role="img" aria-label={title} className="h-auto max-h-[70vh] w-full print:max-h-[76mm]" data-testid="plan-drawing">
      <title>{title}</title>
      <defs>
        <pattern id="rv-hatch" width={hatch.cell} height={hatch.cell} patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <rect width="100%" height="100%" fill={HATCH.ground} />
          <line x1="0" y1="0" x2="0" y2={hatch.cell} stroke={HATCH.line} strokeWidth={hatch.line} />
        </pattern>
        <marker id="rv-arrow" viewBox="0 0 10 10" refX="9" refY="5" markerWidth="7" markerHeight="7" orient="auto-start-reverse" markerUnits="userSpaceOnUse">
          <path d="M0 1 L10 5 L0 9 z" fill={ARROW_FILL} transform={`scale(${arrowMarkerScale(model.fontSize)})`} />
        </marker>
      </defs>
      {model.shapes.map((s, i) => (
        // biome-ignore lint/suspicious/noArrayIndexKey: the scene is derived afresh from the plan on every render; a shape's place in it is its identity
        <Fragment key={i}>{drawShape(s)}</Fragment>
      ))}
    </svg>
  );
}
