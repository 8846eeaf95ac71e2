import { useEffect, useId, useRef, useState, type DragEvent } from "react";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { PHOTO_KINDS, PHOTO_KIND_LABELS, type Photo, type PhotoKind } from "@shared/schemas/photos.ts";
import { Button } from "@/components/ui/button.tsx";
import { Notice } from "@/components/ui/feedback.tsx";
import { formatDate } from "@/lib/format.ts";
import { photoKeys, uploadErrorMessage, uploadPhoto, type PhotoUploadFields, type UploadProgress } from "../api/photos.ts";
import { EnumOptions } from "@/components/ui/options.tsx";

// What the file picker offers; the server judges every file by its bytes anyway.
const ACCEPT = "image/jpeg,image/png,image/webp,image/tiff,.jpg,.jpeg,.png,.webp,.tif,.tiff";
const CAPTION_MAX = 300;

type Status = "ready" | "uploading" | "processing" | "done" | "failed";
type Item = {
  key: string;
  file: File;
  kind: PhotoKind;
  caption: string;
  status: Status;
  sent: number;
  error?: string;
  photo?: Photo;
  preview: string | null;
};

let seq = 0;

/** Recto for the first photo of a batch, verso for the second, then details: what a framer usually shoots first. */
function defaultKind(index: number): PhotoKind {
  return index === 0 ? "recto" : index === 1 ? "verso" : "detail";
}

function formatBytes(n: number): string {
  if (n >= 1024 * 1024) return `${(n / (1024 * 1024)).toFixed(1)} MB`;
  if (n >= 1024) return `${Math.round(n / 1024)} KB`;
  return `${n} bytes`;
}

type Props = {
  objectId: string;
  /** Photos added here belong to this condition report. */
  reportId?: string;
  /** From can(user, "photo:write", { clientId }); nothing is shown without it. */
  canUpload: boolean;
  /** Called with each photo once it is saved. */
  onUploaded?: (photo: Photo) => void;
};

/**
 * Adding photos: drop files on the zone or choose them with the file picker (several at once), give
 * each its kind and caption, and send them; each file has its own progress bar, its own message when
 * it is refused, and "Try again".
 */
