import { forwardRef, useCallback, useEffect, useId, useImperativeHandle, useLayoutEffect, useRef, useState, type KeyboardEvent, type PointerEvent } from "react";
import { PHOTO_KINDS, PHOTO_KIND_LABELS, type Photo, type PhotoKind } from "@shared/schemas/photos.ts";
import { Button, buttonClass } from "@/components/ui/button.tsx";
import { ErrorNotice } from "@/components/ui/feedback.tsx";
import { SelectField, TextField } from "@/components/ui/field.tsx";
import { formatDate } from "@/lib/format.ts";
import { ApiError } from "@/lib/api-client.ts";
import { useUpdatePhoto } from "../api/photos.ts";
import { EnumOptions } from "@/components/ui/options.tsx";

/** The web version's longest side (server/features/photos/photos.service.ts, VERSION_MAX_SIDE.web). */
const WEB_MAX_SIDE = 2048;
/** The closest look: four screen pixels per pixel of the full version. */
const MAX_SCALE = 4;
const STEP = 1.5;

export const photoLabel = (p: Photo) => `${PHOTO_KIND_LABELS[p.kind] ?? p.kind}${p.caption ? `: ${p.caption}` : ""}`;

export function takenLine(p: Photo): string | null {
  return p.takenAt ? `Taken ${formatDate(p.takenAt.slice(0, 10))}${p.takenAt.length >= 16 ? `, ${p.takenAt.slice(11, 16)}` : ""}` : null;
}

type Props = {
  photos: Photo[];
  index: number;
  onIndexChange: (index: number) => void;
  onClose: () => void;
  /** Shows the kind and caption form (condition:write). */
  canEdit?: boolean;
};

const FOCUSABLE = 'button:not([disabled]), [href], input:not([disabled]), select:not([disabled]), textarea:not([disabled]), [tabindex]:not([tabindex="-1"])';

/**
 * A modal viewer for inspecting a photo: the web version at first, the full version once zoomed past
 * it. Zoom with the buttons, the + − 0 1 keys, the wheel, a pinch or a click on the spot; drag or use
 * the arrow keys to move about. Escape closes; focus stays inside and goes back where it came from.
 */
export function Lightbox({ photos, index, onIndexChange, onClose, canEdit = false }: Props) {
  const dialogRef = useRef<HTMLDialogElement>(null);
  const viewerRef = useRef<ViewerHandle>(null);
  const closeRef = useRef<HTMLButtonElement>(null);
  const titleId = useId();
  const closed = useRef(false);
  // Set while this component closes the dialog itself (unmounting), so that "close" event is not taken for the user's.
  const selfClosing = useRef(false);
  const photo = photos[index];

  const close = useCallback(() => {
    if (closed.current) return;
    closed.current = true;
    onClose();
  }, [onClose]);

  useEffect(() => {
    const opener = document.activeElement as HTMLElement | null;
    const d = dialogRef.current;
    if (d && !d.open) d.showModal();
    // showModal() focuses the first control (React's autoFocus is not an attribute it sees): start on Close.
    closeRef.current?.focus();
    return () => {
      if (d?.open) {
        selfClosing.current = true;
        d.close();
      }
      opener?.focus?.();
    };
  }, []);

  if (!photo) return null;
  const go = (delta: number) => onIndexChange((index + delta + photos.length) % photos.length);

  function onKeyDown(e: KeyboardEvent<HTMLDialogElement>) {
    if (e.key === "Tab") {
      // showModal() already makes the page behind inert; this keeps Tab from leaving for the browser's own bar.
      const nodes = Array.from(dialogRef.current?.querySelectorAll<HTMLElement>(FOCUSABLE) ?? []).filter((n) => n.offsetParent !== null);
      const first = nodes[0];
      const last = nodes.at(-1);
      if (!first || !last) return;
      if (e.shiftKey && document.activeElement === first) {
        e.preventDefault();
        last.focus();
      } else if (!e.shiftKey && document.activeElement === last) {
        e.preventDefault();
        first.focus();
      }
      return;
    }
    const t = e.target as HTMLElement;
    if (t.closest("input, select, textarea")) return;
    if (viewerRef.current?.handleKey(e.key)) {
      e.preventDefault();
      return;
    }
    if (photos.length > 1 && e.key === "ArrowRight") go(1);
    else if (photos.length > 1 && e.key === "ArrowLeft") go(-1);
  }

  const taken = takenLine(photo);
  return (
    <dialog
      ref={dialogRef}
      aria-labelledby={titleId}
      onCancel={(e) => {
        e.preventDefault();
        close();
      }}
      onClose={() => {
        if (selfClosing.current) selfClosing.current = false;
        else close();
      }}
      onKeyDown={onKeyDown}
      className="fixed inset-0 m-0 h-full max-h-none w-full max-w-none border-0 bg-ink p-0 text-ink backdrop:bg-ink/80"
    >
      <div className="flex h-full flex-col">
        <header className="flex flex-wrap items-center justify-between gap-3 border-b border-stone bg-paper-sheet px-4 py-2">
          <div className="min-w-0">
            <h2 id={titleId} className="truncate text-base font-semibold">
              {photoLabel(photo)}
            </h2>
            <p className="text-xs text-graphite num">
              {photos.length > 1 && `${index + 1} of ${photos.length} · `}
              {photo.width.toLocaleString("en-GB")} × {photo.height.toLocaleString("en-GB")} px{taken ? ` · ${taken}` : ""}
            </p>
          </div>
          <div className="flex items-center gap-2">
            {photos.length > 1 && (
              <>
                <Button variant="secondary" className="px-3 py-1" onClick={() => go(-1)} aria-label="Previous photo">
                  <span aria-hidden="true">←</span>
                </Button>
                <Button variant="secondary" className="px-3 py-1" onClick={() => go(1)} aria-label="Next photo">
                  <span aria-hidden="true">→</span>
                </Button>
              </>
            )}
            <button ref={closeRef} type="button" className={buttonClass("secondary", "px-3 py-1")} onClick={close}>
              Close<span className="sr-only"> the photo viewer</span>
            </button>
          </div>
        </header>

        <ZoomViewer ref={viewerRef} key={`view-${photo.id}`} photo={photo} />

        {canEdit && <EditPhoto key={`edit-${photo.id}`} photo={photo} />}
      </div>
    </dialog>
  );
}

