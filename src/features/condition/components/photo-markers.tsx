import { useRef, type PointerEvent } from "react";

export type Marker = { id: string; n: number; x: number; y: number; tone: "slight" | "moderate" | "severe" | "critical" };
type Props = {
  src: string;
  alt: string;
  markers: Marker[];
  editable?: boolean;
  selectedId?: string | null;
  onAdd?: (x: number, y: number) => void;
  onMove?: (id: string, x: number, y: number) => void;
  onSelect?: (id: string) => void;
};

const TONE: Record<Marker["tone"], string> = {
  slight: "bg-paper-sheet text-ink border-ink",
  moderate: "bg-warn-soft text-warn border-warn",
  severe: "bg-fail-soft text-fail border-fail",
  critical: "bg-fail text-paper-sheet border-fail",
};

/** A photo with numbered finding markers: click to drop one, drag to move it, click one to edit its finding. */
export function PhotoMarkers({ src, alt, markers, editable = false, selectedId, onAdd, onMove, onSelect }: Props) {
  const box = useRef<HTMLDivElement>(null);
  const drag = useRef<{ id: string; moved: boolean } | null>(null);
  const frac = (e: { clientX: number; clientY: number }) => {
    const r = box.current!.getBoundingClientRect();
    return { x: Math.min(1, Math.max(0, (e.clientX - r.left) / r.width)), y: Math.min(1, Math.max(0, (e.clientY - r.top) / r.height)) };
  };
  const down = (id: string) => (e: PointerEvent<HTMLButtonElement>) => {
    if (!editable) return;
    e.stopPropagation();
    (e.target as Element).setPointerCapture(e.pointerId);
    drag.current = { id, moved: false };
  };
  const move = (e: PointerEvent<HTMLButtonElement>) => {
    if (!drag.current || !onMove) return;
    drag.current.moved = true;
    const p = frac(e);
    onMove(drag.current.id, p.x, p.y);
  };
  const up = (id: string) => () => {
    const d = drag.current;
    drag.current = null;
    if (!d?.moved) onSelect?.(id);
  };
  return (
    // biome-ignore lint/a11y/noStaticElementInteractions: pointer shortcut only; the keyboard places a finding by its zone in the report form, and each placed marker is a button
    // biome-ignore lint/a11y/useKeyWithClickEvents: as above, the keyboard path is the zone field of the finding
    // biome-ignore lint/a11y/noNoninteractiveElementInteractions: as above
    <div
      ref={box}
      className={`relative select-none overflow-hidden rounded-card border border-stone bg-paper-deep ${editable ? "cursor-crosshair" : ""}`}
      onClick={(e) => {
        if (!editable || !onAdd || e.target !== e.currentTarget.querySelector("img")) return;
        const p = frac(e);
        onAdd(p.x, p.y);
      }}
      data-testid="photo-markers"
    >
      <img src={src} alt={alt} className="block h-auto w-full" draggable={false} />
      {markers.map((m) => (
        <button
          key={m.id}
          type="button"
          aria-label={`Finding ${m.n}${editable ? ": drag to move, select to edit" : ""}`}
          aria-pressed={selectedId === m.id}
          className={`absolute flex h-7 w-7 -translate-x-1/2 -translate-y-1/2 items-center justify-center rounded-full border-2 text-xs font-bold shadow ${TONE[m.tone]} ${selectedId === m.id ? "ring-2 ring-accent ring-offset-1" : ""} ${editable ? "cursor-grab" : ""}`}
          style={{ left: `${m.x * 100}%`, top: `${m.y * 100}%`, touchAction: "none" }}
          onPointerDown={down(m.id)}
          onPointerMove={move}
          onPointerUp={up(m.id)}
          onClick={(e) => {
            e.stopPropagation();
            if (!editable) onSelect?.(m.id);
          }}
          onKeyDown={(e) => {
            if (!editable || !onMove) return;
            const step = e.shiftKey ? 0.05 : 0.01;
            const moves: Record<string, [number, number]> = { ArrowLeft: [-step, 0], ArrowRight: [step, 0], ArrowUp: [0, -step], ArrowDown: [0, step] };
            const d = moves[e.key];
            if (d) {
              e.preventDefault();
              const [dx, dy] = d;
              onMove(m.id, Math.min(1, Math.max(0, m.x + dx)), Math.min(1, Math.max(0, m.y + dy)));
            }
          }}
          data-marker={m.n}
        >
          {m.n}
        </button>
      ))}
    </div>
  );
}