export function PhotoUploader({ objectId, reportId, canUpload, onUploaded }: Props) {
  const qc = useQueryClient();
  const inputId = useId();
  const hintId = `${inputId}-hint`;
  const inputRef = useRef<HTMLInputElement>(null);
  const [items, setItems] = useState<Item[]>([]);
  const [dragging, setDragging] = useState(false);
  const controllers = useRef(new Map<string, AbortController>());
  const itemsRef = useRef(items);
  itemsRef.current = items;

  // Through a mutation, so an expired session (401) is handled where every other request's is.
  const send = useMutation({
    mutationFn: (a: { file: File; fields: PhotoUploadFields; onProgress: (p: UploadProgress) => void; signal: AbortSignal }) =>
      uploadPhoto(objectId, a.file, a.fields, a.onProgress, a.signal),
  });

  // Previews are object URLs: let them go when the rows go.
  useEffect(() => {
    const map = controllers.current;
    return () => {
      for (const i of itemsRef.current) if (i.preview) URL.revokeObjectURL(i.preview);
      for (const c of map.values()) c.abort();
    };
  }, []);

  if (!canUpload) return null;

  const patch = (key: string, change: Partial<Item>) => setItems((list) => list.map((i) => (i.key === key ? { ...i, ...change } : i)));

  function add(files: FileList | File[]) {
    const list = Array.from(files);
    if (list.length === 0) return;
    setItems((current) => {
      const waiting = current.filter((i) => i.status !== "done").length;
      return [
        ...current,
        ...list.map((file, n) => ({
          key: `f${++seq}`,
          file,
          kind: defaultKind(waiting + n),
          caption: "",
          status: "ready" as const,
          sent: 0,
          error: file.size === 0 ? "This file is empty (0 bytes), so there is no photo in it. Choose the file again, or export it again from the camera or scanner." : undefined,
          preview: /^image\/(jpeg|png|webp)$/.test(file.type) && file.size > 0 ? URL.createObjectURL(file) : null,
        })),
      ];
    });
  }

  async function start(item: Item) {
    if (item.file.size === 0) return;
    const controller = new AbortController();
    controllers.current.set(item.key, controller);
    patch(item.key, { status: "uploading", sent: 0, error: undefined });
    try {
      const photo = await send.mutateAsync({
        file: item.file,
        fields: { kind: item.kind, caption: item.caption.trim() || undefined, reportId },
        onProgress: (p) => patch(item.key, { sent: p.sent, status: p.processing ? "processing" : "uploading" }),
        signal: controller.signal,
      });
      patch(item.key, { status: "done", sent: 1, photo });
      onUploaded?.(photo);
      qc.invalidateQueries({ queryKey: photoKeys.all });
    } catch (e) {
      patch(item.key, { status: "failed", error: uploadErrorMessage(e) });
    } finally {
      controllers.current.delete(item.key);
    }
  }

  function remove(item: Item) {
    controllers.current.get(item.key)?.abort();
    if (item.preview) URL.revokeObjectURL(item.preview);
    setItems((list) => list.filter((i) => i.key !== item.key));
  }

  const ready = items.filter((i) => i.status === "ready" && i.file.size > 0);
  const busy = items.some((i) => i.status === "uploading" || i.status === "processing");
  const done = items.filter((i) => i.status === "done");

  const onDrop = (e: DragEvent) => {
    e.preventDefault();
    setDragging(false);
    add(e.dataTransfer.files);
  };

  return (
    <div className="space-y-3">
      {/* biome-ignore lint/a11y/noStaticElementInteractions: a drop target for dragged files; the keyboard uses the file input inside it */}
      {/* biome-ignore lint/a11y/noNoninteractiveElementInteractions: as above */}
      <div
        onDragEnter={(e) => {
          e.preventDefault();
          setDragging(true);
        }}
        onDragOver={(e) => {
          e.preventDefault();
          e.dataTransfer.dropEffect = "copy";
        }}
        onDragLeave={(e) => {
          if (!e.currentTarget.contains(e.relatedTarget as Node | null)) setDragging(false);
        }}
        onDrop={onDrop}
        className={`rounded-card border-2 border-dashed px-5 py-6 text-center transition-colors focus-within:border-accent ${
          dragging ? "border-accent bg-accent-soft" : "border-stone bg-paper-sheet"
        }`}
      >
        <p className="text-sm text-ink-soft">Drop photos here, or</p>
        <div className="mt-2">
          {/* A real file input, visually hidden but focusable; its label is the visible button. */}
          <input
            ref={inputRef}
            id={inputId}
            type="file"
            multiple
            accept={ACCEPT}
            aria-describedby={hintId}
            className="peer sr-only"
            onChange={(e) => {
              if (e.target.files) add(e.target.files);
              e.target.value = "";
            }}
          />
          <label
            htmlFor={inputId}
            className="inline-flex cursor-pointer items-center justify-center gap-2 rounded-card border border-stone bg-paper-sheet px-4 py-2 text-sm font-semibold text-ink hover:border-graphite-light hover:bg-paper-deep peer-focus-visible:outline-2 peer-focus-visible:outline-offset-2 peer-focus-visible:outline-accent"
          >
            Choose photos…
          </label>
        </div>
        <p id={hintId} className="mt-2 text-xs text-graphite">
          JPEG, PNG, WebP or TIFF. Several at once; each gets its kind and caption before it is sent. The date taken is read from the camera's data when it is there.
        </p>
      </div>

      {items.length > 0 && (
        <ul aria-label="Photos to add" className="divide-y divide-stone-light rounded-card border border-stone bg-paper-sheet">
          {items.map((item) => (
            <UploadRow key={item.key} item={item} onChange={(change) => patch(item.key, change)} onStart={() => start(item)} onRemove={() => remove(item)} />
          ))}
        </ul>
      )}

      {items.length > 0 && (
        <div className="flex flex-wrap items-center gap-3">
          {ready.length > 0 && <Button onClick={() => ready.forEach((i) => void start(i))}>{ready.length > 1 ? `Add ${ready.length} photos` : "Add the photo"}</Button>}
          {done.length > 0 && !busy && (
            <Button
              variant="quiet"
              onClick={() => {
                for (const i of done) if (i.preview) URL.revokeObjectURL(i.preview);
                setItems((list) => list.filter((i) => i.status !== "done"));
              }}
            >
              Clear the added photos from this list
            </Button>
          )}
          <p className="text-sm text-graphite" aria-live="polite">
            {busy ? "Sending…" : done.length > 0 ? `${done.length} added.` : ""}
          </p>
        </div>
      )}
      {items.some((i) => i.status === "failed") && !busy && (
        <Notice tone="warn" title="Some photos were not added">
          Each one says why beside it. Correct what it says, then choose “Try again”, or remove it from the list.
        </Notice>
      )}
    </div>
  );
}