type ViewerHandle = { handleKey: (key: string) => boolean };
type View = { zoom: number; x: number; y: number };

const ZoomViewer = forwardRef<ViewerHandle, { photo: Photo }>(function ZoomViewer({ photo }, ref) {
  const boxRef = useRef<HTMLDivElement>(null);
  const [box, setBox] = useState({ w: 0, h: 0 });
  const [view, setView] = useState<View>({ zoom: 1, x: 0, y: 0 });
  const [fullState, setFullState] = useState<"idle" | "loading" | "ready" | "failed">("idle");
  const W = photo.width;
  const H = photo.height;
  const fit = box.w && box.h ? Math.min(box.w / W, box.h / H) : 1;
  const maxZoom = Math.max(1, MAX_SCALE / fit);

  // The latest geometry, for handlers that outlive a render (wheel, pointer moves).
  const geom = useRef({ fit, box, maxZoom });
  geom.current = { fit, box, maxZoom };

  useLayoutEffect(() => {
    const el = boxRef.current;
    if (!el) return;
    const measure = () => setBox({ w: el.clientWidth, h: el.clientHeight });
    measure();
    const ro = new ResizeObserver(measure);
    ro.observe(el);
    return () => ro.disconnect();
  }, []);

  const clamp = useCallback(
    (v: View): View => {
      const { fit: f, box: b, maxZoom: mz } = geom.current;
      const zoom = Math.min(mz, Math.max(1, v.zoom));
      const s = f * zoom;
      const w = W * s;
      const h = H * s;
      const x = w <= b.w ? (b.w - w) / 2 : Math.min(0, Math.max(b.w - w, v.x));
      const y = h <= b.h ? (b.h - h) / 2 : Math.min(0, Math.max(b.h - h, v.y));
      return { zoom, x, y };
    },
    [W, H],
  );

  /** Zooms to `zoom`, keeping the point (px, py) of the viewer where it is. */
  const zoomAt = useCallback(
    (zoom: (z: number) => number, px?: number, py?: number) =>
      setView((v) => {
        const { box: b, maxZoom: mz } = geom.current;
        const cur = clamp(v);
        const next = Math.min(mz, Math.max(1, zoom(cur.zoom)));
        const cx = px ?? b.w / 2;
        const cy = py ?? b.h / 2;
        const k = next / cur.zoom;
        return clamp({ zoom: next, x: cx - (cx - cur.x) * k, y: cy - (cy - cur.y) * k });
      }),
    [clamp],
  );
  const pan = useCallback((dx: number, dy: number) => setView((v) => clamp({ ...clamp(v), x: clamp(v).x + dx, y: clamp(v).y + dy })), [clamp]);
  const actualPixels = () => 1 / geom.current.fit;

  const shown = clamp(view);
  const scale = fit * shown.zoom;

  useImperativeHandle(ref, () => ({
    handleKey(key: string) {
      if (key === "+" || key === "=") zoomAt((z) => z * STEP);
      else if (key === "-" || key === "_") zoomAt((z) => z / STEP);
      else if (key === "0") setView({ zoom: 1, x: 0, y: 0 });
      else if (key === "1") zoomAt(() => actualPixels());
      else if (shown.zoom > 1.001 && key.startsWith("Arrow")) {
        const d = 80;
        pan(key === "ArrowLeft" ? d : key === "ArrowRight" ? -d : 0, key === "ArrowUp" ? d : key === "ArrowDown" ? -d : 0);
      } else return false;
      return true;
    },
  }));

  // The wheel, non-passive so the page does not scroll behind the viewer.
  useEffect(() => {
    const el = boxRef.current;
    if (!el) return;
    const onWheel = (e: WheelEvent) => {
      e.preventDefault();
      const r = el.getBoundingClientRect();
      const dy = e.deltaMode === 1 ? e.deltaY * 16 : e.deltaMode === 2 ? e.deltaY * r.height : e.deltaY;
      zoomAt((z) => z * Math.exp(-dy * 0.0015), e.clientX - r.left, e.clientY - r.top);
    };
    el.addEventListener("wheel", onWheel, { passive: false });
    return () => el.removeEventListener("wheel", onWheel);
  }, [zoomAt]);

  // Drag to move, pinch to zoom, click to zoom in on a spot (or back out).
  const pointers = useRef(new Map<number, { x: number; y: number }>());
  const gesture = useRef({ moved: 0, pinch: 0 });
  const local = (e: PointerEvent) => {
    const r = boxRef.current!.getBoundingClientRect();
    return { x: e.clientX - r.left, y: e.clientY - r.top };
  };
  const onPointerDown = (e: PointerEvent<HTMLDivElement>) => {
    if (e.button !== 0) return;
    e.currentTarget.setPointerCapture(e.pointerId);
    pointers.current.set(e.pointerId, local(e));
    if (pointers.current.size === 1) gesture.current = { moved: 0, pinch: 0 };
  };
  const onPointerMove = (e: PointerEvent<HTMLDivElement>) => {
    const prev = pointers.current.get(e.pointerId);
    if (!prev) return;
    const p = local(e);
    pointers.current.set(e.pointerId, p);
    const [a, b] = pointers.current.values();
    if (a && b) {
      const dist = Math.hypot(a.x - b.x, a.y - b.y);
      if (gesture.current.pinch) zoomAt((z) => z * (dist / gesture.current.pinch), (a.x + b.x) / 2, (a.y + b.y) / 2);
      gesture.current.pinch = dist;
      gesture.current.moved += 10;
      return;
    }
    gesture.current.moved += Math.abs(p.x - prev.x) + Math.abs(p.y - prev.y);
    pan(p.x - prev.x, p.y - prev.y);
  };
  const onPointerUp = (e: PointerEvent<HTMLDivElement>) => {
    const p = pointers.current.get(e.pointerId);
    pointers.current.delete(e.pointerId);
    if (pointers.current.size < 2) gesture.current.pinch = 0;
    if (!p || pointers.current.size > 0 || gesture.current.moved > 6 || e.type === "pointercancel") return;
    if (shown.zoom > 1.001) setView({ zoom: 1, x: 0, y: 0 });
    else zoomAt(() => Math.max(actualPixels(), 2), p.x, p.y);
  };

  // Past what the web version holds, fetch the full one (once) and show it when it has arrived.
  const webScale = Math.min(1, WEB_MAX_SIDE / Math.max(W, H));
  const dpr = typeof window === "undefined" ? 1 : window.devicePixelRatio || 1;
  const wantFull = scale * dpr > webScale * 1.1;
  useEffect(() => {
    if (!wantFull || fullState !== "idle") return;
    setFullState("loading");
    const img = new Image();
    img.onload = () => setFullState("ready");
    img.onerror = () => setFullState("failed");
    img.src = photo.urls.full;
  }, [wantFull, fullState, photo.urls.full]);
  const src = fullState === "ready" ? photo.urls.full : photo.urls.web;
  const percent = Math.round(scale * 100);

  return (
    <div className="relative flex min-h-0 flex-1 flex-col">
      <div
        ref={boxRef}
        role="img"
        aria-label={`${photoLabel(photo)}. Shown at ${percent}% of its full size.`}
        onPointerDown={onPointerDown}
        onPointerMove={onPointerMove}
        onPointerUp={onPointerUp}
        onPointerCancel={onPointerUp}
        className={`relative min-h-0 flex-1 touch-none select-none overflow-hidden ${shown.zoom > 1.001 ? "cursor-grab active:cursor-grabbing" : "cursor-zoom-in"}`}
      >
        {box.w > 0 && (
          <img
            src={src}
            alt=""
            draggable={false}
            className="absolute left-0 top-0 max-w-none origin-top-left"
            style={{ width: W * scale, height: H * scale, transform: `translate3d(${shown.x}px, ${shown.y}px, 0)` }}
          />
        )}
      </div>
      <div className="flex flex-wrap items-center justify-between gap-3 border-t border-stone bg-paper-sheet px-4 py-2 text-sm">
        <fieldset aria-label="Zoom" className="flex items-center gap-2">
          <Button variant="secondary" className="px-3 py-1" onClick={() => zoomAt((z) => z / STEP)} disabled={shown.zoom <= 1.001} aria-label="Zoom out">
            <span aria-hidden="true">−</span>
          </Button>
          <span className="num w-14 text-center" aria-live="polite">
            {percent}%
          </span>
          <Button variant="secondary" className="px-3 py-1" onClick={() => zoomAt((z) => z * STEP)} disabled={shown.zoom >= maxZoom - 0.001} aria-label="Zoom in">
            <span aria-hidden="true">+</span>
          </Button>
          <Button variant="quiet" className="px-3 py-1" onClick={() => setView({ zoom: 1, x: 0, y: 0 })} disabled={shown.zoom <= 1.001}>
            Fit
          </Button>
          <Button variant="quiet" className="px-3 py-1" onClick={() => zoomAt(() => actualPixels())}>
            Actual pixels
          </Button>
        </fieldset>
        <p className="text-xs text-graphite" aria-live="polite">
          {fullState === "loading"
            ? "Loading the full-size version…"
            : fullState === "failed"
              ? "The full-size version could not be loaded; showing the web version."
              : "Scroll, pinch or click to zoom; drag or use the arrow keys to move. Keys: + − 0 1."}
        </p>
      </div>
    </div>
  );
});

function EditPhoto({ photo }: { photo: Photo }) {
  const update = useUpdatePhoto();
  const [kind, setKind] = useState<PhotoKind>(photo.kind);
  const [caption, setCaption] = useState(photo.caption ?? "");
  const changed = kind !== photo.kind || caption.trim() !== (photo.caption ?? "");
  return (
    <form
      className="flex flex-wrap items-end gap-3 border-t border-stone bg-paper-sheet px-4 py-3"
      onSubmit={(e) => {
        e.preventDefault();
        update.mutate({ id: photo.id, kind, caption: caption.trim() || null });
      }}
    >
      <SelectField label="Kind" value={kind} onChange={(e) => setKind(e.target.value as PhotoKind)} wrapClassName="w-48">
        <EnumOptions values={PHOTO_KINDS} labels={PHOTO_KIND_LABELS} />
      </SelectField>
      <TextField
        label="Caption"
        value={caption}
        maxLength={300}
        onChange={(e) => setCaption(e.target.value)}
        error={update.error instanceof ApiError ? update.error.fields.caption : undefined}
        wrapClassName="min-w-[16rem] flex-1"
      />
      <Button type="submit" disabled={!changed || update.isPending}>
        {update.isPending ? "Saving…" : "Save"}
      </Button>
      <div className="basis-full empty:hidden">
        {update.isError && <ErrorNotice title="The change was not saved" error={update.error} />}
        {update.isSuccess && !changed && <p className="text-sm text-pass">✓ Saved.</p>}
      </div>
    </form>
  );
}