function UploadRow({ item, onChange, onStart, onRemove }: { item: Item; onChange: (c: Partial<Item>) => void; onStart: () => void; onRemove: () => void }) {
  const id = useId();
  const errorId = `${id}-error`;
  const editable = item.status === "ready" || item.status === "failed";
  const pct = Math.round(item.sent * 100);
  return (
    <li className="grid gap-3 px-4 py-3 sm:grid-cols-[4rem_1fr]">
      <div aria-hidden="true" className="flex h-16 w-16 items-center justify-center overflow-hidden rounded border border-stone-light bg-paper-deep">
        {item.photo ? (
          <img src={item.photo.urls.thumb} alt="" className="h-full w-full object-cover" />
        ) : item.preview ? (
          // biome-ignore lint/a11y/noNoninteractiveElementInteractions: onError is the image failing to decode, not a user interaction
          <img src={item.preview} alt="" className="h-full w-full object-cover" onError={() => onChange({ preview: null })} />
        ) : (
          <span className="text-xs text-graphite">{item.file.name.split(".").pop()?.toUpperCase().slice(0, 4) || "?"}</span>
        )}
      </div>
      <div className="min-w-0 space-y-2">
        <p className="flex flex-wrap items-baseline justify-between gap-x-3 text-sm">
          <span className="truncate font-medium" title={item.file.name}>
            {item.file.name || "Unnamed file"}
          </span>
          <span className="num text-graphite">{formatBytes(item.file.size)}</span>
        </p>
        <div className="grid gap-2 sm:grid-cols-[12rem_1fr]">
          <div>
            <label htmlFor={`${id}-kind`} className="mb-1 block text-xs font-medium text-ink-soft">
              Kind
            </label>
            <select
              id={`${id}-kind`}
              value={item.kind}
              disabled={!editable}
              onChange={(e) => onChange({ kind: e.target.value as PhotoKind })}
              className="block w-full rounded-card border border-stone bg-paper-sheet px-2 py-1.5 text-sm text-ink focus:border-accent focus:outline-none focus:ring-2 focus:ring-accent/30 disabled:bg-paper-deep disabled:text-graphite"
            >
              <EnumOptions values={PHOTO_KINDS} labels={PHOTO_KIND_LABELS} />
            </select>
          </div>
          <div>
            <label htmlFor={`${id}-caption`} className="mb-1 block text-xs font-medium text-ink-soft">
              Caption <span className="font-normal text-graphite">(optional)</span>
            </label>
            <input
              id={`${id}-caption`}
              type="text"
              value={item.caption}
              maxLength={CAPTION_MAX}
              disabled={!editable}
              placeholder="e.g. Foxing in the lower margin"
              onChange={(e) => onChange({ caption: e.target.value })}
              className="block w-full rounded-card border border-stone bg-paper-sheet px-2 py-1.5 text-sm text-ink placeholder:text-graphite focus:border-accent focus:outline-none focus:ring-2 focus:ring-accent/30 disabled:bg-paper-deep disabled:text-graphite"
            />
          </div>
        </div>

        {(item.status === "uploading" || item.status === "processing" || item.status === "done") && (
          <div>
            <div
              role="progressbar"
              aria-label={`Sending ${item.file.name}`}
              aria-valuemin={0}
              aria-valuemax={100}
              aria-valuenow={item.status === "processing" ? undefined : pct}
              aria-valuetext={item.status === "processing" ? "Sent; making the web and thumbnail versions" : item.status === "done" ? "Added" : `${pct}% sent`}
              className="h-2 overflow-hidden rounded-full bg-stone-light"
            >
              <div
                className={`h-full rounded-full ${item.status === "done" ? "bg-pass" : "bg-accent"} ${item.status === "processing" ? "animate-pulse" : ""} transition-[width] duration-200`}
                style={{ width: `${item.status === "uploading" ? pct : 100}%` }}
              />
            </div>
            <p className="mt-1 text-xs text-graphite" aria-live="polite">
              {item.status === "uploading" && <span className="num">{pct}% sent</span>}
              {item.status === "processing" && "Sent. Checking the file and making the web and thumbnail versions…"}
              {item.status === "done" && (
                <span className="text-pass">
                  <span aria-hidden="true">✓ </span>Added{item.photo?.takenAt ? `; taken on ${formatDate(item.photo.takenAt.slice(0, 10))}` : ""}.
                </span>
              )}
            </p>
          </div>
        )}

        {item.error && (
          <p id={errorId} role="alert" className="flex items-start gap-1 text-sm text-fail">
            <span aria-hidden="true">✕</span>
            {item.error}
          </p>
        )}

        <div className="flex flex-wrap gap-2">
          {item.status === "ready" && item.file.size > 0 && (
            <Button variant="secondary" className="px-3 py-1" onClick={onStart}>
              Add this photo
            </Button>
          )}
          {item.status === "failed" && (
            <Button variant="secondary" className="px-3 py-1" onClick={onStart} aria-describedby={errorId}>
              Try again
            </Button>
          )}
          {/* Once the bytes are sent the server finishes the photo, so there is nothing left to stop. */}
          {item.status !== "done" && item.status !== "processing" && (
            <Button variant="quiet" className="px-3 py-1" onClick={onRemove}>
              {item.status === "uploading" ? "Stop" : "Remove"}
              <span className="sr-only"> {item.file.name}</span>
            </Button>
          )}
        </div>
      </div>
    </li>
  );
}
